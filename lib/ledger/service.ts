import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getSequelize } from '@/db';
import { ApiError } from '@/lib/api/errors';
import { recordChange } from '@/lib/events';
import type { Role } from '@/lib/roles';
import { GRADE_CLASSES } from '@/lib/sugar/grade';
import { ledgerRuns, settle, settlementRow, sugarByWeek, emptyByClass, type AllocationRow, type DeliveryRow } from './rules';
import { storedAllocation } from './allocate-run';
import { enqueueStatements } from './statement-mail';
import { loadStatement } from './statement-data';
import type { Ledger, Settlement, Statement } from './types';

/** Who acts and for which co-op; `transaction` when the caller already holds one. */
export interface LedgerContext {
  actor: { id: string; role: Role; householdId: string | null };
  cooperativeId: string;
  transaction?: Transaction;
}

export const fail = (status: number, code: string, message: string, fields?: Record<string, string>) =>
  new ApiError(status, message, fields, { code });

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function select<T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction): Promise<T[]> {
  return getSequelize().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
}

interface SeasonRow {
  id: string;
  label: string;
  status: 'planned' | 'open' | 'closed' | 'settled';
  startsOn: string;
  endsOn: string;
  currency: string;
  unitSystem: 'metric' | 'us';
  timeZone: string;
  cooperativeName: string;
}

async function seasonOf(ctx: LedgerContext, seasonId: string, { lock = false } = {}): Promise<SeasonRow> {
  if (!UUID.test(seasonId)) throw fail(404, 'not_found', 'That season was not found.');
  const [season] = await select<SeasonRow>(
    `SELECT s.id, s.label, s.status, s.starts_on AS "startsOn", s.ends_on AS "endsOn", c.currency,
            c.unit_system AS "unitSystem", c.time_zone AS "timeZone", c.name AS "cooperativeName"
       FROM seasons s JOIN cooperatives c ON c.id = s.cooperative_id
      WHERE s.id = :seasonId AND s.cooperative_id = :cooperativeId ${lock ? 'FOR UPDATE OF s' : ''}`,
    { seasonId, cooperativeId: ctx.cooperativeId },
    ctx.transaction,
  );
  if (!season) throw fail(404, 'not_found', 'That season was not found.');
  return season;
}

const requireCoordinator = (ctx: LedgerContext, what: string) => {
  if (ctx.actor.role !== 'coordinator') throw fail(403, 'forbidden', `Only a coordinator can ${what}.`);
};

interface AllocationDbRow {
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

/**
 * The whole co-op's ledger for a season, from five lean queries (lots grouped by household,
 * status, °Brix and week; allocations; finished runs; fees; payments). Not filtered by role.
 */
async function computeLedger(ctx: LedgerContext, season: SeasonRow): Promise<Ledger> {
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
      { runId: string; lotCode: string | null; finishedAt: string | null }[],
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
    () => select<{ runId: string; lotCode: string | null; finishedAt: string | null }>(
      `SELECT id AS "runId", lot_code AS "lotCode", to_char(finished_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"') AS "finishedAt"
         FROM boil_runs WHERE cooperative_id = :cooperativeId AND season_id = :seasonId AND status = 'finished'
        ORDER BY started_at, id`,
      r,
      t,
    ),
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
  const allocations: AllocationRow[] = allocs.map((a) => ({
    runId: a.runId,
    householdId: a.householdId,
    sapL: a.sapL,
    sugarKg: a.sugarKg,
    share: a.share,
    syrupByClassMl: { golden: a.golden, amber: a.amber, dark: a.dark, 'very-dark': a.veryDark },
    syrupMl: a.golden + a.amber + a.dark + a.veryDark,
    fuelCents: a.fuelCents,
  }));
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
  return {
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
}

/** What a member may see: its own row, runs and statement, the co-op totals, the other names. */
function forActor(ctx: LedgerContext, ledger: Ledger): Ledger {
  if (ctx.actor.role !== 'member') return ledger;
  const own = ctx.actor.householdId;
  return {
    ...ledger,
    households: ledger.households.filter((h) => h.householdId === own),
    runs: ledger.runs
      .filter((run) => run.allocations.some((a) => a.householdId === own))
      .map((run) => ({ ...run, allocations: run.allocations.filter((a) => a.householdId === own) })),
    weeks: ledger.weeks.map((w) => ({ week: w.week, sugarKg: own && own in w.sugarKg ? { [own]: w.sugarKg[own] } : {} })),
    statements: ledger.statements.filter((s) => s.householdId === own),
  };
}

/** GET /api/seasons/:id/ledger */
export async function getLedger(ctx: LedgerContext, seasonId: string): Promise<Ledger> {
  const season = await seasonOf(ctx, seasonId);
  return forActor(ctx, await computeLedger(ctx, season));
}

/** GET /api/seasons/:id/settlement — the contract's shape; a member gets its own household only. */
export async function getSettlement(ctx: LedgerContext, seasonId: string): Promise<Settlement> {
  const ledger = await getLedger(ctx, seasonId);
  return {
    seasonId: ledger.seasonId,
    households: ledger.households.map(settlementRow),
    totals: { sugarKg: Math.round(ledger.totals.sugarKg * 10_000) / 10_000, syrupMl: ledger.totals.syrupMl, fuelCents: ledger.totals.fuelCents },
  };
}

export interface SeasonDto {
  id: string;
  label: string;
  startsOn: string;
  endsOn: string;
  status: string;
}

/** POST /api/seasons/:id/close — no more lots or runs; a running run must be finished first. */
export async function closeSeason(ctx: LedgerContext, seasonId: string): Promise<SeasonDto> {
  requireCoordinator(ctx, 'close a season');
  return getSequelize().transaction(async (transaction) => {
    const tctx = { ...ctx, transaction };
    const season = await seasonOf(tctx, seasonId, { lock: true });
    if (season.status === 'closed' || season.status === 'settled') {
      return { id: season.id, label: season.label, startsOn: season.startsOn, endsOn: season.endsOn, status: season.status };
    }
    if (season.status !== 'open') throw fail(409, 'season_not_open', 'Only an open season can be closed.');
    const [running] = await select<{ lotCode: string }>(
      `SELECT lot_code AS "lotCode" FROM boil_runs WHERE season_id = :seasonId AND cooperative_id = :cooperativeId AND status = 'running' LIMIT 1`,
      { seasonId, cooperativeId: ctx.cooperativeId },
      transaction,
    );
    if (running) throw fail(409, 'run_running', `Run ${running.lotCode} is still boiling: finish it before closing the season.`);
    await getSequelize().query(`UPDATE seasons SET status = 'closed', updated_at = now() WHERE id = :seasonId`, {
      replacements: { seasonId },
      transaction,
    });
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'season.closed', seasonId });
    return { id: season.id, label: season.label, startsOn: season.startsOn, endsOn: season.endsOn, status: 'closed' };
  });
}

/**
 * POST /api/seasons/:id/settlement/send — settles a closed season and queues each household's
 * statement, in one transaction. The statement rows are unique per season × household and are
 * queued only when first made, so pressing send twice (or at once from two screens) queues each
 * statement once; the worker sends each once (see statement-mail).
 */
export async function sendSettlement(ctx: LedgerContext, seasonId: string): Promise<{ queued: number }> {
  requireCoordinator(ctx, 'settle a season');
  return getSequelize().transaction(async (transaction) => {
    const tctx = { ...ctx, transaction };
    const season = await seasonOf(tctx, seasonId, { lock: true });
    if (season.status === 'open' || season.status === 'planned') {
      throw fail(409, 'season_not_closed', 'Close the season before settling it.');
    }
    const ledger = await computeLedger(tctx, season);
    const rows = ledger.households.filter((h) => h.sapL > 0 || h.dueCents > 0 || h.syrupMl > 0);
    let made: { id: string }[] = [];
    if (rows.length) {
      const replacements: Record<string, unknown> = { cooperativeId: ctx.cooperativeId, seasonId, actorId: ctx.actor.id };
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
        transaction,
      );
    }
    await enqueueStatements(made.map((m) => m.id), transaction);
    if (season.status !== 'settled') {
      await getSequelize().query(`UPDATE seasons SET status = 'settled', updated_at = now() WHERE id = :seasonId`, {
        replacements: { seasonId },
        transaction,
      });
      await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'season.settled', seasonId });
    }
    return { queued: made.length };
  });
}

/** GET /api/statements/:id — the household's people and coordinators only (others: 404). */
export async function getStatement(ctx: LedgerContext, statementId: string): Promise<Statement> {
  if (!UUID.test(statementId)) throw fail(404, 'not_found', 'That statement was not found.');
  const s = await loadStatement(getSequelize(), statementId, ctx.cooperativeId, ctx.transaction);
  const mayRead = ctx.actor.role === 'coordinator' || (ctx.actor.householdId !== null && ctx.actor.householdId === s?.householdId);
  if (!s || !mayRead) throw fail(404, 'not_found', 'That statement was not found.');
  return s;
}

/** The member's own statement of a season, if settled (for the Today page). */
export async function statementIdFor(ctx: LedgerContext, seasonId: string): Promise<string | null> {
  if (!ctx.actor.householdId) return null;
  const [row] = await select<{ id: string }>(
    `SELECT id FROM settlements WHERE cooperative_id = :cooperativeId AND season_id = :seasonId AND household_id = :householdId`,
    { cooperativeId: ctx.cooperativeId, seasonId, householdId: ctx.actor.householdId },
  );
  return row?.id ?? null;
}

/** A coordinator sets a household's season fee (0 or more cents) while the season is not settled. */
export async function setSeasonFee(ctx: LedgerContext, seasonId: string, householdId: string, feeCents: number) {
  requireCoordinator(ctx, 'set season fees');
  return getSequelize().transaction(async (transaction) => {
    const season = await seasonOf({ ...ctx, transaction }, seasonId, { lock: true });
    if (season.status === 'settled') throw fail(409, 'season_settled', 'The season is settled: its fees can no longer change.');
    await getSequelize().query(
      `INSERT INTO season_fees (season_id, cooperative_id, household_id, fee_cents) VALUES (:seasonId, :cooperativeId, :householdId, :feeCents)
       ON CONFLICT (season_id, household_id) DO UPDATE SET fee_cents = EXCLUDED.fee_cents, updated_at = now()`,
      { replacements: { seasonId, cooperativeId: ctx.cooperativeId, householdId, feeCents }, transaction },
    );
    return { seasonId, householdId, feeCents };
  });
}

/** The ledger's context for a signed-in person. */
export const contextOf = (user: { id: string; role: Role; householdId: string | null; cooperativeId: string }): LedgerContext => ({
  actor: { id: user.id, role: user.role, householdId: user.householdId },
  cooperativeId: user.cooperativeId,
});

/**
 * POST /api/runs/:id/reopen — a coordinator reopens a finished run of an open season so it can
 * be corrected; its allocation stays until the run is finished again, when it is recomputed in
 * that finish's transaction. The reopening is kept in the allocation history with its reason.
 */
export async function reopenRun(ctx: LedgerContext, runId: string, reason: string) {
  requireCoordinator(ctx, 'reopen a run');
  if (!UUID.test(runId)) throw fail(404, 'not_found', 'That run was not found.');
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const [run] = await select<{ id: string; status: string; seasonStatus: string; lotCode: string }>(
      `SELECT r.id, r.status, s.status AS "seasonStatus", r.lot_code AS "lotCode"
         FROM boil_runs r JOIN seasons s ON s.id = r.season_id
        WHERE r.id = :runId AND r.cooperative_id = :cooperativeId FOR UPDATE OF r`,
      { runId, cooperativeId: ctx.cooperativeId },
      transaction,
    );
    if (!run) throw fail(404, 'not_found', 'That run was not found.');
    if (run.seasonStatus !== 'open') throw fail(409, 'season_not_open', 'The season is closed: its runs can no longer change.');
    if (run.status !== 'finished') throw fail(409, 'run_not_finished', 'Only a finished run can be reopened.');
    const current = await storedAllocation({ cooperativeId: ctx.cooperativeId, transaction }, runId);
    await sequelize.query(
      `UPDATE boil_runs SET status = 'running', finished_at = NULL, finished_by_id = NULL, updated_at = now()
        WHERE id = :runId AND cooperative_id = :cooperativeId`,
      { replacements: { runId, cooperativeId: ctx.cooperativeId }, transaction },
    );
    await sequelize.query(
      `INSERT INTO allocation_revisions (cooperative_id, run_id, event, changed_by_id, reason, before, after)
       VALUES (:cooperativeId, :runId, 'reopened', :actorId, :reason, CAST(:rows AS jsonb), CAST(:rows AS jsonb))`,
      { replacements: { cooperativeId: ctx.cooperativeId, runId, actorId: ctx.actor.id, reason, rows: JSON.stringify(current) }, transaction },
    );
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.reopened', runId });
    return { id: run.id, lotCode: run.lotCode, status: 'running' as const };
  });
}
