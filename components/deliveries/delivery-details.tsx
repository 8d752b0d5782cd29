'use client';

import { useState, type FormEvent } from 'react';
import useSWR, { useSWRConfig } from 'swr';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Dialog, DialogContent } from '@/components/ui/dialog';
import { Field, Input, Textarea, fieldA11y } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { toast } from '@/components/ui/toaster';
import { ApiClientError, apiSend, fetcher } from '@/lib/client/api';
import { parseNumber } from '@/lib/deliveries/form';
import type { DeliveryDetailDto } from '@/lib/deliveries/types';
import { gallonsToLitres, litresToGallons, type UnitSystem } from '@/lib/sugar';
import { formatTemperature } from '@/lib/format/units';
import { brix as fmtBrix, formatDay, formatWhen, mass, vol, volumeUnit } from './format';

export interface DeliveryDetailsProps {
  id: string | null;
  onClose: () => void;
  units: UnitSystem;
  timeZone: string;
  households: { id: string; name: string }[] | null;
  canCorrect: boolean;
}

const FIELD_LABEL: Record<string, string> = {
  householdId: 'Household',
  volumeL: 'Volume',
  brix: '°Brix',
  sapTempC: 'Sap temperature',
  collectedOn: 'Collected on',
  clarity: 'Clarity',
  contamination: 'In the sap',
  mix: 'Sugarbush mix',
  recommendation: 'Recommendation',
  status: 'Status',
  reason: 'Lot’s reason',
  photoKey: 'Photo',
  note: 'Note',
};

/** One lot: its figures, photo, revisions and (for staff) a correction with its reason. */
export function DeliveryDetails({ id, onClose, units, timeZone, households, canCorrect }: DeliveryDetailsProps) {
  const { data: lot, error, mutate } = useSWR<DeliveryDetailDto>(id ? `/api/deliveries/${id}` : null, fetcher);
  return (
    <Dialog open={!!id} onOpenChange={(open) => (!open ? onClose() : undefined)}>
      {id ? (
        <DialogContent
          title={lot ? `${lot.householdName} household, ${formatWhen(lot.receivedAt, timeZone)}` : 'Drop-off'}
          description={lot ? `Lot ${lot.id.slice(0, 8)}` : undefined}
          className="sm:max-w-2xl"
        >
          {error ? <Alert tone="danger">This drop-off could not be loaded.</Alert> : null}
          {!lot ? <p className="text-slate-muted">Loading…</p> : <LotBody lot={lot} units={units} timeZone={timeZone} households={households} />}
          {lot && canCorrect ? <Correction key={lot.revisions.length} lot={lot} units={units} onSaved={(l) => mutate(l, { revalidate: false })} /> : null}
        </DialogContent>
      ) : null}
    </Dialog>
  );
}

function show(field: string, value: unknown, units: UnitSystem, households: { id: string; name: string }[] | null): string {
  if (value === null || value === undefined || value === '') return '—';
  if (field === 'volumeL' && typeof value === 'number') return vol(value, units);
  if (field === 'brix' && typeof value === 'number') return fmtBrix(value);
  if (field === 'sapTempC' && typeof value === 'number') return formatTemperature(value, units);
  if (field === 'householdId') return households?.find((h) => h.id === value)?.name ?? 'another household';
  if (field === 'mix' && typeof value === 'object') {
    const m = value as { sugarMaple: number; redMaple: number; other: number };
    return `${m.sugarMaple} % sugar maple, ${m.redMaple} % red maple, ${m.other} % other`;
  }
  if (field === 'photoKey') return 'a photo';
  return String(value);
}

function LotBody({ lot, units, timeZone, households }: { lot: DeliveryDetailDto; units: UnitSystem; timeZone: string; households: { id: string; name: string }[] | null }) {
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2">
        <Badge variant={lot.status === 'accepted' ? 'spruce' : 'ember'}>{lot.status === 'accepted' ? 'Accepted' : 'Rejected'}</Badge>
        {lot.recommendation === 'reject' && lot.status === 'accepted' ? <Badge variant="ember">Accepted against the recommendation</Badge> : null}
        {lot.litresBoiled > 0 ? <Badge>{vol(lot.litresBoiled, units)} boiled</Badge> : null}
      </div>
      {lot.reason ? (
        <p>
          <span className="font-semibold">Reason: </span>
          {lot.reason}
        </p>
      ) : null}
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5">
        <dt className="text-slate-muted">Volume</dt>
        <dd className="num">{vol(lot.volumeL, units)}</dd>
        <dt className="text-slate-muted">Sugar content</dt>
        <dd className="num">{fmtBrix(lot.brix)}</dd>
        <dt className="text-slate-muted">Sugar</dt>
        <dd className="num">{lot.status === 'accepted' ? mass(lot.sugarKg, units) : `${mass(lot.sugarKg, units)} (not counted)`}</dd>
        <dt className="text-slate-muted">Sap temperature</dt>
        <dd className="num">{formatTemperature(lot.sapTempC, units)}</dd>
        <dt className="text-slate-muted">Collected on</dt>
        <dd>{formatDay(lot.collectedOn)}</dd>
        <dt className="text-slate-muted">Boil by</dt>
        <dd>{formatWhen(lot.deadline, timeZone)}</dd>
        <dt className="text-slate-muted">Clarity, in the sap</dt>
        <dd>
          {lot.clarity}, {lot.contamination === 'none' ? 'nothing' : lot.contamination}
        </dd>
        {lot.mix ? (
          <>
            <dt className="text-slate-muted">Sugarbush</dt>
            <dd>{show('mix', lot.mix, units, households)}</dd>
          </>
        ) : null}
        <dt className="text-slate-muted">Logged by</dt>
        <dd>{lot.loggedByName ?? '—'}</dd>
        {lot.note ? (
          <>
            <dt className="text-slate-muted">Note</dt>
            <dd>{lot.note}</dd>
          </>
        ) : null}
      </dl>
      {lot.photoKey ? (
        // eslint-disable-next-line @next/next/no-img-element -- a private photo served with the session cookie
        <img src={`/api/photos/${lot.photoKey}`} alt={`Photo of the lot from the ${lot.householdName} household`} width={480} height={360} className="h-auto max-h-80 w-full rounded-lg border border-birch-line object-contain" />
      ) : null}
      <section aria-labelledby="revisions-title">
        <h3 id="revisions-title" className="text-lg font-bold">
          Corrections
        </h3>
        {lot.revisions.length === 0 ? (
          <p className="text-slate-muted">None: the lot is as first logged.</p>
        ) : (
          <ol className="flex flex-col gap-2" data-testid="revisions">
            {lot.revisions.map((r) => (
              <li key={r.id} className="rounded-lg border border-birch-line p-3">
                <p className="text-sm text-slate-muted">
                  {formatWhen(r.changedAt, timeZone, true)} by {r.changedByName ?? 'someone no longer in the co-op'}
                </p>
                <p className="font-semibold">{r.reason}</p>
                <ul className="mt-1 text-sm">
                  {Object.keys(r.after).map((k) => (
                    <li key={k}>
                      {FIELD_LABEL[k] ?? k}: {show(k, r.before[k], units, households)} → {show(k, r.after[k], units, households)}
                    </li>
                  ))}
                </ul>
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}

function Correction({ lot, units, onSaved }: { lot: DeliveryDetailDto; units: UnitSystem; onSaved: (lot: DeliveryDetailDto) => void }) {
  const { mutate } = useSWRConfig();
  const shownVolume = units === 'us' ? litresToGallons(lot.volumeL).toFixed(3) : String(lot.volumeL);
  const [volume, setVolume] = useState(shownVolume);
  const [brixText, setBrix] = useState(String(lot.brix));
  const [status, setStatus] = useState(lot.status);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saving, setSaving] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    const patch: Record<string, unknown> = { reason };
    if (volume !== shownVolume) {
      const typed = parseNumber(volume);
      patch.volumeL = units === 'us' && Number.isFinite(typed) ? gallonsToLitres(typed) : typed;
    }
    if (brixText !== String(lot.brix)) patch.brix = parseNumber(brixText);
    if (status !== lot.status) patch.status = status;
    setSaving(true);
    setErrors({});
    try {
      const saved = await apiSend<DeliveryDetailDto>('PATCH', `/api/deliveries/${lot.id}`, patch);
      onSaved(saved);
      toast.success('Correction saved, with its reason.');
      await mutate((k) => typeof k === 'string' && k.startsWith('/api/deliveries?'));
    } catch (err) {
      if (err instanceof ApiClientError) setErrors({ ...err.fields, _: Object.keys(err.fields).length ? '' : err.message });
      else setErrors({ _: 'Could not reach Brixhouse; nothing was changed.' });
    } finally {
      setSaving(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Correct this lot" className="flex flex-col gap-3 border-t border-birch-line pt-4">
      <h3 className="text-lg font-bold">Correct this lot</h3>
      {errors._ ? <Alert tone="danger">{errors._}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <Field label={`Volume (${volumeUnit(units)})`} htmlFor="fix-volume" error={errors.volumeL}>
          <Input {...fieldA11y('fix-volume', errors.volumeL)} inputMode="decimal" value={volume} onChange={(e) => setVolume(e.target.value)} />
        </Field>
        <Field label="°Brix" htmlFor="fix-brix" error={errors.brix}>
          <Input {...fieldA11y('fix-brix', errors.brix)} inputMode="decimal" value={brixText} onChange={(e) => setBrix(e.target.value)} />
        </Field>
        <Field label="Status" htmlFor="fix-status" error={errors.status}>
          <Select id="fix-status" value={status} onChange={(e) => setStatus(e.target.value as typeof status)}>
            <option value="accepted">Accepted</option>
            <option value="rejected">Rejected</option>
          </Select>
        </Field>
      </div>
      <Field label="Why is it corrected?" htmlFor="fix-reason" error={errors.reason} hint="Kept with the lot’s history; a rejection is e-mailed to the household.">
        <Textarea {...fieldA11y('fix-reason', errors.reason, true)} rows={2} value={reason} onChange={(e) => setReason(e.target.value)} />
      </Field>
      <div>
        <Button type="submit" loading={saving}>
          Save correction
        </Button>
      </div>
    </form>
  );
}
