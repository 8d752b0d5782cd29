import type { Metadata } from 'next';
import Link from 'next/link';
import { requireContext } from '@/lib/server/context';
import { getCooperative, listEvaporators, listSeasons } from '@/lib/coop/service';
import { listUpcomingSlots } from '@/lib/slots/service';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { buttonVariants } from '@/components/ui/button';
import { formatSlotRange } from '@/lib/time';
import { showRate } from '@/lib/figures';
import { Alert } from '@/components/ui/alert';
import { TodayQueueCard } from '@/components/queue/today-queue-card';
import { TodayLedgerCard } from '@/components/ledger/today-ledger-card';
import { listDeliveries } from '@/lib/deliveries/service';
import { localDay } from '@/lib/time';
import { TodayLots, lotTotals } from '@/components/deliveries/today-lots';

export const metadata: Metadata = { title: 'Today' };

export default async function HomePage() {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  const [coop, seasons, evaporators, upcoming] = await Promise.all([
    getCooperative(ctx),
    listSeasons(ctx),
    listEvaporators(ctx),
    listUpcomingSlots(ctx, { householdId: user.role === 'member' ? user.householdId : null, limit: 5 }),
  ]);
  const open = seasons.find((s) => s.status === 'open');
  const member = user.role === 'member';
  const today = localDay(new Date(), coop.timeZone);
  // A member: its household's lots of the season; staff: today's lots of every household.
  const lots = await listDeliveries(
    ctx,
    member ? (open ? { seasonId: open.id } : {}) : { from: today, to: today },
  );
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Today at {coop.name}</h1>
        <p className="text-slate-muted">
          {open ? `${open.label} is open: ${open.startsOn} to ${open.endsOn}.` : 'No season is open right now.'}
        </p>
      </div>
      <div className="grid gap-6 md:grid-cols-2">
        <TodayQueueCard cooperativeId={ctx.cooperativeId} householdId={user.role === 'member' ? user.householdId : null} unitSystem={coop.unitSystem} timeZone={coop.timeZone} />
        <Card>
          <CardHeader>
            <CardTitle>{user.role === 'member' ? 'Your next boil slots' : 'Next boil slots'}</CardTitle>
          </CardHeader>
          <CardBody className="flex flex-col gap-3">
            {upcoming.length === 0 ? (
              <p className="text-slate-muted">Nothing booked yet.</p>
            ) : (
              <ul className="flex flex-col gap-2">
                {upcoming.map((s) => (
                  <li key={s.id} className="rounded-lg border border-birch-line p-3">
                    <span className="font-semibold">{s.householdName}</span>
                    <span className="block text-slate-muted">{formatSlotRange(s.startsAt, s.endsAt, coop.timeZone)}</span>
                  </li>
                ))}
              </ul>
            )}
            <Link href="/calendar" className={buttonVariants({ variant: 'primary' })}>
              Open the Boil calendar
            </Link>
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>The sugarhouse</CardTitle>
          </CardHeader>
          <CardBody>
            <ul className="flex flex-col gap-1">
              {evaporators.map((e) => (
                <li key={e.id}>
                  {e.name}: boils off {showRate(e.evaporationLph, coop.unitSystem)} of water, {e.fuelKind}-fired
                </li>
              ))}
            </ul>
          </CardBody>
        </Card>
      </div>
      {user.role === 'member' && (
        <TodayLedgerCard
          ctx={ctx}
          openSeasonId={open?.id ?? null}
          settledSeasonId={seasons.find((s) => s.status === 'settled')?.id ?? null}
        />
      )}
      <TodayLots
        title={member ? 'Your latest drop-offs' : 'Today’s drop-offs'}
        lots={member ? lots.slice(0, 5) : lots}
        units={coop.unitSystem}
        timeZone={coop.timeZone}
        showHousehold={!member}
        empty={member ? 'No sap logged for your household this season yet.' : 'No sap has been logged today yet.'}
        totalsLabel={member ? (open ? `${open.label} so far` : 'All seasons') : 'Today'}
        totals={lotTotals(lots)}
        linkLabel={member ? 'All our drop-offs' : 'Open the Drop-off desk'}
      />
      <Alert tone="warning" title="Before you crew a boil">
        Boiling sap and syrup burn; never leave a firing evaporator unattended; keep the sugarhouse ventilated against carbon
        monoxide. Follow local fire codes and the co-op’s sugarmakers.
      </Alert>
    </div>
  );
}
