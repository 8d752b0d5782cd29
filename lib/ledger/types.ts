import type { GradeClass } from '@/lib/sugar/grade';

/** Syrup in whole millilitres per colour class of the grading standard. */
export type SyrupByClass = Record<GradeClass, number>;

/** One household's row of the settlement, as the API contract gives it. */
export interface SettlementHousehold {
  householdId: string;
  name: string;
  /** Accepted sap delivered in the season (L). */
  sapL: number;
  /** Sugar the household's sap put into the season's runs (kg): the basis of the split. */
  sugarKg: number;
  /** Fraction of the season's boiled sugar, 0–1. */
  share: number;
  syrupMl: number;
  fuelCents: number;
  feeCents: number;
  dueCents: number;
}

export interface SettlementTotals {
  sugarKg: number;
  syrupMl: number;
  fuelCents: number;
}

export interface Settlement {
  seasonId: string;
  households: SettlementHousehold[];
  totals: SettlementTotals;
}

/** The same split done by raw litres, shown beside the split by sugar. */
export interface VolumeSplit {
  share: number;
  syrupMl: number;
  fuelCents: number;
}

/** One household's row of the Season ledger. */
export interface LedgerHousehold extends SettlementHousehold {
  rejectedL: number;
  /** Volume-weighted mean °Brix of the accepted lots (null with no accepted sap). */
  meanBrix: number | null;
  /** Sugar in the accepted lots delivered, boiled or not (kg). */
  sugarDeliveredKg: number;
  /** Sap the household put into the season's runs (L). */
  boiledL: number;
  syrupByClassMl: SyrupByClass;
  paidCents: number;
  balanceCents: number;
  byVolume: VolumeSplit;
}

export interface LedgerRunAllocation {
  householdId: string;
  sapL: number;
  sugarKg: number;
  share: number;
  syrupMl: number;
  syrupByClassMl: SyrupByClass;
  fuelCents: number;
}

/** One finished run in the ledger's list: its totals (its split is asked for run by run). */
export interface LedgerRunSummary {
  runId: string;
  lotCode: string | null;
  finishedAt: string | null;
  syrupMl: number;
  fuelCents: number;
  sugarKg: number;
  /** Households whose sap went into the run (a member's list shows only its own runs). */
  households: number;
}

/** GET /api/seasons/:id/ledger/runs/:runId — one run's split between households. */
export interface LedgerRun extends Omit<LedgerRunSummary, 'households'> {
  allocations: LedgerRunAllocation[];
}

export interface LedgerWeek {
  /** Monday of the week, YYYY-MM-DD. */
  week: string;
  /** Sugar delivered in accepted lots, kg, by household id. */
  sugarKg: Record<string, number>;
}

export interface Ledger {
  seasonId: string;
  season: { id: string; label: string; status: string; startsOn: string; endsOn: string };
  currency: string;
  unitSystem: 'metric' | 'us';
  /** Every household of the co-op, names only (a member sees no more of the others). */
  householdNames: { householdId: string; name: string }[];
  households: LedgerHousehold[];
  totals: SettlementTotals & {
    sapL: number;
    rejectedL: number;
    /** Mean °Brix of the co-op's accepted sap, weighted by litres (null before any accepted lot). */
    meanBrix: number | null;
    feeCents: number;
    dueCents: number;
    paidCents: number;
    balanceCents: number;
    syrupByClassMl: SyrupByClass;
  };
  /** Finished runs, oldest first; each run's split is GET /api/seasons/:id/ledger/runs/:runId. */
  runs: LedgerRunSummary[];
  weeks: LedgerWeek[];
  /** Statement ids per household once the season is settled. */
  statements: { id: string; householdId: string; sentAt: string | null }[];
}

/** One household's statement: the settlement row frozen at settlement time, with what was paid. */
export interface Statement {
  id: string;
  seasonId: string;
  seasonLabel: string;
  householdId: string;
  householdName: string;
  cooperativeName: string;
  currency: string;
  unitSystem: 'metric' | 'us';
  sapL: number;
  meanBrix: number | null;
  sugarKg: number;
  share: number;
  syrupMl: number;
  syrupByClassMl: SyrupByClass;
  fuelCents: number;
  feeCents: number;
  dueCents: number;
  paidCents: number;
  balanceCents: number;
  paid: boolean;
  settledAt: string;
  sentAt: string | null;
  payments: { id: string; amountCents: number; method: string; paidAt: string; reference: string | null }[];
}
