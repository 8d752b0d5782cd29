'use client';

import { clock, duration, STATE_LABEL } from '@/components/queue/format';
import { useLiveQueue } from '@/components/queue/use-live-queue';
import type { QueueSnapshot } from '@/lib/queue/types';
import { GRADE_CLASS_INFO, type UnitSystem } from '@/lib/sugar';
import { formatBrix } from '@/lib/format/units';
import { cn } from '@/lib/utils';
import { showSyrup, showVolume } from '@/lib/figures';

interface DisplayBoardProps {
  token: string;
  initial: QueueSnapshot;
  coopName: string;
  unitSystem: UnitSystem;
  timeZone: string;
}

/** Full-screen, high-contrast view of the queue for a screen across the sugarhouse. */
export function DisplayBoard({ token, initial, coopName, unitSystem, timeZone }: DisplayBoardProps) {
  const { snapshot, status } = useLiveQueue(initial, { displayToken: token });
  const { run, lots, totals } = snapshot;
  const last = run?.draws.at(-1);
  return (
    <main className="flex min-h-dvh flex-col gap-6 p-6 lg:p-10" data-testid="display-board" data-version={snapshot.version}>
      <header className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-3xl font-bold lg:text-5xl">{coopName}</h1>
        <p className="text-xl lg:text-3xl" role="status">
          <span className={cn('mr-2 inline-block size-4 rounded-full', status === 'live' ? 'bg-spruce-glow' : 'bg-ember-glow')} aria-hidden="true" />
          {status === 'live' ? 'Live' : 'Reconnecting…'} · {clock(snapshot.computedAt, timeZone)}
        </p>
      </header>

      <section aria-labelledby="display-run" className="rounded-2xl border-2 border-ember-glow bg-night-raised p-6">
        <h2 id="display-run" className="text-2xl font-bold text-ember-glow lg:text-4xl">
          {run ? `Boiling now: run ${run.lotCode}` : 'Nothing is boiling right now'}
        </h2>
        {run ? (
          <dl className="mt-4 grid grid-cols-2 gap-4 lg:grid-cols-4">
            <Big label="Syrup drawn" value={showSyrup(run.syrupDrawnL, unitSystem)} testId="display-run-syrup" />
            <Big label="Expected from the sap in" value={showSyrup(run.syrupExpectedL, unitSystem)} />
            <Big label="Sap to boil" value={duration(run.hoursLeft)} />
            <Big
              label="Last draw-off"
              value={last ? `${formatBrix(last.brix)} ${last.gradeClass ? GRADE_CLASS_INFO[last.gradeClass].name.replace(' Color', '') : ''}` : '—'}
            />
          </dl>
        ) : null}
      </section>

      <dl className="grid grid-cols-2 gap-4 lg:grid-cols-4">
        <Big label="Syrup drawn today" value={showSyrup(totals.syrupDrawnTodayL, unitSystem)} testId="display-today" />
        <Big label="Sap waiting" value={showVolume(totals.litresWaiting, unitSystem)} />
        <Big label="Boiling needed" value={duration(totals.hoursNeeded)} />
        <Big label="Booked ahead" value={duration(totals.hoursBookedAhead)} />
      </dl>

      {totals.atRisk > 0 ? (
        <p role="alert" className="rounded-2xl bg-ember-glow p-4 text-2xl font-bold text-night lg:text-3xl">
          Warning: {totals.atRisk} {totals.atRisk === 1 ? 'lot' : 'lots'} will spoil before their turn.
        </p>
      ) : null}

      <section aria-labelledby="display-next" className="flex-1">
        <h2 id="display-next" className="text-2xl font-bold lg:text-4xl">
          Next to boil
        </h2>
        {lots.length === 0 ? <p className="mt-3 text-2xl text-night-muted">No sap is waiting.</p> : null}
        <ol className="mt-3 flex flex-col gap-2">
          {lots.slice(0, 6).map((l, i) => (
            <li
              key={l.deliveryId}
              data-testid="display-lot"
              className={cn('grid grid-cols-[3rem_1fr_auto] items-baseline gap-4 rounded-xl bg-night-raised p-4 text-xl lg:text-3xl', l.spoilsBeforeTurn && 'border-2 border-ember-glow')}
            >
              <span className="font-bold text-night-muted">{i + 1}</span>
              <span>
                <span className="font-bold">{l.householdName}</span> {showVolume(l.litresLeft, unitSystem)} · {formatBrix(l.brix)}
                <span className={cn('block text-lg lg:text-2xl', l.state === 'urgent' || l.state === 'expired' ? 'text-ember-glow' : 'text-night-muted')}>
                  {STATE_LABEL[l.state]}
                  {l.spoilsBeforeTurn ? ' · spoils before its turn' : ''} · deadline {clock(l.deadline, timeZone)}
                </span>
              </span>
              <span className="text-night-muted">{clock(l.etaStart, timeZone, false)}</span>
            </li>
          ))}
        </ol>
      </section>

      <footer className="text-lg text-night-muted lg:text-2xl">
        Caution: boiling syrup burns · never leave the fire unattended · ventilate against carbon monoxide · local codes come first.
      </footer>
    </main>
  );
}

function Big({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="rounded-xl bg-night-raised p-4">
      <dt className="text-lg text-night-muted lg:text-2xl">{label}</dt>
      <dd className="text-3xl font-bold lg:text-5xl" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}
