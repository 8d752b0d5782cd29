// Server code only (it talks to the database), but without the 'server-only' marker: the Runs
// service, server.ts and the tests import it under plain Node, where that marker throws.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { getSequelize } from '@/db';
import { AppError } from '@/lib/server/errors';
import type { GradeClass } from '@/lib/sugar/grade';
import { allocateRunRows, type RunAllocation } from './rules';

/** What the allocation needs: the acting co-op and the open transaction of the finish. */
export interface AllocateRunContext {
  cooperativeId: string;
  transaction: Transaction;
  /** The person who finished the run, kept in the allocation history (none for the seed). */
  actorId?: string | null;
}

/** A run that cannot be allocated (not this co-op's, not finished, or syrup with no sugar in). */
export class RunAllocationError extends AppError {
  constructor(message: string, code: 'run_not_found' | 'run_not_finished' | 'run_without_sugar') {
    super(code === 'run_not_found' ? 'not_found' : code === 'run_not_finished' ? 'conflict' : 'invalid', code, message, {
      fields: code === 'run_without_sugar' ? { runId: message } : undefined,
    });
    this.name = 'RunAllocationError';
  }
}

const sequelizeOf = (t: Transaction) => (t as unknown as { sequelize: Sequelize }).sequelize;

interface StoredAllocation {
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

const SELECT_STORED = `
  SELECT household_id AS "householdId", sap_l AS "sapL", sugar_kg AS "sugarKg", share,
         syrup_golden_ml AS golden, syrup_amber_ml AS amber, syrup_dark_ml AS dark,
         syrup_very_dark_ml AS "veryDark", fuel_cents AS "fuelCents"
    FROM allocations WHERE run_id = :runId AND cooperative_id = :cooperativeId ORDER BY household_id`;

/** The run's stored allocation rows (for history, checks and the ledger's drill-down); outside a transaction, on the pool. */
export async function storedAllocation(ctx: { cooperativeId: string; transaction?: Transaction }, runId: string): Promise<StoredAllocation[]> {
  return (ctx.transaction ? sequelizeOf(ctx.transaction) : getSequelize()).query<StoredAllocation>(SELECT_STORED, {
    replacements: { runId, cooperativeId: ctx.cooperativeId },
    type: QueryTypes.SELECT,
    transaction: ctx.transaction,
  });
}

const toStored = (r: RunAllocation): StoredAllocation => ({
  householdId: r.householdId,
  sapL: r.sapL,
  sugarKg: r.sugarKg,
  share: r.share,
  golden: r.syrupByClassMl.golden,
  amber: r.syrupByClassMl.amber,
  dark: r.syrupByClassMl.dark,
  veryDark: r.syrupByClassMl['very-dark'],
  fuelCents: r.fuelCents,
});

/**
 * Allocates a finished run's syrup (whole mL per colour class) and fuel cost (whole cents) to
 * the households whose accepted sap went in, by sugar (lib/ledger/rules → lib/sugar allocateRun),
 * inside the finish's transaction. Replaces the run's previous allocation, if any, and records
 * who changed it with the rows before and after. Touches no other run.
 */
export async function allocateRun(ctx: AllocateRunContext, runId: string): Promise<RunAllocation[]> {
  const { transaction, cooperativeId } = ctx;
  const sequelize = sequelizeOf(transaction);
  const q = <T extends object>(sql: string) =>
    sequelize.query<T>(sql, { replacements: { runId, cooperativeId }, type: QueryTypes.SELECT, transaction });

  const [run] = await q<{ id: string; seasonId: string; status: string }>(
    `SELECT id, season_id AS "seasonId", status FROM boil_runs WHERE id = :runId AND cooperative_id = :cooperativeId FOR UPDATE`,
  );
  if (!run) throw new RunAllocationError('That run was not found.', 'run_not_found');
  if (run.status !== 'finished') throw new RunAllocationError('Finish the run before sharing out its syrup and fuel.', 'run_not_finished');

  // One connection per transaction: these run one after another.
  const inputs = await q<{ householdId: string; litres: number; brix: number }>(
      `SELECT d.household_id AS "householdId", ri.litres, d.brix::float8 AS brix
         FROM run_inputs ri JOIN sap_deliveries d ON d.id = ri.delivery_id AND d.cooperative_id = ri.cooperative_id
        WHERE ri.run_id = :runId AND ri.cooperative_id = :cooperativeId AND d.status = 'accepted'
        ORDER BY ri.created_at, ri.id`,
  );
  const draws = await q<{ litres: number; gradeClass: GradeClass }>(
      `SELECT litres, grade_class AS "gradeClass" FROM syrup_draws WHERE run_id = :runId AND cooperative_id = :cooperativeId`,
  );
  const [fuel] = await q<{ cents: string }>(`SELECT COALESCE(sum(cost_cents), 0) AS cents FROM fuel_uses WHERE run_id = :runId AND cooperative_id = :cooperativeId`);
  const before = await storedAllocation(ctx, runId);
  const [history] = await q<{ n: string }>(`SELECT count(*) AS n FROM allocation_revisions WHERE run_id = :runId AND cooperative_id = :cooperativeId`);

  let rows: RunAllocation[];
  try {
    rows = allocateRunRows(inputs, draws, Number(fuel.cents));
  } catch (err) {
    throw new RunAllocationError(err instanceof Error ? err.message : String(err), 'run_without_sugar');
  }

  await sequelize.query('DELETE FROM allocations WHERE run_id = :runId AND cooperative_id = :cooperativeId', {
    replacements: { runId, cooperativeId },
    transaction,
  });
  const actorId = ctx.actorId ?? null;
  if (rows.length) {
    const values: string[] = [];
    const replacements: Record<string, unknown> = { runId, cooperativeId, seasonId: run.seasonId, actorId };
    rows.forEach((r, i) => {
      values.push(
        `(:cooperativeId, :seasonId, :runId, :h${i}, :l${i}, :s${i}, :sh${i}, :g${i}, :a${i}, :d${i}, :v${i}, :f${i}, :actorId)`,
      );
      Object.assign(replacements, {
        [`h${i}`]: r.householdId,
        [`l${i}`]: r.sapL,
        [`s${i}`]: r.sugarKg,
        [`sh${i}`]: r.share,
        [`g${i}`]: r.syrupByClassMl.golden,
        [`a${i}`]: r.syrupByClassMl.amber,
        [`d${i}`]: r.syrupByClassMl.dark,
        [`v${i}`]: r.syrupByClassMl['very-dark'],
        [`f${i}`]: r.fuelCents,
      });
    });
    await sequelize.query(
      `INSERT INTO allocations (cooperative_id, season_id, run_id, household_id, sap_l, sugar_kg, share,
         syrup_golden_ml, syrup_amber_ml, syrup_dark_ml, syrup_very_dark_ml, fuel_cents, computed_by_id)
       VALUES ${values.join(', ')}`,
      { replacements, transaction },
    );
  }
  const after = rows.map(toStored).sort((a, b) => (a.householdId < b.householdId ? -1 : 1));
  await sequelize.query(
    `INSERT INTO allocation_revisions (cooperative_id, run_id, event, changed_by_id, before, after)
     VALUES (:cooperativeId, :runId, :event, :actorId, CAST(:before AS jsonb), CAST(:after AS jsonb))`,
    {
      replacements: {
        cooperativeId,
        runId,
        event: Number(history.n) > 0 ? 'refinished' : 'finished',
        actorId,
        before: JSON.stringify(before),
        after: JSON.stringify(after),
      },
      transaction,
    },
  );
  return rows;
}
