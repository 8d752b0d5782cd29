import 'server-only';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import { recordChange } from '@/lib/events';
import { allocationRow, computeLedger, fail, finishedRuns, insertSettlements, seasonOf, select, UUID, type WholeLedger } from './ledger-data';

export { fail };
import type { PersonCtx } from '@/lib/server/context';
import { ledgerRunSplit, round, settlementRow, sumAscending } from './rules';
import { storedAllocation } from './allocate-run';
import { enqueueStatements } from './statement-mail';
import { loadStatement } from './statement-data';
import type { Ledger, LedgerRun, Settlement, Statement } from './types';
import type { SeasonDto } from '@/lib/coop/types';
import { deepFreeze, processCache } from '@/lib/server/versioned-cache';

/** Who acts (a signed-in person) and for which co-op; `transaction` when the caller already holds one. */
export type LedgerContext = PersonCtx;

const requireCoordinator = (ctx: LedgerContext, what: string) => {
  if (ctx.actor.role !== 'coordinator') throw fail('forbidden', 'forbidden', `Only a coordinator can ${what}.`);
};

/** The ledger as a member may see it: its own row, runs and statement, the co-op totals, the other names. */
function forMember(whole: BuiltLedger, own: string | null): Ledger {
  const { ledger } = whole;
  const mine = (own && whole.runsOf.get(own)) || new Set<string>();
  return {
    ...ledger,
    households: ledger.households.filter((h) => h.householdId === own),
    runs: ledger.runs.filter((run) => mine.has(run.runId)).map((run) => ({ ...run, households: 1 })),
    weeks: ledger.weeks.map((w) => ({ week: w.week, sugarKg: own && own in w.sugarKg ? { [own]: w.sugarKg[own] } : {} })),
    statements: ledger.statements.filter((s) => s.householdId === own),
  };
}

/** The whole co-op's ledger, the runs of each household (for a member's view), and the JSON text of the answer, built once per co-op change version. */
interface BuiltLedger extends WholeLedger {
  json: string;
}

// About 3 bytes of memory per character of JSON (the text and the objects it came from), and
// about 64 bytes per run a household's sap went into (the member's lists).
const ledgers = processCache<BuiltLedger>('ledgers', 64 * 2 ** 20, (b) => 3 * b.json.length + 64 * b.ledger.runs.reduce((n, r) => n + r.households, 0));

/**
 * The whole co-op's ledger of a season. Every write the ledger shows (lots, runs, fees,
 * payments, statements sent, households, the season's status) bumps the co-op's change version
 * as it commits; the ledger is read after the version, so one built at that version or later
 * holds every change up to it, and is shared until the next change. Inside a caller's
 * transaction it is built afresh.
 */
async function wholeLedger(ctx: LedgerContext, seasonId: string, knownVersion: string | undefined): Promise<BuiltLedger> {
  const key = `${ctx.cooperativeId}:${seasonId}`;
  const kept = knownVersion && !ctx.transaction ? ledgers.peek(key, knownVersion) : undefined;
  if (kept) return kept;
  const season = await seasonOf(ctx, seasonId);
  const build = async (): Promise<BuiltLedger> => {
    const { ledger, runsOf } = await computeLedger(ctx, season);
    deepFreeze(ledger);
    return { ledger, runsOf, json: JSON.stringify(ledger) };
  };
  return ctx.transaction ? build() : ledgers.get(key, season.changeVersion, build);
}

/** The ledger as the acting person may see it, with its JSON text. */
export async function ledgerView(ctx: LedgerContext, seasonId: string, { knownVersion }: KnownVersion = {}): Promise<{ ledger: Ledger; json: string }> {
  const whole = await wholeLedger(ctx, seasonId, knownVersion);
  if (ctx.actor.role !== 'member') return whole;
  const own = forMember(whole, ctx.actor.householdId);
  return { ledger: own, json: JSON.stringify(own) };
}

/**
 * GET /api/seasons/:id/ledger/runs/:runId — one finished run's split between the households
 * whose sap went into it (a member: its own part, and 404 for a run without its sap). Read from
 * that run's rows alone, whatever the size of the season.
 */
export async function ledgerRun(ctx: LedgerContext, seasonId: string, runId: string): Promise<LedgerRun> {
  const notFound = () => fail('not_found', 'not_found', 'That run was not found among this season’s finished runs.');
  if (!UUID.test(seasonId) || !UUID.test(runId)) throw notFound();
  const [[found], stored] = await Promise.all([finishedRuns(ctx, seasonId, runId), storedAllocation(ctx, runId)]);
  if (!found) throw notFound();
  // The run's totals are the whole run's, as in the ledger's list; a member sees its own part of the split.
  const run = ledgerRunSplit(found, stored.map((a) => allocationRow({ ...a, runId })));
  if (ctx.actor.role !== 'member') return run;
  const own = run.allocations.filter((a) => a.householdId === ctx.actor.householdId);
  if (!own.length) throw notFound();
  return { ...run, allocations: own };
}

/**
 * The co-op's change version a GET route handler read with the person (`ctx.changeVersion`): an
 * answer cached at that version or later is served without asking the database again.
 */
export interface KnownVersion {
  knownVersion?: string;
}

/** GET /api/seasons/:id/ledger (as data; the route sends `ledgerView`'s text). */
export async function getLedger(ctx: LedgerContext, seasonId: string): Promise<Ledger> {
  return (await ledgerView(ctx, seasonId)).ledger;
}

interface SettlementDbRow {
  householdId: string | null;
  name: string;
  sapL: number;
  sugarKg: number;
  syrupMl: number;
  fuelCents: number;
  feeCents: number;
}

// One statement of plain rows, one per household: what the settlement needs and nothing of the
// ledger's drill-downs. Sugar is summed in ascending order, as the ledger's rules sum it, so both
// give the same figures to the last bit. No row at all: no such season in this co-op.
const SETTLEMENT_SQL = `
WITH s AS (
  SELECT s.id, c.change_version::text AS version
    FROM seasons s JOIN cooperatives c ON c.id = s.cooperative_id
   WHERE s.id = $seasonId AND s.cooperative_id = $cooperativeId
), a AS (
  SELECT household_id, sum(sugar_kg ORDER BY sugar_kg) AS sugar_kg, sum(syrup_ml)::float8 AS syrup_ml, sum(fuel_cents)::float8 AS fuel_cents
    FROM allocations WHERE cooperative_id = $cooperativeId AND season_id = $seasonId GROUP BY household_id
), d AS (
  SELECT household_id, sum(volume_l) AS sap_l
    FROM sap_deliveries WHERE cooperative_id = $cooperativeId AND season_id = $seasonId AND status = 'accepted' GROUP BY household_id
)
SELECT s.version, h.id AS "householdId", h.name, coalesce(d.sap_l, 0) AS "sapL", coalesce(a.sugar_kg, 0) AS "sugarKg",
       coalesce(a.syrup_ml, 0) AS "syrupMl", coalesce(a.fuel_cents, 0) AS "fuelCents", coalesce(f.fee_cents, 0) AS "feeCents"
  FROM s
  LEFT JOIN households h ON h.cooperative_id = $cooperativeId
  LEFT JOIN a ON a.household_id = h.id
  LEFT JOIN d ON d.household_id = h.id
  LEFT JOIN season_fees f ON f.season_id = s.id AND f.household_id = h.id
 ORDER BY lower(h.name)`;

/**
 * GET /api/seasons/:id/settlement — the contract's shape, from one query; a member gets its own
 * household only (the totals stay the co-op's).
 */
interface BuiltSettlement {
  settlement: Settlement;
  json: string;
}

const settlements = processCache<BuiltSettlement>('settlements', 8 * 2 ** 20, (b) => 3 * b.json.length);

/** The whole co-op's settlement of a season, from one statement (the version is read in it). */
async function buildSettlement(ctx: LedgerContext, seasonId: string): Promise<{ version: string; settlement: Settlement }> {
  const rows = await getSequelize().query<SettlementDbRow & { version: string }>(SETTLEMENT_SQL, {
    bind: { seasonId, cooperativeId: ctx.cooperativeId },
    type: QueryTypes.SELECT,
    transaction: ctx.transaction,
  });
  if (!rows.length) throw fail('not_found', 'not_found', 'That season was not found.');
  const households = rows.filter((r): r is SettlementDbRow & { householdId: string; version: string } => r.householdId !== null);
  const totalSugar = sumAscending(households.map((h) => h.sugarKg));
  return {
    version: rows[0].version,
    settlement: {
      seasonId,
      households: households.map((h) =>
        settlementRow({
          ...h,
          share: totalSugar > 0 ? h.sugarKg / totalSugar : 0,
          dueCents: h.fuelCents + h.feeCents,
        }),
      ),
      totals: {
        sugarKg: round(totalSugar, 4),
        syrupMl: households.reduce((t, h) => t + h.syrupMl, 0),
        fuelCents: households.reduce((t, h) => t + h.fuelCents, 0),
      },
    },
  };
}

/**
 * GET /api/seasons/:id/settlement with its JSON text; a member gets its own household only (the
 * totals stay the co-op's). Kept per co-op change version like the ledger.
 */
export async function settlementView(ctx: LedgerContext, seasonId: string, { knownVersion }: KnownVersion = {}): Promise<BuiltSettlement> {
  if (!UUID.test(seasonId)) throw fail('not_found', 'not_found', 'That season was not found.');
  const key = `${ctx.cooperativeId}:${seasonId}`;
  let whole = knownVersion && !ctx.transaction ? settlements.peek(key, knownVersion) : undefined;
  if (!whole) {
    const built = await buildSettlement(ctx, seasonId);
    const settlement = deepFreeze(built.settlement);
    whole = { settlement, json: JSON.stringify(settlement) };
    // The version was read in the same statement as the figures: they belong to it exactly.
    if (!ctx.transaction) whole = settlements.keep(key, built.version, whole);
  }
  if (ctx.actor.role !== 'member') return whole;
  const own = ctx.actor.householdId;
  const mine: Settlement = { ...whole.settlement, households: whole.settlement.households.filter((h) => h.householdId === own) };
  return { settlement: mine, json: JSON.stringify(mine) };
}

/** What closing answers: the season as the co-op's season list has it, less its fuel price. */
type ClosedSeason = Omit<SeasonDto, 'fuelPriceCents'>;

/** POST /api/seasons/:id/close — no more lots or runs; a running run must be finished first. */
export async function closeSeason(ctx: LedgerContext, seasonId: string): Promise<ClosedSeason> {
  requireCoordinator(ctx, 'close a season');
  return getSequelize().transaction(async (transaction) => {
    const tctx = { ...ctx, transaction };
    const season = await seasonOf(tctx, seasonId, { lock: true });
    if (season.status === 'closed' || season.status === 'settled') {
      return { id: season.id, label: season.label, startsOn: season.startsOn, endsOn: season.endsOn, status: season.status };
    }
    if (season.status !== 'open') throw fail('conflict', 'season_not_open', 'Only an open season can be closed.');
    const [running] = await select<{ lotCode: string }>(
      `SELECT lot_code AS "lotCode" FROM boil_runs WHERE season_id = :seasonId AND cooperative_id = :cooperativeId AND status = 'running' LIMIT 1`,
      { seasonId, cooperativeId: ctx.cooperativeId },
      transaction,
    );
    if (running) throw fail('conflict', 'run_running', `Run ${running.lotCode} is still boiling: finish it before closing the season.`);
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
      throw fail('conflict', 'season_not_closed', 'Close the season before settling it.');
    }
    const made = await insertSettlements(tctx, season, ctx.actor.userId);
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
  if (!UUID.test(statementId)) throw fail('not_found', 'not_found', 'That statement was not found.');
  const s = await loadStatement(getSequelize(), statementId, ctx.cooperativeId, ctx.transaction);
  const mayRead = ctx.actor.role === 'coordinator' || (ctx.actor.householdId !== null && ctx.actor.householdId === s?.householdId);
  if (!s || !mayRead) throw fail('not_found', 'not_found', 'That statement was not found.');
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
    if (season.status === 'settled') throw fail('conflict', 'season_settled', 'The season is settled: its fees can no longer change.');
    await getSequelize().query(
      `INSERT INTO season_fees (season_id, cooperative_id, household_id, fee_cents) VALUES (:seasonId, :cooperativeId, :householdId, :feeCents)
       ON CONFLICT (season_id, household_id) DO UPDATE SET fee_cents = EXCLUDED.fee_cents, updated_at = now()`,
      { replacements: { seasonId, cooperativeId: ctx.cooperativeId, householdId, feeCents }, transaction },
    );
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'season.fee', seasonId, householdId });
    return { seasonId, householdId, feeCents };
  });
}

/**
 * POST /api/runs/:id/reopen — a coordinator reopens a finished run of an open season so it can
 * be corrected; its allocation stays until the run is finished again, when it is recomputed in
 * that finish's transaction. The reopening is kept in the allocation history with its reason.
 */
export async function reopenRun(ctx: LedgerContext, runId: string, reason: string) {
  requireCoordinator(ctx, 'reopen a run');
  if (!UUID.test(runId)) throw fail('not_found', 'not_found', 'That run was not found.');
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const [run] = await select<{ id: string; status: string; seasonStatus: string; lotCode: string }>(
      `SELECT r.id, r.status, s.status AS "seasonStatus", r.lot_code AS "lotCode"
         FROM boil_runs r JOIN seasons s ON s.id = r.season_id
        WHERE r.id = :runId AND r.cooperative_id = :cooperativeId FOR UPDATE OF r`,
      { runId, cooperativeId: ctx.cooperativeId },
      transaction,
    );
    if (!run) throw fail('not_found', 'not_found', 'That run was not found.');
    if (run.seasonStatus !== 'open') throw fail('conflict', 'season_not_open', 'The season is closed: its runs can no longer change.');
    if (run.status !== 'finished') throw fail('conflict', 'run_not_finished', 'Only a finished run can be reopened.');
    const current = await storedAllocation({ cooperativeId: ctx.cooperativeId, transaction }, runId);
    await sequelize.query(
      `UPDATE boil_runs SET status = 'running', finished_at = NULL, finished_by_id = NULL, updated_at = now()
        WHERE id = :runId AND cooperative_id = :cooperativeId`,
      { replacements: { runId, cooperativeId: ctx.cooperativeId }, transaction },
    );
    await sequelize.query(
      `INSERT INTO allocation_revisions (cooperative_id, run_id, event, changed_by_id, reason, before, after)
       VALUES (:cooperativeId, :runId, 'reopened', :actorId, :reason, CAST(:rows AS jsonb), CAST(:rows AS jsonb))`,
      { replacements: { cooperativeId: ctx.cooperativeId, runId, actorId: ctx.actor.userId, reason, rows: JSON.stringify(current) }, transaction },
    );
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.reopened', runId });
    return { id: run.id, lotCode: run.lotCode, status: 'running' as const };
  });
}
