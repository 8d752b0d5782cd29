import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requireContext } from '@/lib/server/context';
import { getStatement } from '@/lib/ledger/service';
import { statementLines } from '@/lib/ledger/format';
import { formatMoney } from '@/lib/format/units';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { buttonVariants } from '@/components/ui/button';
import { RecordPaymentForm } from '@/components/ledger/record-payment-form';
import type { Statement } from '@/lib/ledger/types';

export const metadata: Metadata = { title: 'Statement' };

export default async function StatementPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ paid?: string }> }) {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  const { id } = await params;
  const { paid: justPaid } = await searchParams;
  let s: Statement;
  try {
    s = await getStatement(ctx, id);
  } catch {
    notFound();
  }
  const money = (c: number) => formatMoney(c, s.currency);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">{s.seasonLabel} statement</h1>
        <p className="text-slate-muted">
          {s.householdName} household · settled {s.settledAt.slice(0, 10)}{' '}
          <Badge data-testid="statement-status" variant={s.paid ? 'spruce' : 'ember'}>
            {s.paid ? 'Paid' : `${money(s.balanceCents)} to pay`}
          </Badge>
        </p>
      </div>
      {justPaid && !s.paid && (
        <Alert tone="info" title="Payment on its way">
          The payment service is confirming your payment; reload in a moment.
        </Alert>
      )}
      <Card>
        <CardHeader>
          <CardTitle>Figures</CardTitle>
        </CardHeader>
        <CardBody>
          <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-2">
            {statementLines(s).map((l) => (
              <div key={l.label} className="contents">
                <dt className={l.strong ? 'font-bold' : undefined}>{l.label}</dt>
                <dd className={`num text-right ${l.strong ? 'font-bold' : ''}`}>{l.value}</dd>
              </div>
            ))}
          </dl>
          <div className="flex flex-wrap gap-2 pt-2">
            {s.balanceCents > 0 && (user.role !== 'member' || user.householdId === s.householdId) && (
              <a href={`/statements/${s.id}/pay`} className={buttonVariants({ variant: 'primary' })}>
                Pay {money(s.balanceCents)}
              </a>
            )}
            <a href={`/api/statements/${s.id}.pdf`} className={buttonVariants({ variant: 'secondary' })}>
              Download PDF
            </a>
            <Link href={`/ledger?season=${s.seasonId}`} className={buttonVariants({ variant: 'ghost' })}>
              Season ledger
            </Link>
          </div>
        </CardBody>
      </Card>
      <Card>
        <CardHeader>
          <CardTitle>Payments</CardTitle>
        </CardHeader>
        <CardBody>
          {s.payments.length === 0 ? (
            <p className="text-slate-muted">No payment yet.</p>
          ) : (
            <ul className="flex flex-col gap-1">
              {s.payments.map((p) => (
                <li key={p.id}>
                  {p.paidAt.slice(0, 10)}: {money(p.amountCents)} by {p.method}
                  {p.reference ? ` (${p.reference})` : ''}
                </li>
              ))}
            </ul>
          )}
          {user.role === 'coordinator' && s.balanceCents > 0 && <RecordPaymentForm statementId={s.id} balanceCents={s.balanceCents} currency={s.currency} />}
        </CardBody>
      </Card>
    </div>
  );
}
