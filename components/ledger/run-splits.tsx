'use client';

import { useState } from 'react';
import type { UnitSystem } from '@/lib/sugar';
import type { LedgerRun, LedgerRunSummary } from '@/lib/ledger/types';
import { formatShare, formatSyrup } from '@/lib/ledger/format';
import { formatMoney } from '@/lib/format/units';
import { showMass, showVolume } from '@/lib/figures';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';

export interface RunSplitsProps {
  seasonId: string;
  runs: LedgerRunSummary[];
  /** Household names by id. */
  names: Record<string, string>;
  unitSystem: UnitSystem;
  currency: string;
}

type Split = { state: 'loading' } | { state: 'failed'; message: string } | { state: 'ready'; run: LedgerRun };

/**
 * Each finished run of the season with its totals; a run's split between households is fetched
 * when it is opened (a season has hundreds of runs, and few are looked into).
 */
export function RunSplits({ seasonId, runs, names, unitSystem: u, currency }: RunSplitsProps) {
  const [splits, setSplits] = useState<Record<string, Split>>({});

  async function load(runId: string) {
    setSplits((s) => ({ ...s, [runId]: { state: 'loading' } }));
    try {
      const res = await fetch(`/api/seasons/${seasonId}/ledger/runs/${runId}`, { headers: { accept: 'application/json' } });
      const body = await res.json().catch(() => null);
      if (!res.ok) throw new Error(body?.error?.message ?? 'The run’s split could not be loaded.');
      setSplits((s) => ({ ...s, [runId]: { state: 'ready', run: body as LedgerRun } }));
    } catch (err) {
      const message = err instanceof Error && err.message !== 'Failed to fetch' ? err.message : 'The run’s split could not be loaded. Check the connection and open it again.';
      setSplits((s) => ({ ...s, [runId]: { state: 'failed', message } }));
    }
  }

  return (
    <ul className="flex flex-col gap-2">
      {runs.map((run) => {
        const split = splits[run.runId];
        return (
          <li key={run.runId}>
            <details
              className="rounded-lg border border-birch-line bg-birch-raised"
              onToggle={(e) => {
                if (e.currentTarget.open && (!split || split.state === 'failed')) void load(run.runId);
              }}
            >
              <summary className="flex min-h-touch cursor-pointer flex-wrap items-center gap-x-4 px-3 py-2">
                <span className="font-semibold">Run {run.lotCode}</span>
                <span className="text-slate-muted">{run.finishedAt?.slice(0, 10)}</span>
                <span>{formatSyrup(run.syrupMl, u)} syrup</span>
                <span>{formatMoney(run.fuelCents, currency)} fuel</span>
              </summary>
              <div className="px-3 pb-3" aria-live="polite" aria-busy={split?.state === 'loading'}>
                {!split || split.state === 'loading' ? (
                  <p className="text-sm text-slate-muted">Loading the split…</p>
                ) : split.state === 'failed' ? (
                  <p className="text-sm text-ember" role="alert">
                    {split.message}
                  </p>
                ) : (
                  <Table stack>
                    <THead>
                      <TR>
                        <TH>Household</TH>
                        <TH numeric>Sap in</TH>
                        <TH numeric>Sugar</TH>
                        <TH numeric>Share</TH>
                        <TH numeric>Syrup</TH>
                        <TH numeric>Fuel</TH>
                      </TR>
                    </THead>
                    <TBody>
                      {split.run.allocations.map((a) => (
                        <TR key={a.householdId}>
                          <TH scope="row">{names[a.householdId]}</TH>
                          <TD label="Sap in" numeric>
                            {showVolume(a.sapL, u)}
                          </TD>
                          <TD label="Sugar" numeric>
                            {showMass(a.sugarKg, u)}
                          </TD>
                          <TD label="Share" numeric>
                            {formatShare(a.share)}
                          </TD>
                          <TD label="Syrup" numeric>
                            {formatSyrup(a.syrupMl, u)}
                          </TD>
                          <TD label="Fuel" numeric>
                            {formatMoney(a.fuelCents, currency)}
                          </TD>
                        </TR>
                      ))}
                    </TBody>
                  </Table>
                )}
              </div>
            </details>
          </li>
        );
      })}
    </ul>
  );
}
