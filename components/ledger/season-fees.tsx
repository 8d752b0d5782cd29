'use client';

import { useState, type FormEvent } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { Field, Input, fieldA11y } from '@/components/ui/input';
import { Alert } from '@/components/ui/alert';
import { ApiClientError, apiSend } from '@/lib/client/api';

export interface SeasonFeesProps {
  seasonId: string;
  currency: string;
  households: { householdId: string; name: string; feeCents: number }[];
}

/** Whole or decimal amount in the currency's main unit → whole cents, or null if it is not one. */
export function parseAmount(text: string): number | null {
  const t = text.trim().replace(/^\$/, '');
  if (!/^\d{1,7}(\.\d{1,2})?$/.test(t)) return null;
  const [whole, frac = ''] = t.split('.');
  return Number(whole) * 100 + Number(frac.padEnd(2, '0'));
}

/**
 * The season fee of each household (coordinator; zero allowed): a share of the co-op's fixed
 * costs that the statement adds to the fuel share. Fees can change until the season is settled.
 */
export function SeasonFees({ seasonId, currency, households }: SeasonFeesProps) {
  const router = useRouter();
  const [householdId, setHouseholdId] = useState(households[0]?.householdId ?? '');
  const current = households.find((h) => h.householdId === householdId);
  const [amount, setAmount] = useState(current ? (current.feeCents / 100).toFixed(2) : '0.00');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  function choose(id: string) {
    setHouseholdId(id);
    const h = households.find((x) => x.householdId === id);
    setAmount(h ? (h.feeCents / 100).toFixed(2) : '0.00');
    setFields({});
    setSaved(null);
  }

  async function submit(e: FormEvent) {
    e.preventDefault();
    setError(null);
    setSaved(null);
    const feeCents = parseAmount(amount);
    if (feeCents === null) {
      setFields({ feeCents: `Give the fee as an amount in ${currency}, such as 25 or 25.50.` });
      return;
    }
    setFields({});
    setBusy(true);
    try {
      await apiSend('PUT', `/api/seasons/${seasonId}/fees`, { householdId, feeCents });
      setSaved(`The ${households.find((h) => h.householdId === householdId)?.name ?? ''} household’s fee is saved.`);
      router.refresh();
    } catch (err) {
      if (err instanceof ApiClientError) {
        setFields(err.fields);
        if (!Object.keys(err.fields).length) setError(err.message);
      } else setError('Could not reach Brixhouse. Try again in a moment.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Season fees" className="flex flex-col gap-3">
      <p className="text-slate-muted">A fixed fee per household for the season (co-op dues, the sugarhouse’s upkeep); it may be zero. It is added to the fuel share on the statement.</p>
      {error ? <Alert tone="danger">{error}</Alert> : null}
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Household" htmlFor="fee-household" error={fields.householdId}>
          <select
            {...fieldA11y('fee-household', fields.householdId)}
            className="min-h-touch rounded-lg border border-birch-edge bg-birch-raised px-3"
            value={householdId}
            onChange={(e) => choose(e.target.value)}
          >
            {households.map((h) => (
              <option key={h.householdId} value={h.householdId}>
                {h.name}
              </option>
            ))}
          </select>
        </Field>
        <Field label={`Fee (${currency})`} htmlFor="fee-amount" error={fields.feeCents}>
          <Input {...fieldA11y('fee-amount', fields.feeCents)} inputMode="decimal" className="w-36" value={amount} onChange={(e) => setAmount(e.target.value)} />
        </Field>
        <Button type="submit" loading={busy}>
          Save fee
        </Button>
      </div>
      {saved ? (
        <p aria-live="polite" className="font-semibold text-spruce-strong">
          {saved}
        </p>
      ) : null}
    </form>
  );
}
