// Server code (database), without the 'server-only' marker: the demo seed settles last year's
// season with it under plain Node.
import { QueryTypes, type Transaction } from 'sequelize';
import { getSequelize } from '@/db';
import { AppError, type ErrorKind, type FieldErrors } from '@/lib/server/errors';
import { GRADE_CLASSES } from '@/lib/sugar/grade';
import { coopMeanBrix, ledgerRuns, settle, sugarByWeek, emptyByClass, type AllocationRow, type DeliveryRow, type RunRow } from './rules';
import type { Ledger } from './types';

/** What the ledger's reads need: the co-op, and the transaction when the caller holds one. */
export interface LedgerReadContext {
  cooperativeId: string;
  transaction?: Transaction;
}

/** A domain error of the ledger's, with its stable code (the HTTP layer gives it its status). */
export const fail = (kind: ErrorKind, code: string, message: string, fields?: FieldErrors) => new AppError(kind, code, message, { fields });

export const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function select<T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction): Promise<T[]> {
  return getSequelize().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
}

export interface SeasonRow {
  id: string;
  label: string;
  status: 'planned' | 'open' | 'closed' | 'settled';
  startsOn: string;
  endsOn: string;
  currency: string;
  unitSystem: 'metric' | 'us';
  timeZone: string;
  cooperativeName: string;
  /** The co-op's change version when the row was read (every write the ledger shows bumps it). */
  changeVersion: string;
}

export async function seasonOf(ctx: LedgerReadContext, seasonId: string, { lock = false } = {}): Promise<SeasonRow> {
  if (!UUID.test(seasonId)) throw fail('not_found', 'not_found', 'That season was not found.');
  const [season] = await select<SeasonRow>(
    `SELECT s.id, s.label, s.status, s.starts_on AS "startsOn", s.ends_on AS "endsOn", c.currency,
            c.unit_system AS "unitSystem", c.time_zone AS "timeZone", c.name AS "cooperativeName",
            c.change_version::text AS "changeVersion"
       FROM seasons s JOIN cooperatives c ON c.id = s.cooperative_id
      WHERE s.id = :seasonId AND s.cooperative_id = :cooperativeId ${lock ? 'FOR UPDATE OF s' : ''}`,
    { seasonId, cooperativeId: ctx.cooperativeId },
    ctx.transaction,
  );
  if (!season) throw fail('not_found', 'not_found', 'That season was not found.');
  return season;
}


export interface AllocationDbRow {
  runId: string;
  householdId: string;
  sapL: number;
  sugarKg: number;
  share: number;
  golden: number;
  amber: number;
  dark: number;
  veryDark: number;
  fuelCents: number;
}

/** An allocation as the ledger's rules take it. */
export const allocationRow = (a: AllocationDbRow): AllocationRow => ({
  runId: a.runId,
  householdId: a.householdId,
  sapL: a.sapL,
  sugarKg: a.sugarKg,
  share: a.share,
  syrupByClassMl: { golden: a.golden, amber: a.amber, dark: a.dark, 'very-dark': a.veryDark },
  syrupMl: a.golden + a.amber + a.dark + a.veryDark,
  fuelCents: a.fuelCents,
});

/** A season's finished runs, oldest first; with `runId`, that run only (if it is one of them). */
export function finishedRuns(ctx: LedgerReadContext, seasonId: string, runId?: string): Promise<RunRow[]> {
  return select<RunRow>(
    `SELECT id AS "runId", lot_code AS "lotCode", to_char(finished_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"') AS "finishedAt"
       FROM boil_runs WHERE cooperative_id = :cooperativeId AND season_id = :seasonId AND status = 'finished'${runId ? ' AND id = :runId' : ''}
      ORDER BY started_at, id`,
    { cooperativeId: ctx.cooperativeId, seasonId, runId },
    ctx.transaction,
  );
}

/** The whole co-op's ledger of a season, and for each household the runs its sap went into (a member's list of runs). */
export interface WholeLedger {
  ledger: Ledger;
  runsOf: ReadonlyMap<string, ReadonlySet<string>>;
}

/**
 * The whole co-op's ledger for a season, from five lean queries (lots grouped by household,
 * status, °Brix and week; allocations; finished runs; fees; payments). Not filtered by role.
 * Each run comes with its totals; its split between households is read run by run (`ledgerRun`).
 */
export async function computeLedger(ctx: LedgerReadContext, season: SeasonRow): Promise<WholeLedger> {
  const r = { seasonId: season.id, cooperativeId: ctx.cooperativeId, tz: season.timeZone };
  const t = ctx.transaction;
  // In parallel over the pool; one after another on a transaction's single connection.
  const all = <T extends readonly unknown[]>(thunks: { [K in keyof T]: () => Promise<T[K]> }): Promise<T> =>
    (t ? thunks.reduce(async (acc, f) => [...(await acc), await f()], Promise.resolve([] as unknown[])) : Promise.all(thunks.map((f) => f()))) as unknown as Promise<T>;
  const [households, lots, allocs, runs, fees, paid, statements] = await all<
    [
      { householdId: string; name: string }[],
      DeliveryRow[],
      AllocationDbRow[],
      RunRow[],
      { householdId: string; feeCents: number }[],
      { householdId: string; paidCents: string }[],
      { id: string; householdId: string; sentAt: string | null }[],
    ]
  >([
    () => select<{ householdId: string; name: string }>(
      `SELECT id AS "householdId", name FROM households WHERE cooperative_id = :cooperativeId ORDER BY lower(name)`,
      r,
      t,
    ),
    // Sugar is linear in volume at one °Brix, so lots can be summed per reading before lib/sugar.
    () => select<DeliveryRow>(
      `SELECT household_id AS "householdId", status, brix::float8 AS brix, sum(volume_l) AS "volumeL",
              to_char(date_trunc('week', received_at AT TIME ZONE :tz), 'YYYY-MM-DD') AS week
         FROM sap_deliveries WHERE cooperative_id = :cooperativeId AND season_id = :seasonId
        GROUP BY 1, 2, 3, 5`,
      r,
      t,
    ),
    () => select<AllocationDbRow>(
      `SELECT run_id AS "runId", household_id AS "householdId", sap_l AS "sapL", sugar_kg AS "sugarKg", share,
              syrup_golden_ml AS golden, syrup_amber_ml AS amber, syrup_dark_ml AS dark, syrup_very_dark_ml AS "veryDark",
              fuel_cents AS "fuelCents"
         FROM allocations WHERE cooperative_id = :cooperativeId AND season_id = :seasonId`,
      r,
      t,
    ),
    () => finishedRuns(ctx, season.id),
    () => select<{ householdId: string; feeCents: number }>(
      `SELECT household_id AS "householdId", fee_cents AS "feeCents" FROM season_fees WHERE cooperative_id = :cooperativeId AND season_id = :seasonId`,
      r,
      t,
    ),
    () => select<{ householdId: string; paidCents: string }>(
      `SELECT s.household_id AS "householdId", sum(p.amount_cents) AS "paidCents"
         FROM payments p JOIN settlements s ON s.id = p.settlement_id
        WHERE s.cooperative_id = :cooperativeId AND s.season_id = :seasonId GROUP BY 1`,
      r,
      t,
    ),
    () => select<{ id: string; householdId: string; sentAt: string | null }>(
      `SELECT id, household_id AS "householdId", to_char(sent_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"') AS "sentAt"
         FROM settlements WHERE cooperative_id = :cooperativeId AND season_id = :seasonId`,
      r,
      t,
    ),
  ]);
  const allocations = allocs.map(allocationRow);
  const runsOf = new Map<string, Set<string>>();
  for (const a of allocations) {
    let runIds = runsOf.get(a.householdId);
    if (!runIds) runsOf.set(a.householdId, (runIds = new Set()));
    runIds.add(a.runId);
  }
  const deliveries = lots.map((l) => ({ ...l, volumeL: Number(l.volumeL) }));
  const { households: rows, totals } = settle({
    households,
    deliveries,
    allocations,
    fees: Object.fromEntries(fees.map((f) => [f.householdId, f.feeCents])),
    paid: Object.fromEntries(paid.map((p) => [p.householdId, Number(p.paidCents)])),
  });
  const syrupByClassMl = emptyByClass();
  for (const h of rows) for (const c of GRADE_CLASSES) syrupByClassMl[c] += h.syrupByClassMl[c];
  const sum = (f: (h: (typeof rows)[number]) => number) => rows.reduce((s, h) => s + f(h), 0);
  const ledger: Ledger = {
    seasonId: season.id,
    season: { id: season.id, label: season.label, status: season.status, startsOn: season.startsOn, endsOn: season.endsOn },
    currency: season.currency,
    unitSystem: season.unitSystem,
    householdNames: households.map((h) => ({ householdId: h.householdId, name: h.name })),
    households: rows,
    totals: {
      ...totals,
      sapL: sum((h) => h.sapL),
      rejectedL: sum((h) => h.rejectedL),
      meanBrix: coopMeanBrix(rows),
      feeCents: sum((h) => h.feeCents),
      dueCents: sum((h) => h.dueCents),
      paidCents: sum((h) => h.paidCents),
      balanceCents: sum((h) => h.balanceCents),
      syrupByClassMl,
    },
    runs: ledgerRuns(runs, allocations),
    weeks: sugarByWeek(deliveries, season.timeZone),
    statements,
  };
  return { ledger, runsOf };
}

/**
 * Freezes each household's settlement of a season (sap, sugar, share, syrup by colour class,
 * fuel, fee, due) as its statement row, marked queued. Rows already there stay as they are
 * (unique per season × household); returns the ids of the rows made now.
 */
export async function insertSettlements(ctx: LedgerReadContext, season: SeasonRow, actorId: string | null): Promise<{ id: string }[]> {
  const { ledger } = await computeLedger(ctx, season);
  const rows = ledger.households.filter((h) => h.sapL > 0 || h.dueCents > 0 || h.syrupMl > 0);
  let made: { id: string }[] = [];
  if (rows.length) {
    const replacements: Record<string, unknown> = { cooperativeId: ctx.cooperativeId, seasonId: season.id, actorId };
    const values = rows.map((h, i) => {
      Object.assign(replacements, {
        [`h${i}`]: h.householdId,
        [`l${i}`]: h.sapL,
        [`b${i}`]: h.meanBrix,
        [`s${i}`]: h.sugarKg,
        [`sh${i}`]: h.share,
        [`g${i}`]: h.syrupByClassMl.golden,
        [`a${i}`]: h.syrupByClassMl.amber,
        [`d${i}`]: h.syrupByClassMl.dark,
        [`v${i}`]: h.syrupByClassMl['very-dark'],
        [`f${i}`]: h.fuelCents,
        [`fee${i}`]: h.feeCents,
        [`due${i}`]: h.dueCents,
      });
      return `(:cooperativeId, :seasonId, :h${i}, :l${i}, :b${i}, :s${i}, :sh${i}, :g${i}, :a${i}, :d${i}, :v${i}, :f${i}, :fee${i}, :due${i}, :actorId, now())`;
    });
    made = await select<{ id: string }>(
      `INSERT INTO settlements (cooperative_id, season_id, household_id, sap_l, mean_brix, sugar_kg, share,
         syrup_golden_ml, syrup_amber_ml, syrup_dark_ml, syrup_very_dark_ml, fuel_cents, fee_cents, due_cents, settled_by_id, queued_at)
       VALUES ${values.join(', ')}
       ON CONFLICT (season_id, household_id) DO NOTHING
       RETURNING id`,
      replacements,
      ctx.transaction,
    );
  }
  return made;
}
