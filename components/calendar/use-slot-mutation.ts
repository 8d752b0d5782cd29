'use client';

import { useCallback } from 'react';
import { useSWRConfig, type KeyedMutator } from 'swr';
import { apiSend } from '@/lib/client/api';
import type { SlotDto } from '@/lib/slots/types';
import type { NewSlot } from './booking-dialog';
import { PLANNING_KEY } from './planning-strip';
import type { SlotChange } from './slot-dialog';

/** One change to the calendar's slots, as the person made it. */
export type SlotMutation =
  | { kind: 'book'; input: NewSlot; placeholder: SlotDto }
  | { kind: 'move'; slot: SlotDto; startsAt: string; endsAt: string }
  | { kind: 'change'; slot: SlotDto; patch: SlotChange }
  | { kind: 'cancel'; slot: SlotDto };

/** The request that makes the change; the slot as the server has it now (null once cancelled). */
function send(m: SlotMutation): Promise<SlotDto | null> {
  switch (m.kind) {
    case 'book':
      return apiSend<SlotDto>('POST', '/api/slots', m.input);
    case 'move':
      return apiSend<SlotDto>('PATCH', `/api/slots/${m.slot.id}`, { startsAt: m.startsAt, endsAt: m.endsAt });
    case 'change':
      return apiSend<SlotDto>('PATCH', `/api/slots/${m.slot.id}`, m.patch);
    case 'cancel':
      return apiSend('DELETE', `/api/slots/${m.slot.id}`).then(() => null);
  }
}

/** The slots as they look while the request is on its way. */
export function optimisticSlots(current: readonly SlotDto[], m: SlotMutation): SlotDto[] {
  switch (m.kind) {
    case 'book':
      return [...current, m.placeholder];
    case 'move':
      return current.map((s) => (s.id === m.slot.id ? { ...s, startsAt: m.startsAt, endsAt: m.endsAt } : s));
    case 'change':
      return current.map((s) => (s.id === m.slot.id ? { ...s, ...m.patch } : s));
    case 'cancel':
      return current.filter((s) => s.id !== m.slot.id);
  }
}

/** The slots once the server answered with `saved` (the placeholder of a booking gives way to it). */
export function settledSlots(current: readonly SlotDto[], m: SlotMutation, saved: SlotDto | null): SlotDto[] {
  switch (m.kind) {
    case 'cancel':
      return current.filter((s) => s.id !== m.slot.id);
    case 'book':
      return saved ? [...current.filter((s) => s.id !== saved.id), saved] : [...current];
    default:
      return current.map((s) => (s.id === m.slot.id && saved ? saved : s));
  }
}

/**
 * Books, moves, changes or cancels a slot with an optimistic update of the calendar's slot list:
 * the list shows the change at once, takes the server's copy when it answers, and goes back as it
 * was when the server refuses (the error is thrown on, for the caller to show). A change of time
 * or a booking also refreshes the planning strip. Resolves to the server's copy of the slot
 * (null once cancelled).
 */
export function useSlotMutation(slots: { mutate: KeyedMutator<SlotDto[]> }) {
  const { mutate } = slots;
  const { mutate: mutateAny } = useSWRConfig();
  return useCallback(
    async (m: SlotMutation): Promise<SlotDto | null> => {
      let saved: SlotDto | null = null;
      await mutate(
        async (current) => {
          saved = await send(m);
          return settledSlots(current ?? [], m, saved);
        },
        {
          optimisticData: (current) => optimisticSlots(current ?? [], m),
          rollbackOnError: true,
          populateCache: true,
          revalidate: false,
        },
      );
      // The crew and note do not show on the planning strip.
      if (m.kind !== 'change') void mutateAny(PLANNING_KEY);
      return saved;
    },
    [mutate, mutateAny],
  );
}
