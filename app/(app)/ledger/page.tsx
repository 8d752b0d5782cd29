import type { Metadata } from 'next';
import Link from 'next/link';
import { requireContext } from '@/lib/server/context';
import { listSeasons } from '@/lib/coop/service';
import { getLedger } from '@/lib/ledger/service';
import { formatShare, formatSyrup, formatSyrupClasses } from '@/lib/ledger/format';
import { KG_PER_POUND } from '@/lib/sugar';
import { formatMoney } from '@/lib/format/units';
import { showBrix, showMass, showVolume } from '@/lib/figures';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { Badge } from '@/components/ui/badge';
import { buttonVariants } from '@/components/ui/button';
import { SeasonActions } from '@/components/ledger/season-actions';
import { SeasonFees } from '@/components/ledger/season-fees';
import { SugarChartLazy } from '@/components/ledger/sugar-chart-lazy';
import { RunSplits } from '@/components/ledger/run-splits';

export const metadata: Metadata = { title: 'Season ledger' };

export default async function LedgerPage({ searchParams }: { searchParams: Promise<{ season?: string }> }) {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  const { season: wanted } = await searchParams;
  const seasons = await listSeasons(ctx);
  const season = seasons.find((s) => s.id === wanted) ?? seasons.find((s) => s.status === 'open') ?? seasons[0];
  if (!season) return <p>No season yet.</p>;
  const ledger = await getLedger(ctx, season.id);
  const u = ledger.unitSystem;
  const money = (c: number) => formatMoney(c, ledger.currency);
  const t = ledger.totals;
  const isMember = user.role === 'member';
  const nameOf = new Map(ledger.householdNames.map((h) => [h.householdId, h.name]));
  const statementOf = new Map(ledger.statements.map((s) => [s.householdId, s.id]));

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-3xl font-bold">Season ledger</h1>
          <p className="text-slate-muted">
            {ledger.season.label}, {ledger.season.startsOn} to {ledger.season.endsOn}{' '}
            <Badge variant={ledger.season.status === 'open' ? 'spruce' : 'neutral'}>{ledger.season.status}</Badge>
          </p>
        </div>
        <nav aria-label="Seasons" className="flex flex-wrap gap-2">
          {seasons.map((s) => (
            <Link key={s.id} href={`/ledger?season=${s.id}`} aria-current={s.id === season.id ? 'page' : undefined} className={buttonVariants({ variant: s.id === season.id ? 'primary' : 'secondary', size: 'sm' })}>
              {s.label}
            </Link>
          ))}
        </nav>
      </div>

      <p className="max-w-3xl">
        Syrup and the fuel bill are split by the <strong>sugar</strong> each household’s sap put into each boil, not by litres: a
        litre of 3 °Bx sap holds twice the sugar of a litre at 1.5 °Bx, so it earns twice the syrup and pays twice the fuel. The
        split by raw volume is shown beside it for comparison.
      </p>

      <section aria-labelledby="by-sugar">
        <h2 id="by-sugar" className="mb-2 text-xl font-bold">By sugar{isMember ? ': your household' : ''}</h2>
        <Table label="Ledger by sugar" stack>
          <THead>
            <TR>
              <TH>Household</TH>
              <TH numeric>Sap delivered</TH>
              <TH numeric>Rejected</TH>
              <TH numeric>Mean °Brix</TH>
              <TH numeric>Sugar</TH>
              <TH numeric>Share</TH>
              <TH numeric>Syrup</TH>
              <TH>By colour class</TH>
              <TH numeric>Fuel</TH>
              <TH numeric>Fee</TH>
              <TH numeric>Due</TH>
              <TH numeric>Paid</TH>
              <TH numeric>Balance</TH>
            </TR>
          </THead>
          <TBody>
            {ledger.households.map((h) => (
              <TR key={h.householdId} data-testid={`ledger-row-${h.name}`}>
                <TH scope="row">
                  {statementOf.has(h.householdId) ? <Link href={`/statements/${statementOf.get(h.householdId)}`}>{h.name}</Link> : h.name}
                </TH>
                <TD label="Sap delivered" numeric>{showVolume(h.sapL, u)}</TD>
                <TD label="Rejected" numeric>{showVolume(h.rejectedL, u)}</TD>
                <TD label="Mean °Brix" numeric>{h.meanBrix === null ? '—' : showBrix(h.meanBrix)}</TD>
                <TD label="Sugar" numeric>{showMass(h.sugarKg, u)}</TD>
                <TD label="Share" numeric>{formatShare(h.share)}</TD>
                <TD label="Syrup" numeric>{formatSyrup(h.syrupMl, u)}</TD>
                <TD label="By colour class" className="stack-wide min-w-56">{formatSyrupClasses(h.syrupByClassMl, u)}</TD>
                <TD label="Fuel" numeric>{money(h.fuelCents)}</TD>
                <TD label="Fee" numeric>{money(h.feeCents)}</TD>
                <TD label="Due" numeric>{money(h.dueCents)}</TD>
                <TD label="Paid" numeric>{money(h.paidCents)}</TD>
                <TD label="Balance" numeric className={h.balanceCents > 0 ? 'font-semibold text-ember' : undefined}>
                  {money(h.balanceCents)}
                  {h.balanceCents > 0 && ledger.season.status === 'settled' ? ' owing' : ''}
                </TD>
              </TR>
            ))}
            <TR className="bg-birch font-semibold">
              <TH scope="row">Co-op total</TH>
              <TD label="Sap delivered" numeric>{showVolume(t.sapL, u)}</TD>
              <TD label="Rejected" numeric>{showVolume(t.rejectedL, u)}</TD>
              <TD label="Mean °Brix" numeric>{t.meanBrix === null ? '—' : showBrix(t.meanBrix)}</TD>
              <TD label="Sugar" numeric>{showMass(t.sugarKg, u)}</TD>
              <TD label="Share" numeric>100.0 %</TD>
              <TD label="Syrup" numeric>{formatSyrup(t.syrupMl, u)}</TD>
              <TD label="By colour class" className="stack-wide">{formatSyrupClasses(t.syrupByClassMl, u)}</TD>
              <TD label="Fuel" numeric>{money(t.fuelCents)}</TD>
              <TD label="Fee" numeric>{isMember ? '—' : money(t.feeCents)}</TD>
              <TD label="Due" numeric>{isMember ? '—' : money(t.dueCents)}</TD>
              <TD label="Paid" numeric>{isMember ? '—' : money(t.paidCents)}</TD>
              <TD label="Balance" numeric>{isMember ? '—' : money(t.balanceCents)}</TD>
            </TR>
          </TBody>
        </Table>
      </section>

      <section aria-labelledby="by-volume">
        <h2 id="by-volume" className="mb-2 text-xl font-bold">By volume, for comparison</h2>
        <Table label="The same runs split by volume" stack>
          <THead>
            <TR>
              <TH>Household</TH>
              <TH numeric>Sap boiled</TH>
              <TH numeric>Share by volume</TH>
              <TH numeric>Syrup by volume</TH>
              <TH numeric>Fuel by volume</TH>
              <TH numeric>Syrup by sugar</TH>
              <TH numeric>Difference</TH>
            </TR>
          </THead>
          <TBody>
            {ledger.households.map((h) => (
              <TR key={h.householdId} data-testid={`volume-row-${h.name}`}>
                <TH scope="row">{h.name}</TH>
                <TD label="Sap boiled" numeric>{showVolume(h.boiledL, u)}</TD>
                <TD label="Share by volume" numeric>{formatShare(h.byVolume.share)}</TD>
                <TD label="Syrup by volume" numeric>{formatSyrup(h.byVolume.syrupMl, u)}</TD>
                <TD label="Fuel by volume" numeric>{money(h.byVolume.fuelCents)}</TD>
                <TD label="Syrup by sugar" numeric>{formatSyrup(h.syrupMl, u)}</TD>
                <TD label="Difference" numeric>
                  {h.syrupMl >= h.byVolume.syrupMl ? '+' : '−'}
                  {formatSyrup(Math.abs(h.syrupMl - h.byVolume.syrupMl), u)}
                </TD>
              </TR>
            ))}
          </TBody>
        </Table>
      </section>

      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <CardHeader>
            <CardTitle>Sugar delivered by week</CardTitle>
          </CardHeader>
          <CardBody>
            <SugarChartLazy
              weeks={ledger.weeks}
              households={ledger.households.map((h) => ({ householdId: h.householdId, name: h.name }))}
              factor={u === 'us' ? 1 / KG_PER_POUND : 1}
              unit={u === 'us' ? 'lb' : 'kg'}
            />
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>Files and actions</CardTitle>
          </CardHeader>
          <CardBody>
            <div className="flex flex-wrap gap-2">
              <a className={buttonVariants({ variant: 'secondary' })} href={`/api/seasons/${ledger.seasonId}/ledger?format=csv`} download>
                Download CSV
              </a>
              <a className={buttonVariants({ variant: 'secondary' })} href={`/api/seasons/${ledger.seasonId}/ledger?format=pdf`} download>
                Download PDF
              </a>
            </div>
            {user.role === 'coordinator' && <SeasonActions seasonId={ledger.seasonId} status={ledger.season.status} />}
            {user.role === 'coordinator' && ledger.season.status !== 'settled' && (
              <div className="mt-4 flex flex-col gap-2 border-t border-birch-line pt-4">
                <h3 className="font-semibold">Season fees</h3>
                <SeasonFees
                  seasonId={ledger.seasonId}
                  currency={ledger.currency}
                  households={ledger.households.map((h) => ({ householdId: h.householdId, name: h.name, feeCents: h.feeCents }))}
                />
              </div>
            )}
            {isMember && (
              <p className="text-sm text-slate-muted">
                Other households: {ledger.householdNames.filter((h) => h.householdId !== user.householdId).map((h) => h.name).join(', ')}.
              </p>
            )}
          </CardBody>
        </Card>
      </div>

      <section aria-labelledby="runs">
        <h2 id="runs" className="mb-2 text-xl font-bold">{isMember ? 'Your share of each run' : 'Each run’s allocation'}</h2>
        {ledger.runs.length === 0 ? (
          <p className="text-slate-muted">No finished runs in this season yet.</p>
        ) : (
          <RunSplits seasonId={season.id} runs={ledger.runs} names={Object.fromEntries(nameOf)} unitSystem={u} currency={ledger.currency} />
        )}
      </section>
    </div>
  );
}
