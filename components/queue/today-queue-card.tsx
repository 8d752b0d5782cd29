import Link from 'next/link';
import { buttonVariants } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { currentSnapshot } from '@/lib/queue/service';
import { type UnitSystem } from '@/lib/sugar';
import { clock, STATE_LABEL } from './format';
import { showSyrup, showVolume } from '@/lib/figures';

interface TodayQueueCardProps {
  cooperativeId: string;
  /** A member's household: its lots' places in the queue are listed. */
  householdId: string | null;
  unitSystem: UnitSystem;
  timeZone: string;
}

/** Today: the run now boiling and, for a member, where the household's lots stand in the Boil queue. */
export async function TodayQueueCard({ cooperativeId, householdId, unitSystem, timeZone }: TodayQueueCardProps) {
  const cached = await currentSnapshot(cooperativeId);
  if (!cached) return null;
  const { run, lots, totals } = cached.snapshot;
  const own = householdId ? lots.map((l, i) => ({ ...l, place: i + 1 })).filter((l) => l.householdId === householdId) : [];
  return (
    <Card data-testid="today-queue">
      <CardHeader>
        <CardTitle>On the evaporator</CardTitle>
      </CardHeader>
      <CardBody>
        <p>
          {run
            ? `Run ${run.lotCode} is boiling on ${run.evaporatorName}: ${showSyrup(run.syrupDrawnL, unitSystem)} of syrup drawn of ${showSyrup(run.syrupExpectedL, unitSystem)} expected.`
            : 'Nothing is boiling right now.'}
        </p>
        <p className="text-slate-muted">
          {totals.lots} lots ({showVolume(totals.litresWaiting, unitSystem)}) wait in the queue
          {totals.atRisk ? `; ${totals.atRisk} will spoil before their turn` : ''}.
        </p>
        {householdId ? (
          own.length ? (
            <ul className="flex flex-col gap-1" aria-label="Your lots in the queue">
              {own.map((l) => (
                <li key={l.deliveryId}>
                  <span className="font-semibold">No. {l.place}</span>: {showVolume(l.litresLeft, unitSystem)}, {STATE_LABEL[l.state].toLowerCase()}, boil
                  from about {clock(l.etaStart, timeZone)}
                </li>
              ))}
            </ul>
          ) : (
            <p>None of your household’s sap is waiting.</p>
          )
        ) : null}
        <Link href="/queue" className={buttonVariants({ variant: 'secondary' })}>
          Open the Boil queue
        </Link>
      </CardBody>
    </Card>
  );
}
