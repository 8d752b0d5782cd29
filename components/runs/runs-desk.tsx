'use client';

import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { toast } from '@/components/ui/toaster';
import { clock } from '@/components/queue/format';
import { LiveStatusPill } from '@/components/queue/queue-board';
import { useLiveQueue } from '@/components/queue/use-live-queue';
import { ApiClientError, apiSend, applyFieldErrors } from '@/lib/client/api';
import type { QueueSnapshot } from '@/lib/queue/types';
import type { RunDto } from '@/lib/runs/types';
import { GRADE_CLASS_INFO, fahrenheitToCelsius, gallonsToLitres, gradeClass, type UnitSystem } from '@/lib/sugar';
import { formatBrix, formatMoney } from '@/lib/format/units';
import { FinishedRuns } from './finished-runs';
import { showSyrup, showVolume } from '@/lib/figures';

export interface RunsDeskProps {
  initialRuns: RunDto[];
  initialQueue: QueueSnapshot;
  evaporators: { id: string; name: string; fuelKind: string }[];
  unitSystem: UnitSystem;
  timeZone: string;
  currency: string;
  fuelPriceCents: number;
  seasonOpen: boolean;
}

const num = (v: string) => Number(String(v).replace(',', '.'));

/** The sugarmaker's Runs screen: start a run, take lots from the queue, draw off, fuel, finish. */
export function RunsDesk(props: RunsDeskProps) {
  const { unitSystem, timeZone } = props;
  const [runs, setRuns] = useState(props.initialRuns);
  const { snapshot, status } = useLiveQueue(props.initialQueue);
  const running = runs.filter((r) => r.status === 'running');
  const finished = runs.filter((r) => r.status === 'finished');
  const put = (run: RunDto) => setRuns((all) => (all.some((r) => r.id === run.id) ? all.map((r) => (r.id === run.id ? run : r)) : [run, ...all]));

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <LiveStatusPill status={status} />
        <span className="text-sm text-slate-muted">
          Queue: {snapshot.totals.lots} lots, {showVolume(snapshot.totals.litresWaiting, unitSystem)} waiting
        </span>
      </div>
      {running.map((run) => (
        <RunPanel key={run.id} run={run} onRun={put} queue={snapshot} {...props} />
      ))}
      {props.seasonOpen ? (
        <StartRun evaporators={props.evaporators.filter((e) => !running.some((r) => r.evaporatorId === e.id))} onRun={put} />
      ) : (
        <Alert tone="info" title="No season is open">Runs are recorded in an open season.</Alert>
      )}
      <FinishedRuns runs={finished} unitSystem={unitSystem} timeZone={timeZone} currency={props.currency} />
    </div>
  );
}

function StartRun({ evaporators, onRun }: { evaporators: RunsDeskProps['evaporators']; onRun: (r: RunDto) => void }) {
  const [evaporatorId, setEvaporatorId] = useState(evaporators[0]?.id ?? '');
  const [inSlot, setInSlot] = useState(true);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!evaporators.length) return null;
  const start = async () => {
    setBusy(true);
    setError(null);
    try {
      const run = await apiSend<RunDto>('POST', '/api/runs', { evaporatorId, ...(inSlot ? {} : { slotId: null }) });
      onRun(run);
      toast.success(`Run ${run.lotCode} started.`);
    } catch (err) {
      setError(err instanceof ApiClientError ? err.message : 'Could not reach Brixhouse. Try again in a moment.');
    } finally {
      setBusy(false);
    }
  };
  return (
    <Card>
      <CardHeader>
        <CardTitle>Start a run</CardTitle>
      </CardHeader>
      <CardBody>
        {error ? <Alert tone="danger">{error}</Alert> : null}
        <div className="grid gap-4 sm:grid-cols-[1fr_auto] sm:items-end">
          <Field label="Evaporator" htmlFor="start-evaporator">
            <Select id="start-evaporator" value={evaporatorId} onChange={(e) => setEvaporatorId(e.target.value)}>
              {evaporators.map((e) => (
                <option key={e.id} value={e.id}>
                  {e.name}
                </option>
              ))}
            </Select>
          </Field>
          <label className="flex min-h-touch items-center gap-3 text-base">
            <input type="checkbox" className="size-6 accent-spruce" checked={inSlot} onChange={(e) => setInSlot(e.target.checked)} />
            In the booked slot under way
          </label>
        </div>
        <div>
          <Button size="lg" onClick={start} loading={busy}>
            Start a run
          </Button>
        </div>
      </CardBody>
    </Card>
  );
}

type PanelProps = RunsDeskProps & { run: RunDto; onRun: (r: RunDto) => void; queue: QueueSnapshot };

function RunPanel({ run, onRun, queue, unitSystem, timeZone, currency, evaporators, fuelPriceCents }: PanelProps) {
  const fuelKind = evaporators.find((e) => e.id === run.evaporatorId)?.fuelKind ?? 'wood';
  const t = run.totals;
  const share = t.syrupExpectedL > 0 ? t.syrupDrawnL / t.syrupExpectedL : 0;
  return (
    <Card className="border-ember" data-testid="running-run">
      <CardHeader>
        <CardTitle>
          Run {run.lotCode} on {run.evaporatorName}
        </CardTitle>
        <p className="text-slate-muted">
          Started {clock(run.startedAt, timeZone)}
          {run.startedByName ? ` by ${run.startedByName}` : ''}
          {run.slotId ? ' · in a booked slot' : ''}
        </p>
      </CardHeader>
      <CardBody className="flex flex-col gap-5">
        <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
          <Stat label="Sap taken in" value={showVolume(t.inputL, unitSystem)} />
          <Stat label="Syrup expected" value={showSyrup(t.syrupExpectedL, unitSystem)} hint="what the sugar makes at the co-op’s °Bx" />
          <Stat label="Syrup drawn" value={showSyrup(t.syrupDrawnL, unitSystem)} hint={t.syrupExpectedL ? `${Math.round(share * 100)} % of expected` : undefined} testId="syrup-drawn" />
          <Stat label="Fuel" value={formatMoney(t.fuelCostCents, currency)} />
        </dl>
        {share > 1.02 ? (
          <Alert tone="warning" title="More syrup than the sugar allows">
            The draw-offs add up to more than the sap’s sugar can make. Check the volumes and the °Bx readings.
          </Alert>
        ) : null}
        <TakeLots run={run} queue={queue} onRun={onRun} unitSystem={unitSystem} timeZone={timeZone} />
        <div className="grid gap-5 lg:grid-cols-2">
          <DrawForm run={run} onRun={onRun} unitSystem={unitSystem} />
          <FuelForm run={run} onRun={onRun} unitSystem={unitSystem} fuelKind={fuelKind} priceCents={fuelPriceCents} currency={currency} />
        </div>
        <RunLists run={run} unitSystem={unitSystem} timeZone={timeZone} currency={currency} />
        <FinishButton run={run} onRun={onRun} />
      </CardBody>
    </Card>
  );
}

function Stat({ label, value, hint, testId }: { label: string; value: string; hint?: string; testId?: string }) {
  return (
    <div className="rounded-lg bg-birch p-3">
      <dt className="text-sm text-slate-muted">{label}</dt>
      <dd className="text-xl font-bold" data-testid={testId}>
        {value}
      </dd>
      {hint ? <dd className="text-sm text-slate-muted">{hint}</dd> : null}
    </div>
  );
}

function TakeLots({ run, queue, onRun, unitSystem, timeZone }: { run: RunDto; queue: QueueSnapshot; onRun: (r: RunDto) => void; unitSystem: UnitSystem; timeZone: string }) {
  const [part, setPart] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const unit = unitSystem === 'us' ? 'gal' : 'L';
  const take = async (deliveryId: string, partial: boolean) => {
    setBusy(deliveryId);
    setError(null);
    try {
      const litres = partial ? (unitSystem === 'us' ? gallonsToLitres(num(part[deliveryId])) : num(part[deliveryId])) : undefined;
      if (partial && !(litres! > 0)) throw new ApiClientError(422, `Type the ${unit} to take.`);
      onRun(await apiSend<RunDto>('POST', `/api/runs/${run.id}/inputs`, { deliveryId, ...(partial ? { litres: Math.round(litres! * 1000) / 1000 } : {}) }));
      setPart((p) => ({ ...p, [deliveryId]: '' }));
    } catch (err) {
      setError(err instanceof ApiClientError ? err.message : 'Could not reach Brixhouse. Try again in a moment.');
    } finally {
      setBusy(null);
    }
  };
  const head = queue.lots.slice(0, 6);
  return (
    <section aria-labelledby={`take-${run.id}`} className="flex flex-col gap-3">
      <h3 id={`take-${run.id}`} className="text-lg font-bold">
        Take sap from the head of the queue
      </h3>
      {error ? <Alert tone="danger">{error}</Alert> : null}
      {head.length === 0 ? <p className="text-slate-muted">No sap is waiting.</p> : null}
      <ul className="flex flex-col gap-2">
        {head.map((l) => (
          <li key={l.deliveryId} data-testid="take-lot" className="grid gap-2 rounded-lg border border-birch-line p-3 md:grid-cols-[1fr_auto] md:items-center">
            <div>
              <span className="font-semibold">{l.householdName}</span> · {showVolume(l.litresLeft, unitSystem)} at {formatBrix(l.brix)}
              <span className="block text-sm text-slate-muted">
                deadline {clock(l.deadline, timeZone)}
                {l.spoilsBeforeTurn ? ' · spoils before its turn' : ''}
              </span>
            </div>
            <div className="flex flex-wrap items-center gap-2">
              <Button onClick={() => take(l.deliveryId, false)} loading={busy === l.deliveryId} aria-label={`Take all of the ${l.householdName} lot`}>
                Take all
              </Button>
              <label className="sr-only" htmlFor={`part-${l.deliveryId}`}>
                {unit} of the {l.householdName} lot to take
              </label>
              <Input
                id={`part-${l.deliveryId}`}
                className="w-28"
                inputMode="decimal"
                placeholder={unit}
                value={part[l.deliveryId] ?? ''}
                onChange={(e) => setPart((p) => ({ ...p, [l.deliveryId]: e.target.value }))}
              />
              <Button variant="secondary" onClick={() => take(l.deliveryId, true)} disabled={!part[l.deliveryId]}>
                Take part
              </Button>
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}

type DrawValues = {
  volume: string;
  brix: string;
  transmittancePct: string;
  temperature: string;
};

function DrawForm({ run, onRun, unitSystem }: { run: RunDto; onRun: (r: RunDto) => void; unitSystem: UnitSystem }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, control, setError, reset, formState } = useForm<DrawValues>({
    defaultValues: { volume: '', brix: '', transmittancePct: '', temperature: '' },
  });
  const tc = useWatch({ control, name: 'transmittancePct' });
  const tcValue = num(tc);
  const klass = tc !== '' && tcValue >= 0 && tcValue <= 100 ? gradeClass(tcValue) : null;
  const us = unitSystem === 'us';
  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const litres = us ? gallonsToLitres(num(v.volume)) : num(v.volume);
      const body = {
        litres: Math.round(litres * 1000) / 1000,
        brix: num(v.brix),
        transmittancePct: v.transmittancePct === '' ? null : num(v.transmittancePct),
        temperatureC: v.temperature === '' ? null : us ? fahrenheitToCelsius(num(v.temperature)) : num(v.temperature),
      };
      onRun(await apiSend<RunDto>('POST', `/api/runs/${run.id}/draws`, body));
      reset();
      toast.success('Draw-off recorded.');
    } catch (err) {
      const mapped = err instanceof ApiClientError ? { ...err.fields, volume: err.fields.litres, temperature: err.fields.temperatureC } : {};
      setFormError(applyFieldErrors<DrawValues>(err instanceof ApiClientError ? new ApiClientError(err.status, err.message, mapped) : err, setError, ['volume', 'brix', 'transmittancePct', 'temperature']));
    }
  });
  const e = formState.errors;
  const id = (n: string) => `draw-${run.id}-${n}`;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Record a draw-off" className="flex flex-col gap-3 rounded-lg border border-birch-line p-4">
      <h3 className="text-lg font-bold">Record a draw-off</h3>
      {formError ? <Alert tone="danger">{formError}</Alert> : null}
      <div className="grid grid-cols-2 gap-3">
        <Field label={`Syrup (${us ? 'gal' : 'L'})`} htmlFor={id('volume')} error={e.volume?.message}>
          <Input {...fieldA11y(id('volume'), e.volume?.message)} inputMode="decimal" {...register('volume', { required: 'How much syrup?' })} />
        </Field>
        <Field label="Density (°Bx)" htmlFor={id('brix')} error={e.brix?.message}>
          <Input {...fieldA11y(id('brix'), e.brix?.message)} inputMode="decimal" {...register('brix', { required: 'Read the °Bx.' })} />
        </Field>
        <Field label="Transmittance (%Tc)" htmlFor={id('transmittancePct')} error={e.transmittancePct?.message}>
          <Input {...fieldA11y(id('transmittancePct'), e.transmittancePct?.message)} inputMode="decimal" {...register('transmittancePct', { required: 'Read the %Tc.' })} />
        </Field>
        <Field label={`Temperature (${us ? '°F' : '°C'})`} htmlFor={id('temperature')} error={e.temperature?.message}>
          <Input {...fieldA11y(id('temperature'), e.temperature?.message)} inputMode="decimal" {...register('temperature')} />
        </Field>
      </div>
      <p className="min-h-6" aria-live="polite" data-testid="draw-class">
        {klass ? (
          <>
            Colour class: <Badge variant={klass}>{GRADE_CLASS_INFO[klass].name}</Badge> {GRADE_CLASS_INFO[klass].taste}
          </>
        ) : (
          <span className="text-sm text-slate-muted">The colour class follows from the %Tc (USDA grading standard).</span>
        )}
      </p>
      <div>
        <Button type="submit" loading={formState.isSubmitting}>
          Record draw-off
        </Button>
      </div>
    </form>
  );
}

interface FuelFormProps {
  run: RunDto;
  onRun: (r: RunDto) => void;
  unitSystem: UnitSystem;
  fuelKind: string;
  priceCents: number;
  currency: string;
}

function FuelForm({ run, onRun, unitSystem, fuelKind, priceCents, currency }: FuelFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<{ quantity: string }>({ defaultValues: { quantity: '' } });
  const wood = fuelKind === 'wood';
  const gallons = !wood && unitSystem === 'us';
  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    try {
      const quantity = gallons ? gallonsToLitres(num(v.quantity)) : num(v.quantity);
      onRun(await apiSend<RunDto>('POST', `/api/runs/${run.id}/fuel`, { quantity: Math.round(quantity * 1000) / 1000 }));
      reset();
      toast.success('Fuel recorded.');
    } catch (err) {
      setFormError(applyFieldErrors<{ quantity: string }>(err, setError, ['quantity']));
    }
  });
  const id = `fuel-${run.id}`;
  const err = formState.errors.quantity?.message;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Record fuel" className="flex flex-col gap-3 rounded-lg border border-birch-line p-4">
      <h3 className="text-lg font-bold">Record fuel</h3>
      {formError ? <Alert tone="danger">{formError}</Alert> : null}
      <Field
        label={wood ? 'Wood burned (cords)' : `${fuelKind} burned (${gallons ? 'gal' : 'L'})`}
        htmlFor={id}
        error={err}
        hint={`At the season’s ${formatMoney(priceCents, currency)} a ${wood ? 'cord' : 'litre'}.${wood ? ' A full cord is 128 cu ft stacked (3.62 m³).' : ''}`}
      >
        <Input {...fieldA11y(id, err, true)} inputMode="decimal" {...register('quantity', { required: 'How much wood?' })} />
      </Field>
      <div>
        <Button type="submit" variant="secondary" loading={formState.isSubmitting}>
          Record fuel
        </Button>
      </div>
    </form>
  );
}

function RunLists({ run, unitSystem, timeZone, currency }: { run: RunDto; unitSystem: UnitSystem; timeZone: string; currency: string }) {
  return (
    <div className="grid gap-4 md:grid-cols-3">
      <div>
        <h3 className="font-bold">Sap in</h3>
        <ul className="text-sm">
          {run.inputs.map((i) => (
            <li key={i.id}>
              {i.householdName}: {showVolume(i.litres, unitSystem)} at {formatBrix(i.brix)}
            </li>
          ))}
          {run.inputs.length === 0 ? <li className="text-slate-muted">None yet.</li> : null}
        </ul>
      </div>
      <div>
        <h3 className="font-bold">Draw-offs</h3>
        <ul className="flex flex-col gap-1 text-sm" data-testid="run-draws">
          {run.draws.map((d) => (
            <li key={d.id}>
              {clock(d.drawnAt, timeZone, false)} · {showSyrup(d.litres, unitSystem)} at {formatBrix(d.brix)}{' '}
              <Badge variant={d.gradeClass}>{GRADE_CLASS_INFO[d.gradeClass].name}</Badge>
            </li>
          ))}
          {run.draws.length === 0 ? <li className="text-slate-muted">None yet.</li> : null}
        </ul>
      </div>
      <div>
        <h3 className="font-bold">Fuel</h3>
        <ul className="text-sm">
          {run.fuel.map((f) => (
            <li key={f.id}>
              {f.quantity} {f.unit === 'cord' ? 'cord' : 'L'} {f.kind} · {formatMoney(f.costCents, currency)}
            </li>
          ))}
          {run.fuel.length === 0 ? <li className="text-slate-muted">None yet.</li> : null}
        </ul>
      </div>
    </div>
  );
}

function FinishButton({ run, onRun }: { run: RunDto; onRun: (r: RunDto) => void }) {
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const finish = async () => {
    setBusy(true);
    setError(null);
    try {
      onRun(await apiSend<RunDto>('POST', `/api/runs/${run.id}/finish`, {}));
      toast.success(`Run ${run.lotCode} finished.`);
    } catch (err) {
      setError(err instanceof ApiClientError ? err.message : 'Could not reach Brixhouse. Try again in a moment.');
      setConfirming(false);
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="flex flex-col gap-2 border-t border-birch-line pt-4">
      {error ? <Alert tone="danger">{error}</Alert> : null}
      {confirming ? (
        <div className="flex flex-wrap items-center gap-3">
          <span className="font-semibold">Finish run {run.lotCode}? Its syrup and fuel are then split between the households.</span>
          <Button variant="danger" onClick={finish} loading={busy}>
            Yes, finish run {run.lotCode}
          </Button>
          <Button variant="ghost" onClick={() => setConfirming(false)}>
            Keep boiling
          </Button>
        </div>
      ) : (
        <div>
          <Button variant="danger" size="lg" onClick={() => setConfirming(true)}>
            Finish run
          </Button>
        </div>
      )}
    </div>
  );
}
