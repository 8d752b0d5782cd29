'use client';

import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import type { DateTime } from 'luxon';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog, DialogContent } from '@/components/ui/dialog';
import { Field, Input, Label, Textarea, fieldA11y } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { toast } from '@/components/ui/toaster';
import { ApiClientError } from '@/lib/client/api';
import { gallonsToLitres } from '@/lib/sugar/units';
import { cn } from '@/lib/utils';
import type { CalendarSetup } from './calendar-types';
import { fromLocalParts, toApiIso, toLocalParts } from './slot-time';

/** A booking as the calendar sends it to the API. */
export interface NewSlot {
  evaporatorId: string;
  startsAt: string;
  endsAt: string;
  householdId?: string;
  crew: string[];
  expectedSapL: number | null;
  note: string | null;
}

export interface BookingDraft {
  start: DateTime;
  end: DateTime;
}

interface BookingDialogProps {
  setup: CalendarSetup;
  /** Open while there is a draft; its times fill the form. */
  draft: BookingDraft | null;
  onClose: () => void;
  /** Books the slot; rejects with the API's error so the form can show it. */
  onBook: (slot: NewSlot, householdName: string) => Promise<void>;
}

export function BookingDialog({ setup, draft, onClose, onBook }: BookingDialogProps) {
  const rules = `A slot lasts ${setup.slotMinMinutes / 60} to ${setup.slotMaxMinutes / 60} hours`;
  const description = setup.user.staff
    ? `${rules}. Sugarhouse hours are ${setup.opensAt}–${setup.closesAt}; you can book outside them.`
    : `${rules}, inside the sugarhouse hours ${setup.opensAt}–${setup.closesAt}.`;
  return (
    <Dialog open={draft !== null} onOpenChange={(open) => (open ? undefined : onClose())}>
      {draft ? (
        <DialogContent title="Book a boil slot" description={description} data-testid="booking-dialog">
          <BookingForm key={`${draft.start.toMillis()}-${draft.end.toMillis()}`} setup={setup} draft={draft} onBook={onBook} />
        </DialogContent>
      ) : null}
    </Dialog>
  );
}

type FieldName = 'startsAt' | 'endsAt' | 'householdId' | 'evaporatorId' | 'crew' | 'expectedSapL' | 'note';
const FIELD_NAMES: FieldName[] = ['startsAt', 'endsAt', 'householdId', 'evaporatorId', 'crew', 'expectedSapL', 'note'];

/** The API keys list items as "crew.0"; the form shows them on the list's one input. */
function placeFieldErrors(fields: Record<string, string>) {
  const placed: Partial<Record<FieldName, string>> = {};
  const rest: string[] = [];
  for (const [key, message] of Object.entries(fields)) {
    const name = key.split('.')[0] as FieldName;
    if (FIELD_NAMES.includes(name)) placed[name] ??= message;
    else rest.push(message);
  }
  return { placed, rest };
}

const parseCrew = (text: string) =>
  text
    .split(',')
    .map((n) => n.trim())
    .filter(Boolean);

function BookingForm({ setup, draft, onBook }: { setup: CalendarSetup; draft: BookingDraft; onBook: BookingDialogProps['onBook'] }) {
  const uid = useId();
  const id = (name: string) => `booking-${name}-${uid.replace(/:/g, '')}`;
  const zone = setup.timeZone;
  const gallons = setup.unitSystem === 'us';
  const [start, setStart] = useState(() => toLocalParts(draft.start));
  const [end, setEnd] = useState(() => toLocalParts(draft.end));
  const [householdId, setHouseholdId] = useState(setup.user.staff ? '' : (setup.user.householdId ?? ''));
  const [evaporatorId, setEvaporatorId] = useState(setup.evaporators[0]?.id ?? '');
  const [crew, setCrew] = useState(setup.user.staff ? '' : setup.user.name);
  const [sap, setSap] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Partial<Record<FieldName, string>>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const formErrorRef = useRef<HTMLDivElement>(null);

  // The form scrolls on a phone; bring the server's answer into view where it was given.
  useEffect(() => {
    if (formError) formErrorRef.current?.scrollIntoView({ block: 'nearest' });
  }, [formError]);

  const startAt = fromLocalParts(start, zone);
  const endAt = fromLocalParts(end, zone);
  const minutes = startAt && endAt ? endAt.diff(startAt, 'minutes').minutes : null;

  function check(): { slot: NewSlot; householdName: string } | null {
    const found: Partial<Record<FieldName, string>> = {};
    if (!startAt) found.startsAt = 'Give the date and time the boil starts.';
    if (!endAt) found.endsAt = 'Give the date and time the boil ends.';
    else if (startAt && endAt <= startAt) found.endsAt = 'The slot must end after it starts.';
    if (!householdId) found.householdId = 'Choose the household that crews this boil.';
    if (!evaporatorId) found.evaporatorId = 'Choose an evaporator.';
    let expectedSapL: number | null = null;
    if (sap.trim()) {
      const value = Number(sap.trim().replace(',', '.'));
      if (!Number.isFinite(value) || value < 0) found.expectedSapL = `Give the expected sap as a number of ${gallons ? 'gallons' : 'litres'}, or leave it empty.`;
      else expectedSapL = Math.round((gallons ? gallonsToLitres(value) : value) * 100) / 100;
    }
    setErrors(found);
    if (Object.keys(found).length > 0 || !startAt || !endAt) return null;
    const householdName = setup.user.staff
      ? (setup.households.find((h) => h.id === householdId)?.name ?? '')
      : (setup.user.householdName ?? '');
    return {
      householdName,
      slot: {
        evaporatorId,
        startsAt: toApiIso(startAt),
        endsAt: toApiIso(endAt),
        ...(setup.user.staff ? { householdId } : {}),
        crew: parseCrew(crew),
        expectedSapL,
        note: note.trim() || null,
      },
    };
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    const checked = check();
    if (!checked) return;
    setBusy(true);
    try {
      await onBook(checked.slot, checked.householdName);
    } catch (err) {
      if (!(err instanceof ApiClientError)) {
        setFormError('Could not reach Brixhouse. Check the connection and try again.');
        return;
      }
      const { placed, rest } = placeFieldErrors(err.fields);
      setErrors(placed);
      // A clash or a refusal concerns the whole booking, so it leads the form as well.
      if (err.status === 409 || err.status === 403 || Object.keys(placed).length === 0 || rest.length > 0) {
        setFormError([err.message, ...rest].join(' '));
      }
      if (err.status === 409) toast.error(err.message);
    } finally {
      setBusy(false);
    }
  }

  const startError = errors.startsAt;
  const endError = errors.endsAt;
  const sapHint = `Optional, in ${gallons ? 'US gallons' : 'litres'}: roughly how much sap this boil takes from the tanks.`;

  return (
    <form onSubmit={submit} noValidate aria-label="Book a boil slot" className="flex flex-col gap-4">
      {formError ? (
        <div ref={formErrorRef}>
          <Alert tone="danger" title={formError} />
        </div>
      ) : null}

      <div className="flex flex-col gap-1.5">
        <div className="grid grid-cols-2 gap-3">
          <div className="flex flex-col gap-1.5">
            <Label htmlFor={id('start-date')}>Start date</Label>
            <Input
              type="date"
              id={id('start-date')}
              value={start.date}
              onChange={(e) => setStart({ ...start, date: e.target.value })}
              aria-invalid={!!startError || undefined}
              aria-describedby={startError ? id('start-error') : undefined}
            />
          </div>
          <div className="flex flex-col gap-1.5">
            <Label htmlFor={id('start-time')}>Start time</Label>
            <Input
              type="time"
              id={id('start-time')}
              value={start.time}
              onChange={(e) => setStart({ ...start, time: e.target.value })}
              aria-invalid={!!startError || undefined}
              aria-describedby={startError ? id('start-error') : undefined}
            />
          </div>
        </div>
        {startError ? (
          <p id={id('start-error')} role="alert" className="text-sm font-semibold text-ember">
            {startError}
          </p>
        ) : null}
      </div>

      <div className="flex flex-col gap-1.5">
        <div className="grid grid-cols-2 gap-3">
          <div className="flex flex-col gap-1.5">
            <Label htmlFor={id('end-date')}>End date</Label>
            <Input
              type="date"
              id={id('end-date')}
              value={end.date}
              onChange={(e) => setEnd({ ...end, date: e.target.value })}
              aria-invalid={!!endError || undefined}
              aria-describedby={[id('length'), endError ? id('end-error') : null].filter(Boolean).join(' ')}
            />
          </div>
          <div className="flex flex-col gap-1.5">
            <Label htmlFor={id('end-time')}>End time</Label>
            <Input
              type="time"
              id={id('end-time')}
              value={end.time}
              onChange={(e) => setEnd({ ...end, time: e.target.value })}
              aria-invalid={!!endError || undefined}
              aria-describedby={[id('length'), endError ? id('end-error') : null].filter(Boolean).join(' ')}
            />
          </div>
        </div>
        <p id={id('length')} className="text-sm text-slate-muted">
          {minutes !== null && minutes > 0 ? `Lasts ${lengthLabel(minutes)}, ${zoneLabel(startAt!)} time.` : `Times are ${zone.replace(/_/g, ' ')} time.`}
        </p>
        {endError ? (
          <p id={id('end-error')} role="alert" className="text-sm font-semibold text-ember">
            {endError}
          </p>
        ) : null}
      </div>

      {setup.user.staff ? (
        <Field label="Household" htmlFor={id('household')} error={errors.householdId}>
          <Select {...fieldA11y(id('household'), errors.householdId)} value={householdId} onChange={(e) => setHouseholdId(e.target.value)}>
            <option value="">Choose a household…</option>
            {setup.households.map((h) => (
              <option key={h.id} value={h.id}>
                {h.name}
              </option>
            ))}
          </Select>
        </Field>
      ) : (
        <div className="flex flex-col gap-1">
          <p className="text-base font-semibold">Household</p>
          <p className={cn(errors.householdId ? 'text-ember' : 'text-slate')}>
            {setup.user.householdName ? `${setup.user.householdName} (your household)` : 'You are not in a household yet; ask your coordinator.'}
          </p>
        </div>
      )}

      {setup.evaporators.length > 1 ? (
        <Field label="Evaporator" htmlFor={id('evaporator')} error={errors.evaporatorId}>
          <Select {...fieldA11y(id('evaporator'), errors.evaporatorId)} value={evaporatorId} onChange={(e) => setEvaporatorId(e.target.value)}>
            {setup.evaporators.map((ev) => (
              <option key={ev.id} value={ev.id}>
                {ev.name}
              </option>
            ))}
          </Select>
        </Field>
      ) : errors.evaporatorId ? (
        <p role="alert" className="text-sm font-semibold text-ember">
          {errors.evaporatorId}
        </p>
      ) : null}

      <Field label="Crew" htmlFor={id('crew')} error={errors.crew} hint="Names of the people tending the fire, separated by commas.">
        <Input
          {...fieldA11y(id('crew'), errors.crew, true)}
          value={crew}
          onChange={(e) => setCrew(e.target.value)}
          autoComplete="off"
        />
      </Field>

      <Field label={`Expected sap (${gallons ? 'gal' : 'L'})`} htmlFor={id('sap')} error={errors.expectedSapL} hint={sapHint}>
        <Input
          {...fieldA11y(id('sap'), errors.expectedSapL, true)}
          value={sap}
          onChange={(e) => setSap(e.target.value)}
          inputMode="decimal"
          autoComplete="off"
        />
      </Field>

      <Field label="Note (optional)" htmlFor={id('note')} error={errors.note}>
        <Textarea {...fieldA11y(id('note'), errors.note)} rows={2} maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} />
      </Field>

      <Button type="submit" loading={busy} disabled={!setup.user.staff && !setup.user.householdId}>
        Book this slot
      </Button>
    </form>
  );
}

function lengthLabel(minutes: number) {
  const h = Math.floor(minutes / 60);
  const m = Math.round(minutes % 60);
  return [h ? `${h} h` : null, m ? `${m} min` : null].filter(Boolean).join(' ') || '0 min';
}

const zoneLabel = (at: DateTime) => at.toFormat('ZZZZ');
