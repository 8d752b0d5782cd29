// Server code without the 'server-only' marker: the seed and the tests call it under plain Node.
import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/db/models';
import type { PersonCtx } from '@/lib/server/context';
import { conflict, forbidden, invalid, notFound } from '@/lib/server/errors';
import { recordChange } from '@/lib/events';
import { allocateRun } from '@/lib/ledger/allocate-run';
import { gradeClass, sugarKg, syrupLitres } from '@/lib/sugar';
import type { DrawInput, FinishInput, FuelInput, RunInputsInput, StartRunInput } from './schema';
import type { RunDto } from './types';

/** Who records (a signed-in person) and for which co-op. */
export type RunsContext = PersonCtx;

const STAFF = new Set(['coordinator', 'sugarmaker']);

function mustBeStaff(ctx: RunsContext) {
  if (!STAFF.has(ctx.actor.role)) throw forbidden('Only a sugarmaker or the coordinator records runs.');
}

const pgCode = (err: unknown) => (err as { parent?: { code?: string } })?.parent?.code;
const pgConstraint = (err: unknown) => (err as { parent?: { constraint?: string } })?.parent?.constraint;

// ---------------------------------------------------------------- reading

type RunRow = Omit<RunDto, 'totals'> & { syrupBrix: number };

// Every run with its inputs, draw-offs and fuel in one statement.
const RUNS_SQL = (where: string) => `
SELECT r.id, r.season_id AS "seasonId", r.run_number AS "runNumber", r.lot_code AS "lotCode",
       r.evaporator_id AS "evaporatorId", e.name AS "evaporatorName", r.slot_id AS "slotId", r.status,
       r.started_at AS "startedAt", r.finished_at AS "finishedAt", sb.name AS "startedByName", fb.name AS "finishedByName", r.note,
       c.syrup_brix AS "syrupBrix",
       COALESCE((SELECT json_agg(json_build_object('id', i.id, 'deliveryId', i.delivery_id, 'householdId', d.household_id,
                  'householdName', h.name, 'litres', i.litres, 'brix', d.brix::float8, 'takenAt', i.taken_at) ORDER BY i.taken_at, i.id)
                   FROM run_inputs i JOIN sap_deliveries d ON d.id = i.delivery_id JOIN households h ON h.id = d.household_id
                  WHERE i.run_id = r.id), '[]') AS inputs,
       COALESCE((SELECT json_agg(json_build_object('id', s.id, 'drawnAt', s.drawn_at, 'litres', s.litres, 'brix', s.brix,
                  'transmittancePct', s.transmittance_pct, 'gradeClass', s.grade_class, 'temperatureC', s.temperature_c) ORDER BY s.drawn_at, s.id)
                   FROM syrup_draws s WHERE s.run_id = r.id), '[]') AS draws,
       COALESCE((SELECT json_agg(json_build_object('id', f.id, 'kind', f.kind, 'quantity', f.quantity, 'unit', f.unit,
                  'costCents', f.cost_cents, 'recordedAt', f.recorded_at) ORDER BY f.recorded_at, f.id)
                   FROM fuel_uses f WHERE f.run_id = r.id), '[]') AS fuel
  FROM boil_runs r
  JOIN evaporators e ON e.id = r.evaporator_id
  JOIN cooperatives c ON c.id = r.cooperative_id
  LEFT JOIN users sb ON sb.id = r.started_by_id
  LEFT JOIN users fb ON fb.id = r.finished_by_id
 WHERE r.cooperative_id = :coop ${where}
 ORDER BY r.started_at DESC, r.run_number DESC`;

const iso = (v: string | Date | null) => (v === null ? null : new Date(v).toISOString());

function toDto(row: RunRow): RunDto {
  const { syrupBrix, ...run } = row;
  const inputs = run.inputs.map((i) => ({ ...i, takenAt: iso(i.takenAt)!, sugarKg: sugarKg(i.litres, i.brix) }));
  return {
    ...run,
    startedAt: iso(run.startedAt)!,
    finishedAt: iso(run.finishedAt),
    inputs,
    draws: run.draws.map((d) => ({ ...d, drawnAt: iso(d.drawnAt)! })),
    fuel: run.fuel.map((f) => ({ ...f, recordedAt: iso(f.recordedAt)! })),
    totals: {
      inputL: inputs.reduce((s, i) => s + i.litres, 0),
      sugarKg: inputs.reduce((s, i) => s + i.sugarKg, 0),
      syrupExpectedL: inputs.reduce((s, i) => s + syrupLitres(i.litres, i.brix, syrupBrix), 0),
      syrupDrawnL: run.draws.reduce((s, d) => s + d.litres, 0),
      fuelCostCents: run.fuel.reduce((s, f) => s + f.costCents, 0),
    },
  };
}

/** The co-op's runs, newest first (one season's when `seasonId` is given). Anyone in the co-op reads them. */
export async function listRuns(ctx: RunsContext, { seasonId }: { seasonId?: string } = {}, transaction?: Transaction): Promise<RunDto[]> {
  const rows = await db().sequelize.query<RunRow>(RUNS_SQL(seasonId ? 'AND r.season_id = :seasonId' : ''), {
    replacements: { coop: ctx.cooperativeId, seasonId: seasonId ?? null },
    type: QueryTypes.SELECT,
    transaction,
  });
  return rows.map(toDto);
}

export async function getRun(ctx: RunsContext, id: string, transaction?: Transaction): Promise<RunDto> {
  if (!/^[0-9a-f-]{36}$/i.test(id)) throw notFound('That run');
  const rows = await db().sequelize.query<RunRow>(RUNS_SQL('AND r.id = :id'), {
    replacements: { coop: ctx.cooperativeId, id },
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!rows.length) throw notFound('That run');
  return toDto(rows[0]);
}

// ---------------------------------------------------------------- writing

/** The run, locked for this transaction; refused unless it is still running. */
async function runningRun(ctx: RunsContext, id: string, transaction: Transaction) {
  if (!/^[0-9a-f-]{36}$/i.test(id)) throw notFound('That run');
  const run = await db().BoilRun.findOne({ where: { id, cooperativeId: ctx.cooperativeId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!run) throw notFound('That run');
  if (run.status !== 'running') throw conflict(`Run ${run.lotCode} is finished; nothing more can be added to it.`);
  return run;
}

function notFuture(at: string | undefined, field: string): Date {
  const when = at ? new Date(at) : new Date();
  if (when.getTime() > Date.now() + 5 * 60_000) throw invalid('Some fields need another look.', { [field]: 'That time is in the future.' }, 'invalid_input');
  return when;
}

/** Starts a run on an evaporator, numbered in the open season ("2027-014"). */
export async function startRun(ctx: RunsContext, input: StartRunInput): Promise<RunDto> {
  mustBeStaff(ctx);
  const m = db();
  const startedAt = notFuture(input.startedAt, 'startedAt');
  let evaporatorName = 'That evaporator';
  try {
    const id = await m.sequelize.transaction(async (transaction) => {
      const evaporator = await m.Evaporator.findOne({ where: { id: input.evaporatorId, cooperativeId: ctx.cooperativeId }, transaction });
      if (!evaporator) throw invalid('Some fields need another look.', { evaporatorId: 'Choose one of your co-op’s evaporators.' }, 'invalid_input');
      evaporatorName = evaporator.name;
      // The season row lock numbers runs one at a time.
      const season = await m.Season.findOne({ where: { cooperativeId: ctx.cooperativeId, status: 'open' }, transaction, lock: transaction.LOCK.UPDATE });
      if (!season) throw invalid('No season is open: runs are recorded in an open season.', { evaporatorId: 'Open a season first.' }, 'invalid_input');
      let slotId: string | null = null;
      if (input.slotId) {
        const slot = await m.BoilSlot.findOne({ where: { id: input.slotId, cooperativeId: ctx.cooperativeId }, transaction });
        if (!slot || slot.status === 'cancelled' || slot.evaporatorId !== evaporator.id) {
          throw invalid('Some fields need another look.', { slotId: 'Choose a booked slot on this evaporator.' }, 'invalid_input');
        }
        slotId = slot.id;
      } else if (input.slotId === undefined) {
        const [slot] = await m.sequelize.query<{ id: string }>(
          `SELECT id FROM boil_slots WHERE cooperative_id = :coop AND evaporator_id = :evap AND status <> 'cancelled'
             AND starts_at <= :at AND ends_at > :at ORDER BY starts_at LIMIT 1`,
          { replacements: { coop: ctx.cooperativeId, evap: evaporator.id, at: startedAt.toISOString() }, type: QueryTypes.SELECT, transaction },
        );
        slotId = slot?.id ?? null;
      }
      const [{ next }] = await m.sequelize.query<{ next: number }>(
        'SELECT COALESCE(MAX(run_number), 0) + 1 AS next FROM boil_runs WHERE season_id = :season',
        { replacements: { season: season.id }, type: QueryTypes.SELECT, transaction },
      );
      const year = season.startsOn.slice(0, 4);
      const run = await m.BoilRun.create(
        {
          cooperativeId: ctx.cooperativeId,
          seasonId: season.id,
          evaporatorId: evaporator.id,
          slotId,
          runNumber: next,
          lotCode: `${year}-${String(next).padStart(3, '0')}`,
          startedAt,
          startedById: ctx.actor.userId,
          note: input.note || null,
        },
        { transaction },
      );
      await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.started', runId: run.id });
      return run.id;
    });
    return getRun(ctx, id);
  } catch (err) {
    if (pgConstraint(err) === 'boil_runs_one_running_per_evaporator') {
      const running = await db().BoilRun.findOne({ where: { evaporatorId: input.evaporatorId, cooperativeId: ctx.cooperativeId, status: 'running' } });
      throw conflict(`${evaporatorName} already has run ${running?.lotCode ?? ''} boiling. Finish it before starting another.`.replace('  ', ' '), 'run_already_running');
    }
    throw err;
  }
}

/** Takes lots (whole or part) into a running run. The database refuses more litres than a lot has left. */
export async function addInputs(ctx: RunsContext, runId: string, input: RunInputsInput): Promise<RunDto> {
  mustBeStaff(ctx);
  const m = db();
  let current: string | null = null;
  try {
    await m.sequelize.transaction(async (transaction) => {
      const run = await runningRun(ctx, runId, transaction);
      for (const one of input.inputs) {
        current = one.deliveryId;
        const [lot] = await m.sequelize.query<{ status: string; left: number }>(
          'SELECT status, volume_l - litres_boiled AS left FROM sap_deliveries WHERE id = :id AND cooperative_id = :coop',
          { replacements: { id: one.deliveryId, coop: ctx.cooperativeId }, type: QueryTypes.SELECT, transaction },
        );
        if (!lot) throw invalid('Some fields need another look.', { deliveryId: 'That lot is not one of your co-op’s.' }, 'invalid_input');
        if (lot.status !== 'accepted') throw invalid('That lot was rejected; rejected sap is never boiled.', { deliveryId: 'Choose an accepted lot.' }, 'invalid_input');
        // Taking "all that is left" reads the remainder in the same statement that inserts it.
        await m.sequelize.query(
          `INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres, taken_by_id)
           SELECT :coop, :run, d.id, COALESCE(:litres, d.volume_l - d.litres_boiled), :by
             FROM sap_deliveries d WHERE d.id = :id AND d.cooperative_id = :coop`,
          {
            replacements: { coop: ctx.cooperativeId, run: run.id, id: one.deliveryId, litres: one.litres ?? null, by: ctx.actor.userId },
            transaction,
          },
        );
        await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.input', runId: run.id, deliveryId: one.deliveryId });
      }
    });
  } catch (err) {
    const c = pgConstraint(err);
    if (c === 'sap_deliveries_not_overdrawn' || c === 'run_inputs_litres_check' || (pgCode(err) === '23514' && /litres/.test(String(c)))) {
      const [lot] = await m.sequelize.query<{ left: number }>('SELECT volume_l - litres_boiled AS left FROM sap_deliveries WHERE id = :id', {
        replacements: { id: current },
        type: QueryTypes.SELECT,
      });
      const left = Math.max(0, lot?.left ?? 0);
      throw conflict(left > 0 ? `Only ${+left.toFixed(3)} L of that lot are left to boil.` : 'That lot has already been boiled in full.', 'lot_overdrawn', {
        fields: { litres: 'More than the lot has left.' },
        details: { deliveryId: current, litresLeft: left },
      });
    }
    if (c === 'sap_deliveries_boiled_only_accepted') {
      throw invalid('That lot was rejected; rejected sap is never boiled.', { deliveryId: 'Choose an accepted lot.' }, 'invalid_input');
    }
    throw err;
  }
  return getRun(ctx, runId);
}

/** Records a draw-off; the colour class follows lib/sugar's grading limits when transmittance is given. */
export async function addDraw(ctx: RunsContext, runId: string, input: DrawInput): Promise<RunDto> {
  mustBeStaff(ctx);
  const m = db();
  let klass = input.gradeClass ?? null;
  if (input.transmittancePct != null) {
    const measured = gradeClass(input.transmittancePct);
    if (klass && klass !== measured) {
      throw invalid('Some fields need another look.', { gradeClass: `${input.transmittancePct} %Tc is ${measured}, not ${klass}.` }, 'invalid_input');
    }
    klass = measured;
  }
  const drawnAt = notFuture(input.drawnAt, 'drawnAt');
  await m.sequelize.transaction(async (transaction) => {
    const run = await runningRun(ctx, runId, transaction);
    if (drawnAt < run.startedAt) throw invalid('Some fields need another look.', { drawnAt: 'Before the run started.' }, 'invalid_input');
    const draw = await m.SyrupDraw.create(
      {
        cooperativeId: ctx.cooperativeId,
        runId: run.id,
        drawnAt,
        litres: input.litres,
        brix: input.brix,
        transmittancePct: input.transmittancePct ?? null,
        gradeClass: klass!,
        temperatureC: input.temperatureC ?? null,
        recordedById: ctx.actor.userId,
      },
      { transaction },
    );
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.draw', runId: run.id, drawId: draw.id });
  });
  return getRun(ctx, runId);
}

/** Records fuel burned, costed at the season's price per cord or litre. */
export async function addFuel(ctx: RunsContext, runId: string, input: FuelInput): Promise<RunDto> {
  mustBeStaff(ctx);
  const m = db();
  await m.sequelize.transaction(async (transaction) => {
    const run = await runningRun(ctx, runId, transaction);
    const [evaporator, season] = await Promise.all([
      m.Evaporator.findOne({ where: { id: run.evaporatorId, cooperativeId: ctx.cooperativeId }, transaction }),
      m.Season.findOne({ where: { id: run.seasonId, cooperativeId: ctx.cooperativeId }, transaction }),
    ]);
    const kind = input.kind ?? evaporator!.fuelKind;
    const unit = input.unit ?? (kind === 'wood' ? 'cord' : 'litre');
    if ((kind === 'wood' && unit !== 'cord') || ((kind === 'oil' || kind === 'propane') && unit !== 'litre')) {
      throw invalid('Some fields need another look.', { unit: kind === 'wood' ? 'Wood is counted in cords.' : `${kind} is counted in litres.` }, 'invalid_input');
    }
    const fuel = await m.FuelUse.create(
      {
        cooperativeId: ctx.cooperativeId,
        runId: run.id,
        kind: kind as 'wood',
        quantity: input.quantity,
        unit,
        costCents: Math.round(input.quantity * season!.fuelPriceCents),
        recordedById: ctx.actor.userId,
      },
      { transaction },
    );
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.fuel', runId: run.id, fuelId: fuel.id });
  });
  return getRun(ctx, runId);
}

/** Finishes a run and, in the same transaction, allocates its syrup and fuel to the households. */
export async function finishRun(ctx: RunsContext, runId: string, input: FinishInput = {}): Promise<RunDto> {
  mustBeStaff(ctx);
  const m = db();
  const finishedAt = notFuture(input.finishedAt, 'finishedAt');
  await m.sequelize.transaction(async (transaction) => {
    const run = await runningRun(ctx, runId, transaction);
    if (finishedAt < run.startedAt) throw invalid('Some fields need another look.', { finishedAt: 'Before the run started.' }, 'invalid_input');
    const inputs = await m.RunInput.count({ where: { runId: run.id }, transaction });
    if (!inputs) throw invalid('Take sap from the queue into the run before finishing it.', { runId: 'No sap went into this run.' }, 'invalid_input');
    await run.update({ status: 'finished', finishedAt, finishedById: ctx.actor.userId }, { transaction });
    // The season ledger's per-run allocation, in this same transaction.
    await allocateRun({ cooperativeId: ctx.cooperativeId, transaction, actorId: ctx.actor.userId }, run.id);
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'run.finished', runId: run.id });
  });
  return getRun(ctx, runId);
}
