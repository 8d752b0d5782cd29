import { describe, expect, it } from 'vitest';
import { optimisticSlots, settledSlots, type SlotMutation } from '@/components/calendar/use-slot-mutation';
import type { SlotDto } from '@/lib/slots/types';

// The calendar's one optimistic-update path (components/calendar/use-slot-mutation.ts): what the
// slot list shows while a booking, move, change or cancellation is on its way, and once the
// server has answered.

const slot = (id: string, over: Partial<SlotDto> = {}): SlotDto => ({
  id,
  evaporatorId: 'e1',
  householdId: 'h1',
  householdName: 'Okafor',
  startsAt: '2030-03-14T09:00:00-04:00',
  endsAt: '2030-03-14T12:00:00-04:00',
  status: 'booked',
  crew: ['Adaeze'],
  expectedSapL: 400,
  note: null,
  editable: true,
  ...over,
});

const a = slot('a');
const b = slot('b', { householdId: 'h2', householdName: 'Brennan', startsAt: '2030-03-15T09:00:00-04:00', endsAt: '2030-03-15T12:00:00-04:00' });
const list = [a, b];

describe('booking', () => {
  const placeholder = slot('pending-1', { editable: false, startsAt: '2030-03-16T09:00:00-04:00', endsAt: '2030-03-16T12:00:00-04:00' });
  const m: SlotMutation = {
    kind: 'book',
    input: { evaporatorId: 'e1', startsAt: placeholder.startsAt, endsAt: placeholder.endsAt, crew: [], expectedSapL: null, note: null },
    placeholder,
  };

  it('shows the placeholder at once, after the slots already there', () => {
    expect(optimisticSlots(list, m).map((s) => s.id)).toEqual(['a', 'b', 'pending-1']);
  });

  it('puts the server’s slot in once it answers, and only once', () => {
    const saved = slot('c', { startsAt: placeholder.startsAt, endsAt: placeholder.endsAt });
    expect(settledSlots(list, m, saved).map((s) => s.id)).toEqual(['a', 'b', 'c']);
    // The live socket may have brought it in already.
    expect(settledSlots([...list, saved], m, saved).map((s) => s.id)).toEqual(['a', 'b', 'c']);
  });
});

describe('moving and changing', () => {
  it('a move shows the new times at once, then the server’s copy', () => {
    const m: SlotMutation = { kind: 'move', slot: a, startsAt: '2030-03-14T10:00:00-04:00', endsAt: '2030-03-14T13:00:00-04:00' };
    const shown = optimisticSlots(list, m);
    expect(shown[0]).toEqual({ ...a, startsAt: m.startsAt, endsAt: m.endsAt });
    expect(shown[1]).toBe(b);
    const saved = { ...a, startsAt: m.startsAt, endsAt: m.endsAt, editable: true };
    expect(settledSlots(list, m, saved)).toEqual([saved, b]);
  });

  it('a change of crew and note shows at once, then the server’s copy', () => {
    const m: SlotMutation = { kind: 'change', slot: b, patch: { crew: ['Fintan', 'Juno'], note: 'Bring the cup.' } };
    expect(optimisticSlots(list, m)[1]).toEqual({ ...b, crew: ['Fintan', 'Juno'], note: 'Bring the cup.' });
    const saved = { ...b, crew: ['Fintan', 'Juno'], note: 'Bring the cup.' };
    expect(settledSlots(list, m, saved)).toEqual([a, saved]);
  });
});

describe('cancelling', () => {
  it('takes the slot off at once and keeps it off', () => {
    const m: SlotMutation = { kind: 'cancel', slot: a };
    expect(optimisticSlots(list, m)).toEqual([b]);
    expect(settledSlots(list, m, null)).toEqual([b]);
  });
});

it('never changes the list it was given (SWR rolls back to it on a refusal)', () => {
  const frozen = Object.freeze([...list]);
  for (const m of [
    { kind: 'cancel', slot: a },
    { kind: 'move', slot: a, startsAt: b.startsAt, endsAt: b.endsAt },
    { kind: 'change', slot: a, patch: { crew: [], note: 'x' } },
  ] as SlotMutation[]) {
    expect(() => optimisticSlots(frozen, m)).not.toThrow();
    expect(frozen).toEqual(list);
  }
});
