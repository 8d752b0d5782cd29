import { DateTime } from 'luxon';
import { allocate, allocateRun } from '@/lib/sugar/allocate';
import { sugarKg as sugarOf } from '@/lib/sugar/density';
import { GRADE_CLASSES, type GradeClass } from '@/lib/sugar/grade';
import type { LedgerHousehold, LedgerRun, LedgerRunSummary, LedgerWeek, SettlementHousehold, SettlementTotals, SyrupByClass, VolumeSplit } from './types';

/** Pure rules of the season ledger: no database, no framework. */

export const emptyByClass = (): SyrupByClass => ({ golden: 0, amber: 0, dark: 0, 'very-dark': 0 });
export const sumByClass = (s: SyrupByClass) => GRADE_CLASSES.reduce((t, c) => t + s[c], 0);

/** Syrup drawn off, recorded in litres, as whole millilitres. */
export const drawMl = (litres: number) => Math.round(litres * 1000);

export class AllocationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'AllocationError';
  }
}

export interface RunInputRow {
  householdId: string;
  /** Litres of the lot taken into the run. */
  litres: number;
  /** °Brix of the lot. */
  brix: number;
}

export interface RunDrawRow {
  litres: number;
  gradeClass: GradeClass;
}

/** One household's part of one run, as stored in an Allocation row. */
export interface RunAllocation {
  householdId: string;
  sapL: number;
  sugarKg: number;
  share: number;
  syrupByClassMl: SyrupByClass;
  syrupMl: number;
  fuelCents: number;
}

/**
 * Splits one finished run by sugar: each household's sugar is the sum over its inputs of
 * lib/sugar's sugarKg for the litres taken at the lot's °Brix; the syrup of each colour class
 * (whole mL) and the fuel cost (whole cents) are shared by largest remainder, so every total
 * is conserved exactly. Rows come in order of each household's first input.
 */
export function allocateRunRows(inputs: readonly RunInputRow[], draws: readonly RunDrawRow[], fuelCents: number): RunAllocation[] {
  const syrupTotals = emptyByClass();
  for (const d of draws) syrupTotals[d.gradeClass] += drawMl(d.litres);
  const weights = inputs.map((i) => ({ household: i.householdId, sugarKg: sugarOf(i.litres, i.brix) }));
  const hasSugar = weights.some((w) => w.sugarKg > 0);
  if (!hasSugar && (sumByClass(syrupTotals) > 0 || fuelCents > 0)) {
    throw new AllocationError('The run has syrup or fuel but no sap with sugar in it to share them over.');
  }
  const fuel = allocateRun(weights, { syrupMl: 0, fuelCents });
  const byClass = GRADE_CLASSES.map((c) => allocateRun(weights, { syrupMl: syrupTotals[c], fuelCents: 0 }));
  const litres = new Map<string, number>();
  for (const i of inputs) litres.set(i.householdId, (litres.get(i.householdId) ?? 0) + i.litres);
  return fuel.map((f, h) => {
    const syrupByClassMl = emptyByClass();
    GRADE_CLASSES.forEach((c, k) => (syrupByClassMl[c] = byClass[k][h].syrupMl));
    return {
      householdId: f.household,
      sapL: litres.get(f.household) ?? 0,
      sugarKg: f.sugarKg,
      share: f.share,
      syrupByClassMl,
      syrupMl: sumByClass(syrupByClassMl),
      fuelCents: f.fuelCents,
    };
  });
}

export interface DeliveryRow {
  householdId: string;
  volumeL: number;
  brix: number;
  status: 'accepted' | 'rejected';
  /** When the lot arrived; or `week` (its Monday, YYYY-MM-DD) when the query grouped by week. */
  receivedAt?: string | Date;
  week?: string;
}

/** An allocation row as stored (one run × one household). */
export interface AllocationRow extends RunAllocation {
  runId: string;
}

export interface RunRow {
  runId: string;
  lotCode: string | null;
  finishedAt: string | null;
}

export interface HouseholdRow {
  householdId: string;
  name: string;
}

export interface SettleInput {
  households: readonly HouseholdRow[];
  deliveries: readonly DeliveryRow[];
  allocations: readonly AllocationRow[];
  /** Season fee per household id (cents); missing means 0. */
  fees: ReadonlyMap<string, number> | Record<string, number>;
  /** Paid so far per household id (cents). */
  paid?: ReadonlyMap<string, number> | Record<string, number>;
}

const read = (m: ReadonlyMap<string, number> | Record<string, number> | undefined, k: string) =>
  m === undefined ? 0 : m instanceof Map ? (m.get(k) ?? 0) : ((m as Record<string, number>)[k] ?? 0);

/** Sums in ascending order, so the same numbers always give the same sum to the last bit. */
export const sumAscending = (xs: number[]) => [...xs].sort((a, b) => a - b).reduce((s, x) => s + x, 0);

/**
 * The same runs split by raw litres boiled instead of sugar, per run and summed, so a
 * household sees what a bucket-for-bucket split would have given it.
 */
export function splitByVolume(allocations: readonly AllocationRow[]): Map<string, VolumeSplit> {
  const runs = new Map<string, AllocationRow[]>();
  for (const a of allocations) {
    const list = runs.get(a.runId) ?? [];
    list.push(a);
    runs.set(a.runId, list);
  }
  const out = new Map<string, VolumeSplit>();
  let totalL = 0;
  const litres = new Map<string, number>();
  for (const rows of runs.values()) {
    const weights = rows.map((r) => ({ key: r.householdId, weight: r.sapL }));
    if (!weights.some((w) => w.weight > 0)) continue;
    const syrup = allocate(weights, rows.reduce((s, r) => s + r.syrupMl, 0));
    const fuel = allocate(weights, rows.reduce((s, r) => s + r.fuelCents, 0));
    rows.forEach((r, i) => {
      const v = out.get(r.householdId) ?? { share: 0, syrupMl: 0, fuelCents: 0 };
      v.syrupMl += syrup[i].amount;
      v.fuelCents += fuel[i].amount;
      out.set(r.householdId, v);
      litres.set(r.householdId, (litres.get(r.householdId) ?? 0) + r.sapL);
      totalL += r.sapL;
    });
  }
  for (const [h, v] of out) v.share = totalL > 0 ? (litres.get(h) ?? 0) / totalL : 0;
  return out;
}

/**
 * The season's figures per household from plain rows: sap delivered and rejected, mean °Brix,
 * sugar, share of the season's boiled sugar, syrup by colour class, fuel, fee, due, paid and
 * balance, with the split by volume beside it. Every household of the co-op gets a row.
 */
export function settle(input: SettleInput): { households: LedgerHousehold[]; totals: SettlementTotals } {
  const acc = new Map<
    string,
    { sapL: number; rejectedL: number; brixL: number; sugarDelivered: number[]; boiledL: number; sugar: number[]; syrup: SyrupByClass; fuel: number }
  >();
  const row = (h: string) => {
    let r = acc.get(h);
    if (!r) {
      r = { sapL: 0, rejectedL: 0, brixL: 0, sugarDelivered: [], boiledL: 0, sugar: [], syrup: emptyByClass(), fuel: 0 };
      acc.set(h, r);
    }
    return r;
  };
  for (const d of input.deliveries) {
    const r = row(d.householdId);
    if (d.status === 'accepted') {
      r.sapL += d.volumeL;
      r.brixL += d.brix * d.volumeL;
      r.sugarDelivered.push(sugarOf(d.volumeL, d.brix));
    } else {
      r.rejectedL += d.volumeL;
    }
  }
  for (const a of input.allocations) {
    const r = row(a.householdId);
    r.boiledL += a.sapL;
    r.sugar.push(a.sugarKg);
    for (const c of GRADE_CLASSES) r.syrup[c] += a.syrupByClassMl[c];
    r.fuel += a.fuelCents;
  }
  const sugarKg = new Map<string, number>();
  for (const [h, r] of acc) sugarKg.set(h, sumAscending(r.sugar));
  const totalSugar = sumAscending([...sugarKg.values()]);
  const volume = splitByVolume(input.allocations);

  const households: LedgerHousehold[] = input.households.map(({ householdId, name }) => {
    const r = acc.get(householdId) ?? row(householdId);
    const kg = sugarKg.get(householdId) ?? 0;
    const syrupMl = sumByClass(r.syrup);
    const feeCents = read(input.fees, householdId);
    const dueCents = r.fuel + feeCents;
    const paidCents = read(input.paid, householdId);
    return {
      householdId,
      name,
      sapL: r.sapL,
      rejectedL: r.rejectedL,
      meanBrix: r.sapL > 0 ? r.brixL / r.sapL : null,
      sugarDeliveredKg: sumAscending(r.sugarDelivered),
      boiledL: r.boiledL,
      sugarKg: kg,
      share: totalSugar > 0 ? kg / totalSugar : 0,
      syrupMl,
      syrupByClassMl: { ...r.syrup },
      fuelCents: r.fuel,
      feeCents,
      dueCents,
      paidCents,
      balanceCents: dueCents - paidCents,
      byVolume: volume.get(householdId) ?? { share: 0, syrupMl: 0, fuelCents: 0 },
    };
  });
  const totals: SettlementTotals = {
    sugarKg: totalSugar,
    syrupMl: input.allocations.reduce((s, a) => s + a.syrupMl, 0),
    fuelCents: input.allocations.reduce((s, a) => s + a.fuelCents, 0),
  };
  return { households, totals };
}

/** The co-op's mean °Brix: each household's mean weighted by the litres of accepted sap it delivered. */
export function coopMeanBrix(households: readonly Pick<LedgerHousehold, 'sapL' | 'meanBrix'>[]): number | null {
  let litres = 0;
  let brixL = 0;
  for (const h of households) {
    if (h.meanBrix === null || h.sapL <= 0) continue;
    litres += h.sapL;
    brixL += h.meanBrix * h.sapL;
  }
  return litres > 0 ? brixL / litres : null;
}

/** The contract's settlement row from a ledger row (figures rounded once, for the answer). */
export function settlementRow(h: SettlementHousehold): SettlementHousehold {
  return {
    householdId: h.householdId,
    name: h.name,
    sapL: round(h.sapL, 3),
    sugarKg: round(h.sugarKg, 4),
    share: round(h.share, 6),
    syrupMl: h.syrupMl,
    fuelCents: h.fuelCents,
    feeCents: h.feeCents,
    dueCents: h.dueCents,
  };
}

export function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

/** A run's totals from its allocations (sugar summed in ascending order, as everywhere). */
function runTotals(run: RunRow, rows: readonly AllocationRow[]) {
  return {
    runId: run.runId,
    lotCode: run.lotCode,
    finishedAt: run.finishedAt,
    syrupMl: rows.reduce((s, a) => s + a.syrupMl, 0),
    fuelCents: rows.reduce((s, a) => s + a.fuelCents, 0),
    sugarKg: sumAscending(rows.map((a) => a.sugarKg)),
  };
}

/** Each finished run with its totals and how many households' sap went into it, for the ledger's list. */
export function ledgerRuns(runs: readonly RunRow[], allocations: readonly AllocationRow[]): LedgerRunSummary[] {
  const byRun = new Map<string, AllocationRow[]>();
  for (const a of allocations) {
    const list = byRun.get(a.runId) ?? [];
    list.push(a);
    byRun.set(a.runId, list);
  }
  return runs.map((r) => {
    const rows = byRun.get(r.runId) ?? [];
    return { ...runTotals(r, rows), households: rows.length };
  });
}

/** One run with its split between households (the ledger's drill-down); `rows` are that run's allocations. */
export function ledgerRunSplit(run: RunRow, rows: readonly AllocationRow[]): LedgerRun {
  return {
    ...runTotals(run, rows),
    allocations: rows.map((a) => ({
      householdId: a.householdId,
      sapL: a.sapL,
      sugarKg: a.sugarKg,
      share: a.share,
      syrupMl: a.syrupMl,
      syrupByClassMl: a.syrupByClassMl,
      fuelCents: a.fuelCents,
    })),
  };
}

/** Sugar in accepted lots by week (weeks start on Monday in the co-op's time zone). */
export function sugarByWeek(deliveries: readonly DeliveryRow[], timeZone: string): LedgerWeek[] {
  const weeks = new Map<string, Record<string, number>>();
  for (const d of deliveries) {
    if (d.status !== 'accepted') continue;
    let week = d.week;
    if (!week) {
      if (d.receivedAt === undefined) continue;
      const at = d.receivedAt instanceof Date ? DateTime.fromJSDate(d.receivedAt) : DateTime.fromISO(d.receivedAt);
      week = at.setZone(timeZone).startOf('week').toISODate()!;
    }
    const w = weeks.get(week) ?? {};
    w[d.householdId] = (w[d.householdId] ?? 0) + sugarOf(d.volumeL, d.brix);
    weeks.set(week, w);
  }
  return [...weeks.keys()].sort().map((week) => ({ week, sugarKg: weeks.get(week)! }));
}
