'use client';

import useSWR from 'swr';
import { Alert } from '@/components/ui/alert';
import { fetcher } from '@/lib/client/api';
import { type UnitSystem } from '@/lib/sugar/units';
import type { PlanningDto } from '@/lib/planning/types';
import { formatHours, formatMoment, hourCount } from './slot-time';
import { showVolume } from '@/lib/figures';

export const PLANNING_KEY = '/api/planning';

interface PlanningStripProps {
  timeZone: string;
  unitSystem: UnitSystem;
  /** The figures the page was rendered with on the server (no placeholder, nothing moves). */
  initialData?: PlanningDto;
}

/** How the booked evaporator time compares with the sap waiting to be boiled. */
export function PlanningStrip({ timeZone, unitSystem, initialData }: PlanningStripProps) {
  const { data, error } = useSWR<PlanningDto>(PLANNING_KEY, fetcher, { fallbackData: initialData });

  return (
    <section aria-labelledby="planning-heading" data-testid="planning-strip" className="flex flex-col gap-3">
      <h2 id="planning-heading" className="sr-only">
        Sap and evaporator time
      </h2>
      {error && !data ? (
        <p className="rounded-xl border border-birch-line bg-birch-raised px-4 py-3 text-slate-muted">
          The sap and booking figures could not be loaded just now; the calendar still works.
        </p>
      ) : !data ? (
        <div className="h-[4.5rem] rounded-xl border border-birch-line bg-birch-raised motion-safe:animate-pulse" aria-hidden="true" />
      ) : data.oldestDeadline === null || data.waitingL <= 0 ? (
        <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1 rounded-xl border border-birch-line bg-birch-raised px-4 py-3">
          <p className="text-lg font-bold">No sap waiting</p>
          <p className="text-slate-muted">
            {data.hoursBookedBeforeDeadline > 0
              ? `${formatHours(data.hoursBookedBeforeDeadline)} of evaporator time booked ahead.`
              : 'No evaporator time is booked ahead yet.'}
          </p>
        </div>
      ) : (
        <>
          <dl className="grid grid-cols-1 gap-px overflow-hidden rounded-xl border border-birch-line bg-birch-line sm:grid-cols-3">
            <Figure label="Sap waiting" value={showVolume(data.waitingL, unitSystem)} />
            <Figure label="Evaporator hours needed" value={formatHours(data.hoursNeeded)} />
            <Figure
              label={`Booked before ${formatMoment(data.oldestDeadline, timeZone)}`}
              value={formatHours(data.hoursBookedBeforeDeadline)}
            />
          </dl>
          {data.short ? (
            // Rounded up, so a small shortfall never reads as "0 more hours".
            <Alert
              tone="warning"
              title={`Book ${hourCount(Math.ceil(data.shortfallHours * 10) / 10)} more evaporator ${Math.ceil(data.shortfallHours * 10) === 10 ? 'hour' : 'hours'} before ${formatMoment(data.oldestDeadline, timeZone)} or sap will spoil.`}
            />
          ) : null}
        </>
      )}
    </section>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 bg-birch-raised px-4 py-2.5 sm:flex-col sm:justify-start sm:gap-0.5 sm:py-3">
      <dt className="text-sm font-semibold text-slate-muted">{label}</dt>
      <dd className="whitespace-nowrap text-lg font-bold sm:text-xl">{value}</dd>
    </div>
  );
}
