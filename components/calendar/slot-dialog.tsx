'use client';

import { useId, useState, type FormEvent } from 'react';
import { DateTime } from 'luxon';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Dialog, DialogContent } from '@/components/ui/dialog';
import { Field, Input, Textarea, fieldA11y } from '@/components/ui/input';
import { ApiClientError } from '@/lib/client/api';
import type { SlotDto } from '@/lib/slots/types';

import { formatSlotRange } from '@/lib/time';
import type { CalendarSetup } from './calendar-types';
import { showVolume } from '@/lib/figures';

export interface SlotChange {
  crew: string[];
  note: string | null;
}

interface SlotDialogProps {
  setup: CalendarSetup;
  slot: SlotDto | null;
  onClose: () => void;
  /** Cancels the slot; rejects with the API's error. */
  onCancel: (slot: SlotDto) => Promise<void>;
  /** Saves a new crew or note; rejects with the API's error. */
  onChange: (slot: SlotDto, change: SlotChange) => Promise<void>;
}

const messageOf = (err: unknown) =>
  err instanceof ApiClientError ? err.message : 'Could not reach Brixhouse. Check the connection and try again.';

export function SlotDialog({ setup, slot, onClose, onCancel, onChange }: SlotDialogProps) {
  return (
    <Dialog open={slot !== null} onOpenChange={(open) => (open ? undefined : onClose())}>
      {slot ? (
        <DialogContent
          title={`${slot.householdName} household`}
          description={formatSlotRange(slot.startsAt, slot.endsAt, setup.timeZone)}
          data-testid="slot-dialog"
        >
          <SlotDetails key={slot.id} setup={setup} slot={slot} onCancel={onCancel} onChange={onChange} />
        </DialogContent>
      ) : null}
    </Dialog>
  );
}

function SlotDetails({ setup, slot, onCancel, onChange }: Omit<SlotDialogProps, 'onClose' | 'slot'> & { slot: SlotDto }) {
  const mine = !setup.user.staff && slot.householdId === setup.user.householdId;
  const privateDetails = setup.user.staff || mine;
  const evaporator = setup.evaporators.find((e) => e.id === slot.evaporatorId)?.name;
  const [mode, setMode] = useState<'view' | 'edit' | 'confirm-cancel'>('view');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const hoursToStart = DateTime.fromISO(slot.startsAt).diffNow('hours').hours;
  const lateForMembers = !setup.user.staff && hoursToStart < setup.cancelNoticeHours;

  async function cancel() {
    setBusy(true);
    setError(null);
    try {
      await onCancel(slot);
    } catch (err) {
      setError(messageOf(err));
      setMode('view');
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap gap-2">
        {slot.status === 'done' ? <Badge variant="neutral">Done</Badge> : <Badge variant="spruce">Booked</Badge>}
        {mine ? <Badge variant="spruce">Your household</Badge> : null}
      </div>
      {error ? <Alert tone="danger" title={error} /> : null}

      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-2">
        <dt className="font-semibold">When</dt>
        <dd>{formatSlotRange(slot.startsAt, slot.endsAt, setup.timeZone)}</dd>
        {evaporator ? (
          <>
            <dt className="font-semibold">Evaporator</dt>
            <dd>{evaporator}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Household</dt>
        <dd>{slot.householdName}</dd>
        {privateDetails ? (
          <>
            <dt className="font-semibold">Crew</dt>
            <dd>{slot.crew.length ? slot.crew.join(', ') : <span className="text-slate-muted">Not named yet</span>}</dd>
            <dt className="font-semibold">Expected sap</dt>
            <dd>{slot.expectedSapL !== null ? showVolume(slot.expectedSapL, setup.unitSystem) : <span className="text-slate-muted">Not given</span>}</dd>
            <dt className="font-semibold">Note</dt>
            <dd className="whitespace-pre-line break-words">{slot.note ?? <span className="text-slate-muted">None</span>}</dd>
          </>
        ) : null}
      </dl>
      {!privateDetails ? (
        <p className="text-sm text-slate-muted">The crew and notes of another household’s slot are theirs and the sugarhouse staff’s to see.</p>
      ) : null}

      {slot.editable && mode === 'edit' ? (
        <EditCrewForm
          slot={slot}
          onCancelEdit={() => setMode('view')}
          onSave={async (change) => {
            await onChange(slot, change);
            setMode('view');
          }}
        />
      ) : null}

      {slot.editable && mode === 'confirm-cancel' ? (
        <div className="flex flex-col gap-3 rounded-lg border border-ember bg-ember-soft p-4">
          <p className="font-semibold">
            Cancel this slot? The time becomes free for other households, and the {slot.householdName} household gets an e-mail.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" onClick={cancel} loading={busy}>
              Yes, cancel the slot
            </Button>
            <Button variant="secondary" onClick={() => setMode('view')} disabled={busy}>
              Keep it
            </Button>
          </div>
        </div>
      ) : null}

      {slot.editable && mode === 'view' ? (
        <div className="flex flex-col gap-2">
          {lateForMembers ? (
            <p className="text-sm text-slate-muted">
              Members can cancel up to {setup.cancelNoticeHours} hours before a slot starts; closer to the start, ask a sugarmaker.
            </p>
          ) : null}
          <p className="text-sm text-slate-muted">To move it, drag it to a free time in the week or day view (a long press on a phone); drag its lower edge to change its length.</p>
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => setMode('edit')}>
              Edit crew and note
            </Button>
            <Button variant="secondary" className="border-ember text-ember hover:bg-ember-soft" onClick={() => setMode('confirm-cancel')}>
              Cancel this slot
            </Button>
          </div>
        </div>
      ) : null}
    </div>
  );
}

function EditCrewForm({ slot, onSave, onCancelEdit }: { slot: SlotDto; onSave: (change: SlotChange) => Promise<void>; onCancelEdit: () => void }) {
  const uid = useId().replace(/:/g, '');
  const [crew, setCrew] = useState(slot.crew.join(', '));
  const [note, setNote] = useState(slot.note ?? '');
  const [errors, setErrors] = useState<{ crew?: string; note?: string; form?: string }>({});
  const [busy, setBusy] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setErrors({});
    try {
      await onSave({
        crew: crew
          .split(',')
          .map((n) => n.trim())
          .filter(Boolean),
        note: note.trim() || null,
      });
    } catch (err) {
      if (err instanceof ApiClientError) {
        const crewError = Object.entries(err.fields).find(([k]) => k.split('.')[0] === 'crew')?.[1];
        const noteError = err.fields.note;
        setErrors({ crew: crewError, note: noteError, form: crewError || noteError ? undefined : err.message });
      } else {
        setErrors({ form: messageOf(err) });
      }
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Edit crew and note" className="flex flex-col gap-3 rounded-lg border border-birch-line p-4">
      {errors.form ? <Alert tone="danger" title={errors.form} /> : null}
      <Field label="Crew" htmlFor={`crew-${uid}`} error={errors.crew} hint="Names separated by commas.">
        <Input {...fieldA11y(`crew-${uid}`, errors.crew, true)} value={crew} onChange={(e) => setCrew(e.target.value)} autoComplete="off" />
      </Field>
      <Field label="Note" htmlFor={`note-${uid}`} error={errors.note}>
        <Textarea {...fieldA11y(`note-${uid}`, errors.note)} rows={2} maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" loading={busy}>
          Save crew and note
        </Button>
        <Button type="button" variant="ghost" onClick={onCancelEdit} disabled={busy}>
          Discard changes
        </Button>
      </div>
    </form>
  );
}
