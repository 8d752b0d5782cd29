'use client';

import { useMemo, useRef, useState, type ChangeEvent, type FormEvent } from 'react';
import { useForm, useWatch, type FieldErrors, type Resolver } from 'react-hook-form';
import { useSWRConfig } from 'swr';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, Textarea, fieldA11y } from '@/components/ui/input';
import { toast } from '@/components/ui/toaster';
import { ApiClientError, apiSend } from '@/lib/client/api';
import { FORM_FIELD_OF, parseNumber, toDeliveryInput, type DeliveryFormValues } from '@/lib/deliveries/form';
import { collectionStart, recommend, type ShelfSettings } from '@/lib/deliveries/rules';
import { CONTAMINATIONS, type Contamination } from '@/lib/deliveries/options';
import type { DeliveryDto } from '@/lib/deliveries/types';
import { boilHours, sugarKg, syrupLitres, type UnitSystem } from '@/lib/sugar';
import { cn } from '@/lib/utils';
import { brix as fmtBrix, formatWhen, mass, tempUnit, vol, volumeUnit } from './format';

export interface DeliveryFormProps {
  units: UnitSystem;
  timeZone: string;
  /** The co-op's calendar day now, 'YYYY-MM-DD'. */
  today: string;
  households: { id: string; name: string }[];
  shelf: ShelfSettings;
  syrupBrix: number;
  evaporator: { name: string; evaporationLph: number } | null;
  /** The season lots go into; null when none is open. */
  seasonLabel: string | null;
}

/**
 * The validation schema (the same one the route handler uses), and zod with it, loads when the
 * form is first focused, not with the page: the desk's first paint does not wait for it.
 */
let schema: Promise<(typeof import('@/lib/deliveries/schema'))['DeliveryInput']> | undefined;
const loadSchema = () => {
  if (!schema) {
    schema = import('@/lib/deliveries/schema').then((m) => m.DeliveryInput);
    schema.catch(() => (schema = undefined)); // a failed load (network) is tried again next time
  }
  return schema;
};

const CONTAMINATION_LABEL: Record<Contamination, string> = {
  none: 'None',
  insects: 'Insects',
  debris: 'Debris',
  'off-odour': 'Off odour',
  other: 'Other',
};

/** A key for one form fill; crypto.randomUUID needs a secure context, getRandomValues does not. */
function newKey(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return `desk-${Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('')}`;
}

const blank = (today: string): DeliveryFormValues => ({
  householdId: '',
  volume: '',
  brix: '',
  sapTemp: '',
  collectedOn: today,
  clarity: 'clear',
  contamination: 'none',
  decision: '',
  reason: '',
  note: '',
  photoKey: '',
  mixOn: false,
  sugarMaple: '',
  redMaple: '',
  other: '',
});

const chip =
  'inline-flex min-h-touch min-w-touch cursor-pointer items-center justify-center rounded-lg border border-birch-edge bg-birch-raised px-4 text-base font-semibold text-slate has-[:checked]:border-spruce has-[:checked]:bg-spruce has-[:checked]:text-birch-raised has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-spruce';

export function DeliveryForm({ units, timeZone, today, households, shelf, syrupBrix, evaporator, seasonLabel }: DeliveryFormProps) {
  const { mutate } = useSWRConfig();
  const [key, setKey] = useState(newKey);
  const [formError, setFormError] = useState<string | null>(null);
  const [search, setSearch] = useState('');
  const [photo, setPhoto] = useState<{ url: string; name: string } | null>(null);
  const [uploading, setUploading] = useState(false);
  const inFlight = useRef(false);
  const fileInput = useRef<HTMLInputElement>(null);

  const resolver: Resolver<DeliveryFormValues> = async (values) => {
    const DeliveryInput = await loadSchema();
    const parsed = DeliveryInput.safeParse(toDeliveryInput(values, units, key));
    const errors: FieldErrors<DeliveryFormValues> = {};
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const f = FORM_FIELD_OF[issue.path.join('.')] ?? FORM_FIELD_OF[String(issue.path[0])];
        if (f && !errors[f]) errors[f] = { type: issue.code, message: issue.message };
      }
    }
    if (!errors.collectedOn && values.collectedOn > today) errors.collectedOn = { type: 'max', message: 'The collection day cannot be after today.' };
    return Object.keys(errors).length ? { values: {}, errors } : { values, errors: {} };
  };

  const { register, handleSubmit, control, setValue, setError, reset, formState } = useForm<DeliveryFormValues>({
    resolver,
    defaultValues: blank(today),
  });
  const v = { ...blank(today), ...useWatch({ control }) } as DeliveryFormValues;
  const errors = formState.errors;

  // The live preview, from lib/sugar, in the co-op's units.
  const preview = useMemo(() => {
    const typedVolume = parseNumber(v.volume);
    const volumeL = units === 'us' ? typedVolume * 3.785411784 : typedVolume;
    const b = parseNumber(v.brix);
    const t = parseNumber(v.sapTemp);
    const sapTempC = units === 'us' ? ((t - 32) * 5) / 9 : t;
    const figures = volumeL > 0 && volumeL <= 100_000 && b > 0 && b < syrupBrix;
    let rec: ReturnType<typeof recommend> | null = null;
    if (Number.isFinite(sapTempC) && sapTempC >= -10 && sapTempC <= 40 && /^\d{4}-\d{2}-\d{2}$/.test(v.collectedOn)) {
      try {
        rec = recommend(
          { clarity: v.clarity, contamination: v.contamination, sapTempC, collectedAt: collectionStart(v.collectedOn, timeZone), receivedAt: new Date() },
          shelf,
        );
      } catch {
        rec = null;
      }
    }
    return {
      sugar: figures ? sugarKg(volumeL, b) : null,
      syrup: figures ? syrupLitres(volumeL, b, syrupBrix) : null,
      hours: figures && evaporator ? boilHours(volumeL, b, evaporator.evaporationLph, syrupBrix) : null,
      rec,
    };
  }, [v.volume, v.brix, v.sapTemp, v.collectedOn, v.clarity, v.contamination, units, syrupBrix, evaporator, timeZone, shelf]);

  // Until the temperature and day are typed, only clarity and contamination can speak.
  const ruleDecision = preview.rec?.decision ?? (v.clarity === 'cloudy' || v.contamination !== 'none' ? 'reject' : 'accept');
  const decision = v.decision || ruleDecision;
  const against = decision !== ruleDecision;
  const needsReason = decision === 'reject' || against;
  const ruleText = preview.rec?.text || (ruleDecision === 'reject' ? 'Rejected: the sap failed the check at the tank.' : '');

  const matches = households.filter((h) => h.name.toLowerCase().includes(search.trim().toLowerCase()));
  const chosen = households.find((h) => h.id === v.householdId) ?? null;

  async function onPhoto(e: ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    if (!file) return;
    setUploading(true);
    try {
      const form = new FormData();
      form.append('file', file);
      const res = await fetch('/api/uploads', { method: 'POST', body: form });
      const body = await res.json().catch(() => null);
      if (!res.ok) throw new Error(body?.error?.message ?? 'The photo could not be stored.');
      setValue('photoKey', body.photoKey, { shouldDirty: true });
      setPhoto((old) => {
        if (old) URL.revokeObjectURL(old.url);
        return { url: URL.createObjectURL(file), name: file.name };
      });
      setError('photoKey', { message: '' });
    } catch (err) {
      setError('photoKey', { message: err instanceof Error ? err.message : 'The photo could not be stored.' });
    } finally {
      setUploading(false);
    }
  }

  function clearPhoto() {
    setValue('photoKey', '');
    setPhoto((old) => {
      if (old) URL.revokeObjectURL(old.url);
      return null;
    });
    if (fileInput.current) fileInput.current.value = '';
  }

  async function submitLot(values: DeliveryFormValues) {
    if (inFlight.current) return;
    inFlight.current = true;
    setFormError(null);
    try {
      const lot = await apiSend<DeliveryDto>('POST', '/api/deliveries', {
        ...toDeliveryInput(values, units, key),
        ...(values.decision ? {} : { decision }),
      });
      toast.success(
        lot.status === 'accepted'
          ? `Lot logged for the ${lot.householdName} household: ${vol(lot.volumeL, units)} at ${fmtBrix(lot.brix)}.`
          : `Rejected lot logged for the ${lot.householdName} household; they are told by e-mail.`,
      );
      reset(blank(today));
      setSearch('');
      clearPhoto();
      setKey(newKey());
      await mutate((k) => typeof k === 'string' && k.startsWith('/api/deliveries'));
    } catch (err) {
      // What was typed stays; the same key makes a retry safe.
      if (err instanceof ApiClientError) {
        let placed = false;
        for (const [field, message] of Object.entries(err.fields)) {
          const f = FORM_FIELD_OF[field];
          if (f) {
            setError(f, { message });
            placed = true;
          }
        }
        setFormError(placed ? 'The lot was not logged: see the marked fields.' : err.message);
      } else {
        setFormError('Could not reach Brixhouse, so the lot was not logged. Everything you typed is still here: try again.');
      }
    } finally {
      inFlight.current = false;
    }
  }
  const onSubmit = (e: FormEvent<HTMLFormElement>) => handleSubmit(submitLot)(e);

  const vu = volumeUnit(units);
  const tu = tempUnit(units);

  return (
    <form onSubmit={onSubmit} onFocusCapture={() => void loadSchema()} noValidate aria-label="Log a sap drop-off" className="grid gap-6 md:grid-cols-[minmax(0,1fr)_18rem] lg:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="flex flex-col gap-5">
        {formError ? <Alert tone="danger">{formError}</Alert> : null}
        {!seasonLabel ? <Alert tone="warning" title="No open season">A coordinator opens a season in Settings before sap can be logged.</Alert> : null}

        <fieldset className="flex flex-col gap-2" aria-describedby={errors.householdId ? 'household-error' : undefined}>
          <legend className="mb-1.5 text-base font-semibold">Household</legend>
          <Input
            aria-label="Find a household by name"
            placeholder="Type a few letters…"
            value={search}
            autoComplete="off"
            onChange={(e) => {
              setSearch(e.target.value);
              const q = e.target.value.trim().toLowerCase();
              const found = households.filter((h) => h.name.toLowerCase().includes(q));
              if (q && found.length === 1) setValue('householdId', found[0].id, { shouldValidate: formState.isSubmitted });
            }}
          />
          <div className="flex flex-wrap gap-2">
            {(matches.length ? matches : households).map((h) => (
              <label key={h.id} className={chip}>
                <input type="radio" value={h.id} className="sr-only" {...register('householdId')} />
                {h.name}
              </label>
            ))}
          </div>
          {errors.householdId?.message ? (
            <p id="household-error" role="alert" className="text-sm font-semibold text-ember">
              {errors.householdId.message}
            </p>
          ) : null}
        </fieldset>

        <div className="grid gap-4 sm:grid-cols-3 md:grid-cols-1 lg:grid-cols-3">
          <Field label={`Metered volume (${vu})`} htmlFor="lot-volume" error={errors.volume?.message}>
            <Input {...fieldA11y('lot-volume', errors.volume?.message)} inputMode="decimal" autoComplete="off" {...register('volume')} />
          </Field>
          <Field label="Sugar content (°Bx)" htmlFor="lot-brix" error={errors.brix?.message}>
            <Input {...fieldA11y('lot-brix', errors.brix?.message)} inputMode="decimal" autoComplete="off" {...register('brix')} />
          </Field>
          <Field label={`Sap temperature (${tu})`} htmlFor="lot-temp" error={errors.sapTemp?.message}>
            <Input {...fieldA11y('lot-temp', errors.sapTemp?.message)} inputMode="decimal" autoComplete="off" {...register('sapTemp')} />
          </Field>
        </div>

        <Field label="Oldest sap collected on" htmlFor="lot-collected" error={errors.collectedOn?.message} className="sm:max-w-xs">
          <Input {...fieldA11y('lot-collected', errors.collectedOn?.message)} type="date" max={today} defaultValue={today} {...register('collectedOn')} />
        </Field>

        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1.5 text-base font-semibold">Clarity</legend>
          <div className="flex flex-wrap gap-2">
            {(['clear', 'cloudy'] as const).map((c) => (
              <label key={c} className={chip}>
                <input type="radio" value={c} className="sr-only" defaultChecked={c === 'clear'} {...register('clarity')} />
                {c === 'clear' ? 'Clear' : 'Cloudy'}
              </label>
            ))}
          </div>
        </fieldset>

        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1.5 text-base font-semibold">In the sap</legend>
          <div className="flex flex-wrap gap-2">
            {CONTAMINATIONS.map((c) => (
              <label key={c} className={chip}>
                <input type="radio" value={c} className="sr-only" defaultChecked={c === 'none'} {...register('contamination')} />
                {CONTAMINATION_LABEL[c]}
              </label>
            ))}
          </div>
        </fieldset>

        <div className="flex flex-col gap-2">
          <span className="text-base font-semibold">Photo (optional)</span>
          <div className="flex flex-wrap items-center gap-3">
            <label className={cn(chip, 'has-[:checked]:bg-birch-raised')}>
              <input ref={fileInput} type="file" accept="image/*" capture="environment" className="sr-only" onChange={onPhoto} aria-label="Take or choose a photo" />
              {uploading ? 'Storing the photo…' : photo ? 'Take another photo' : 'Take a photo'}
            </label>
            {photo ? (
              <>
                {/* eslint-disable-next-line @next/next/no-img-element -- a local preview of the chosen file */}
                <img src={photo.url} alt="The photo attached to this lot" width={88} height={66} className="h-16 w-22 rounded-md border border-birch-line object-cover" />
                <Button type="button" variant="ghost" size="sm" onClick={clearPhoto}>
                  Remove photo
                </Button>
              </>
            ) : null}
          </div>
          {errors.photoKey?.message ? (
            <p role="alert" className="text-sm font-semibold text-ember">
              {errors.photoKey.message}
            </p>
          ) : null}
        </div>

        <details className="rounded-lg border border-birch-line bg-birch-raised p-3" open={v.mixOn}>
          <summary className="flex min-h-touch cursor-pointer items-center font-semibold">Sugarbush mix (optional)</summary>
          <label className="mt-2 flex min-h-touch items-center gap-2">
            <input type="checkbox" className="size-5" {...register('mixOn')} />
            Record the mix of trees this sap came from
          </label>
          {v.mixOn ? (
            <div className="mt-2 grid grid-cols-3 gap-3">
              <Field label="Sugar maple %" htmlFor="mix-sugar" error={errors.sugarMaple?.message}>
                <Input {...fieldA11y('mix-sugar', errors.sugarMaple?.message)} inputMode="numeric" {...register('sugarMaple')} />
              </Field>
              <Field label="Red maple %" htmlFor="mix-red" error={errors.redMaple?.message}>
                <Input {...fieldA11y('mix-red', errors.redMaple?.message)} inputMode="numeric" {...register('redMaple')} />
              </Field>
              <Field label="Other %" htmlFor="mix-other" error={errors.other?.message}>
                <Input {...fieldA11y('mix-other', errors.other?.message)} inputMode="numeric" {...register('other')} />
              </Field>
            </div>
          ) : null}
        </details>

        <Field label="Note (optional)" htmlFor="lot-note" error={errors.note?.message}>
          <Textarea {...fieldA11y('lot-note', errors.note?.message)} rows={2} {...register('note')} />
        </Field>
      </div>

      <aside className="flex flex-col gap-4 md:sticky md:top-4 md:self-start" aria-label="This lot">
        <section aria-labelledby="preview-title" aria-live="polite" className="rounded-xl border border-birch-line bg-birch-raised p-4">
          <h2 id="preview-title" className="text-lg font-bold">
            {chosen ? `${chosen.name} household` : 'This lot'}
          </h2>
          <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-base" data-testid="lot-preview">
            <dt className="text-slate-muted">Sugar</dt>
            <dd className="num text-right font-semibold" data-testid="preview-sugar">{preview.sugar === null ? '—' : mass(preview.sugar, units)}</dd>
            <dt className="text-slate-muted">Syrup it should make</dt>
            <dd className="num text-right font-semibold" data-testid="preview-syrup">{preview.syrup === null ? '—' : vol(preview.syrup, units, 2)}</dd>
            <dt className="text-slate-muted">Boil time{evaporator ? ` (${evaporator.name})` : ''}</dt>
            <dd className="num text-right font-semibold" data-testid="preview-hours">{preview.hours === null ? '—' : `${preview.hours.toFixed(1)} h`}</dd>
            <dt className="text-slate-muted">Boil by</dt>
            <dd className="num text-right font-semibold" data-testid="preview-deadline">{preview.rec ? formatWhen(preview.rec.deadline.toISOString(), timeZone) : '—'}</dd>
          </dl>
          <p className="mt-3 text-sm text-slate-muted">Syrup at {syrupBrix} °Bx by a sugar balance, before losses.</p>
        </section>

        <section aria-labelledby="decision-title" className="flex flex-col gap-3 rounded-xl border border-birch-line bg-birch-raised p-4">
          <h2 id="decision-title" className="text-lg font-bold">
            Decision
          </h2>
          <p data-testid="recommendation" className={cn('rounded-lg px-3 py-2 font-semibold', ruleDecision === 'reject' ? 'bg-ember-soft text-ember-strong' : 'bg-spruce-soft text-spruce-strong')}>
            {ruleDecision === 'reject' ? `Recommended: reject. ${ruleText.replace(/^Rejected: /, '')}` : 'Recommended: accept.'}
          </p>
          <fieldset className="flex gap-2">
            <legend className="sr-only">Accept or reject this lot</legend>
            {(['accept', 'reject'] as const).map((d) => (
              <label key={d} className={cn(chip, 'flex-1')}>
                <input
                  type="radio"
                  name="decision-choice"
                  value={d}
                  className="sr-only"
                  checked={decision === d}
                  onChange={() => setValue('decision', d === ruleDecision ? '' : d, { shouldDirty: true })}
                />
                {d === 'accept' ? 'Accept' : 'Reject'}
              </label>
            ))}
          </fieldset>
          {needsReason ? (
            <Field
              label={against ? (decision === 'accept' ? 'Why accept against the recommendation?' : 'Why reject against the recommendation?') : 'Reason for rejecting'}
              htmlFor="lot-reason"
              error={errors.reason?.message}
              hint={!against && ruleText ? `Leave empty to keep: “${ruleText}”` : 'Kept on record; the household is told when the lot is rejected.'}
            >
              <Textarea {...fieldA11y('lot-reason', errors.reason?.message, true)} rows={2} {...register('reason')} />
            </Field>
          ) : null}
          <Button type="submit" size="lg" variant={decision === 'reject' ? 'danger' : 'primary'} loading={formState.isSubmitting} disabled={uploading || !seasonLabel}>
            {decision === 'reject' ? 'Reject and log lot' : 'Accept and log lot'}
          </Button>
        </section>
      </aside>
    </form>
  );
}
