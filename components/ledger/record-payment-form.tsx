'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';

export interface RecordPaymentFormProps {
  statementId: string;
  balanceCents: number;
  currency: string;
}

/** A coordinator records a payment by cheque or cash (amount in the currency's main unit). */
export function RecordPaymentForm({ statementId, balanceCents, currency }: RecordPaymentFormProps) {
  const router = useRouter();
  const [amount, setAmount] = useState((balanceCents / 100).toFixed(2));
  const [method, setMethod] = useState<'cheque' | 'cash'>('cheque');
  const [reference, setReference] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    const res = await fetch(`/api/statements/${statementId}/payments`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ amountCents: Math.round(Number(amount) * 100), method, reference: reference || null }),
    });
    setBusy(false);
    if (!res.ok) {
      const body = await res.json().catch(() => null);
      setError(body?.error?.fields?.amountCents ?? body?.error?.message ?? 'That did not work.');
      return;
    }
    router.refresh();
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3 border-t border-birch-line pt-3">
      <h3 className="font-semibold">Record a cheque or cash payment</h3>
      <div className="flex flex-wrap gap-3">
        <label className="flex flex-col gap-1">
          <span>Amount ({currency})</span>
          <input className="min-h-touch rounded-lg border border-birch-edge px-3" inputMode="decimal" value={amount} onChange={(e) => setAmount(e.target.value)} aria-invalid={error ? true : undefined} aria-describedby={error ? 'payment-error' : undefined} />
        </label>
        <label className="flex flex-col gap-1">
          <span>Method</span>
          <select className="min-h-touch rounded-lg border border-birch-edge px-3" value={method} onChange={(e) => setMethod(e.target.value as 'cheque' | 'cash')}>
            <option value="cheque">Cheque</option>
            <option value="cash">Cash</option>
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span>Reference (optional)</span>
          <input className="min-h-touch rounded-lg border border-birch-edge px-3" value={reference} onChange={(e) => setReference(e.target.value)} />
        </label>
      </div>
      {error && (
        <p id="payment-error" className="text-ember" role="alert">
          {error}
        </p>
      )}
      <Button type="submit" variant="secondary" loading={busy} className="self-start">
        Record payment
      </Button>
    </form>
  );
}
