import Link from 'next/link';
import { getLedger, getStatement, statementIdFor } from '@/lib/ledger/service';
import type { PersonCtx } from '@/lib/server/context';
import { formatShare, formatSyrup } from '@/lib/ledger/format';
import { formatMoney } from '@/lib/format/units';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { buttonVariants } from '@/components/ui/button';
import { showMass } from '@/lib/figures';

export interface TodayLedgerCardProps {
  /** The signed-in member's request context. */
  ctx: PersonCtx;
  openSeasonId: string | null;
  /** The latest settled season, whose statement a member can open and pay. */
  settledSeasonId: string | null;
}

/** Today, for a member: the household's season so far, and its last statement with the pay link. */
export async function TodayLedgerCard({ ctx, openSeasonId, settledSeasonId }: TodayLedgerCardProps) {
  const [ledger, statementId] = await Promise.all([
    openSeasonId ? getLedger(ctx, openSeasonId) : Promise.resolve(null),
    settledSeasonId ? statementIdFor(ctx, settledSeasonId) : Promise.resolve(null),
  ]);
  const statement = statementId ? await getStatement(ctx, statementId) : null;
  const own = ledger?.households[0];
  const money = (c: number) => formatMoney(c, ledger?.currency ?? statement?.currency ?? 'USD');
  const u = ledger?.unitSystem ?? statement?.unitSystem ?? 'metric';
  return (
    <Card>
      <CardHeader>
        <CardTitle>Your season so far</CardTitle>
      </CardHeader>
      <CardBody>
        {own ? (
          <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-1" data-testid="today-ledger">
            <dt>Sugar delivered</dt>
            <dd className="num text-right">{showMass(own.sugarDeliveredKg, u)}</dd>
            <dt>Share of the co-op’s boiled sugar</dt>
            <dd className="num text-right">{formatShare(own.share)}</dd>
            <dt>Syrup earned to date</dt>
            <dd className="num text-right">{formatSyrup(own.syrupMl, u)}</dd>
            <dt>Fuel to date</dt>
            <dd className="num text-right">{money(own.fuelCents)}</dd>
          </dl>
        ) : (
          <p className="text-slate-muted">No season is open right now.</p>
        )}
        {statement && (
          <p>
            <Link href={`/statements/${statement.id}`}>{statement.seasonLabel} statement</Link>:{' '}
            {statement.paid ? 'paid, thank you.' : `${money(statement.balanceCents)} to pay.`}
          </p>
        )}
        <div className="flex flex-wrap gap-2">
          {statement && !statement.paid && (
            <a href={`/statements/${statement.id}/pay`} className={buttonVariants({ variant: 'primary' })}>
              Pay {money(statement.balanceCents)}
            </a>
          )}
          <Link href="/ledger" className={buttonVariants({ variant: 'secondary' })}>
            Open the Season ledger
          </Link>
        </div>
      </CardBody>
    </Card>
  );
}
