'use client';

import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { GRADE_CLASS_INFO, type UnitSystem } from '@/lib/sugar';
import { formatBrix } from '@/lib/format/units';
import type { QueueRun, QueueSnapshot } from '@/lib/queue/types';
import { cn } from '@/lib/utils';
import { clock, duration, STATE_BADGE, STATE_LABEL } from './format';
import { useLiveQueue, type LiveStatus } from './use-live-queue';
import { showSyrup, showVolume } from '@/lib/figures';

interface QueueBoardProps {
  initial: QueueSnapshot;
  unitSystem: UnitSystem;
  timeZone: string;
  /** The signed-in member's household, whose lots are marked. */
  ownHouseholdId: string | null;
}

const STATUS_TEXT: Record<LiveStatus, string> = { live: 'Live', connecting: 'Reconnecting…', offline: 'Offline: showing the last queue received' };

export function LiveStatusPill({ status }: { status: LiveStatus }) {
  return (
    <span role="status" data-testid="live-status" data-status={status} className="inline-flex items-center gap-2 text-sm font-semibold">
      <span aria-hidden="true" className={cn('size-2.5 rounded-full', status === 'live' ? 'bg-spruce' : 'bg-ember')} />
      {STATUS_TEXT[status]}
    </span>
  );
}

export function RunNow({ run, unitSystem, timeZone }: { run: QueueRun | null; unitSystem: UnitSystem; timeZone: string }) {
  if (!run) {
    return (
      <Card data-testid="run-now">
        <CardBody className="pt-5">
          <p className="text-lg font-semibold">Nothing is boiling right now.</p>
        </CardBody>
      </Card>
    );
  }
  const last = run.draws.at(-1);
  return (
    <Card data-testid="run-now" className="border-ember">
      <CardHeader>
        <CardTitle>
          Boiling now: run {run.lotCode} <span className="font-normal text-slate-muted">on {run.evaporatorName}</span>
        </CardTitle>
      </CardHeader>
      <CardBody>
        <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <Stat label="Started" value={clock(run.startedAt, timeZone)} />
          <Stat label="Sap taken in" value={showVolume(run.inputL, unitSystem)} />
          <Stat label="Syrup drawn" value={`${showSyrup(run.syrupDrawnL, unitSystem)} of ${showSyrup(run.syrupExpectedL, unitSystem)}`} testId="run-syrup" />
          <Stat label="Left to boil" value={duration(run.hoursLeft)} />
        </dl>
        {last ? (
          <p className="text-sm">
            Last draw-off {clock(last.drawnAt, timeZone, false)}: {showSyrup(last.litres, unitSystem)} at {formatBrix(last.brix)}{' '}
            {last.gradeClass ? <Badge variant={last.gradeClass}>{GRADE_CLASS_INFO[last.gradeClass].name}</Badge> : null}
          </p>
        ) : null}
      </CardBody>
    </Card>
  );
}

function Stat({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="rounded-lg bg-birch p-3">
      <dt className="text-sm text-slate-muted">{label}</dt>
      <dd className="text-lg font-bold" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

/** The Boil queue page's live body: the run on the evaporator, totals, warnings and the lots in boiling order. */
export function QueueBoard({ initial, unitSystem, timeZone, ownHouseholdId }: QueueBoardProps) {
  const { snapshot, status } = useLiveQueue(initial);
  const { lots, totals, run } = snapshot;
  const own = ownHouseholdId ? lots.filter((l) => l.householdId === ownHouseholdId).length : 0;
  return (
    <div className="flex flex-col gap-4" data-testid="queue-board" data-version={snapshot.version}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <LiveStatusPill status={status} />
        <span className="text-sm text-slate-muted">Updated {clock(snapshot.computedAt, timeZone)}</span>
      </div>
      <RunNow run={run} unitSystem={unitSystem} timeZone={timeZone} />
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <Stat label="Sap waiting" value={showVolume(totals.litresWaiting, unitSystem)} testId="total-waiting" />
        <Stat label="Evaporator hours needed" value={duration(totals.hoursNeeded)} />
        <Stat label="Booked ahead" value={duration(totals.hoursBookedAhead)} />
        <Stat label="Syrup drawn today" value={showSyrup(totals.syrupDrawnTodayL, unitSystem)} />
      </dl>
      {totals.atRisk > 0 ? (
        <Alert tone="warning" title={`${totals.atRisk} ${totals.atRisk === 1 ? 'lot' : 'lots'} will spoil before their turn`}>
          At the evaporator’s rate, the marked lots would finish boiling after their deadline. Book more boil time or boil them sooner.
        </Alert>
      ) : null}
      {ownHouseholdId ? (
        <p className="text-slate-muted" data-testid="own-summary">
          {own ? `${own} of your household’s lots ${own === 1 ? 'is' : 'are'} waiting; they are marked “Yours”.` : 'None of your household’s sap is waiting.'}
        </p>
      ) : null}
      {lots.length === 0 ? (
        <p className="rounded-lg border border-birch-line bg-birch-raised p-4">No sap is waiting: every accepted lot has been boiled.</p>
      ) : (
        <ol className="flex flex-col gap-2" aria-label="Lots in boiling order">
          {lots.map((l, i) => {
            const mine = l.householdId === ownHouseholdId;
            return (
              <li
                key={l.deliveryId}
                data-testid="queue-lot"
                data-delivery-id={l.deliveryId}
                className={cn(
                  'grid grid-cols-[2.5rem_1fr] gap-x-3 gap-y-1 rounded-lg border bg-birch-raised p-3 sm:grid-cols-[2.5rem_1fr_auto]',
                  mine ? 'border-spruce ring-1 ring-spruce' : 'border-birch-line',
                  l.spoilsBeforeTurn && 'border-ember',
                )}
              >
                <span className="row-span-2 text-2xl font-bold text-slate-muted" aria-label={`Number ${i + 1}`}>
                  {i + 1}
                </span>
                <div className="flex flex-wrap items-center gap-2">
                  <span className="font-semibold">{l.householdName}</span>
                  {mine ? <Badge variant="spruce">Yours</Badge> : null}
                  <Badge variant={STATE_BADGE[l.state]}>{STATE_LABEL[l.state]}</Badge>
                  {l.spoilsBeforeTurn ? <Badge variant="ember">Spoils before its turn</Badge> : null}
                </div>
                <div className="text-right font-semibold sm:row-span-2 sm:self-center">
                  {showVolume(l.litresLeft, unitSystem)} · {formatBrix(l.brix)}
                </div>
                <p className="col-start-2 text-sm text-slate-muted">
                  Boil {clock(l.etaStart, timeZone)}–{clock(l.etaEnd, timeZone, false)} ({duration(l.boilHours)}) · deadline {clock(l.deadline, timeZone)}
                </p>
              </li>
            );
          })}
        </ol>
      )}
    </div>
  );
}
