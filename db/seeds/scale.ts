import bcrypt from 'bcryptjs';
import { DateTime } from 'luxon';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { DEMO_PASSWORD } from '@/db/seeds/demo';
import { gradeClass, syrupLitres, waterToEvaporateL, type GradeClass } from '@/lib/sugar';
import { allocateRunRows } from '@/lib/ledger/rules';

/**
 * A generated large co-op for benchmarks: per unit of scale 20 households, 2,000 sap lots and
 * 200 boil runs (and the slots, evaporators and people around them). Invented data only; the
 * co-op is called "Scale ×N" so it is never mistaken for the demo. Rows go in with set-based
 * SQL (generate_series), so ×100 loads in seconds; each step only runs once the feature's
 * table exists, so the generator grows with the schema.
 */
export interface GeneratedCoop {
  name: string;
  cooperativeId: string;
  openSeasonId: string;
  lastSeasonId: string;
  coordinatorEmail: string;
  memberEmail: string;
  password: string;
  counts: Record<string, number>;
}

export const SCALE_TIME_ZONE = 'America/New_York';
/** Each evaporator boils 100 runs of the season; two per unit of scale. */
const EVAPORATORS_PER_UNIT = 2;
const HOUSEHOLDS_PER_UNIT = 20;
const LOTS_PER_UNIT = 2_000;
const RUNS_PER_UNIT = 200;
/** Accepted lots of the last hours still waiting in the Boil queue, per unit of scale. */
const WAITING_PER_UNIT = 40;
const SYRUP_BRIX = 66.9;
/** Heating oil for the season, per litre (the evaporators burn oil). */
const OIL_CENTS_PER_L = 110;

/** The shape of a generated co-op: how many of each, and its name and sign-in domain. */
export interface CoopSpec {
  name: string;
  /** E-mail domain of its people: coordinator@, sugarmaker@, member-00001@ … */
  domain: string;
  households: number;
  lots: number;
  runs: number;
  /** Accepted lots left in the queue (the latest ones). */
  waiting: number;
  evaporators: number;
  timeZone?: string;
  unitSystem?: 'us' | 'metric';
  currency?: string;
}

/** The benchmark co-op of scale N: 20 households, 2,000 lots and 200 runs per unit. */
export function scaleSpec(scale: number): CoopSpec {
  if (!Number.isInteger(scale) || scale < 1 || scale > 1000) throw new RangeError('The scale is a whole number from 1 to 1000.');
  return {
    name: `Scale ×${scale} Cooperative`,
    domain: `scale-${scale}.example`,
    households: HOUSEHOLDS_PER_UNIT * scale,
    lots: LOTS_PER_UNIT * scale,
    runs: RUNS_PER_UNIT * scale,
    waiting: WAITING_PER_UNIT * scale,
    evaporators: EVAPORATORS_PER_UNIT * scale,
  };
}

async function tableExists(sequelize: Sequelize, name: string, transaction: Transaction) {
  const [row] = await sequelize.query<{ t: string | null }>('SELECT to_regclass(:name)::text AS t', {
    replacements: { name },
    type: QueryTypes.SELECT,
    transaction,
  });
  return row?.t != null;
}

async function count(sequelize: Sequelize, table: string, cooperativeId: string, transaction: Transaction) {
  const [row] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM ${table} WHERE cooperative_id = :cooperativeId`, {
    replacements: { cooperativeId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return Number(row.n);
}

/** Feature tables, children first: deleted explicitly because some keys restrict deletion. */
const OWNED_TABLES = [
  'payments', 'settlements', 'allocation_revisions', 'allocations', 'season_fees',
  'run_inputs', 'syrup_draws', 'fuel_uses', 'boil_runs', 'delivery_revisions', 'sap_deliveries',
];

/** Removes a generated co-op (by name) and everything of it. */
export async function dropCoop(sequelize: Sequelize, name: string, transaction: Transaction) {
  const [coop] = await sequelize.query<{ id: string }>('SELECT id FROM cooperatives WHERE name = :name', {
    replacements: { name },
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!coop) return;
  for (const table of OWNED_TABLES) {
    if (await tableExists(sequelize, table, transaction)) {
      await sequelize.query(`DELETE FROM ${table} WHERE cooperative_id = :id`, { replacements: { id: coop.id }, transaction });
    }
  }
  await sequelize.query('DELETE FROM cooperatives WHERE id = :id', { replacements: { id: coop.id }, transaction });
}

/** Generates (or regenerates) the benchmark co-op of scale `scale` (npm run db:seed -- --scale N). */
export function seedScale(sequelize: Sequelize, scale: number, options: { now?: Date } = {}): Promise<GeneratedCoop> {
  return seedCoop(sequelize, scaleSpec(scale), options);
}

/**
 * Generates (or regenerates) a co-op of the given shape. The open season began 35 days before
 * `now` and ends 25 days after; last year's season has the same shape and is settled.
 */
export async function seedCoop(sequelize: Sequelize, spec: CoopSpec, { now = new Date() }: { now?: Date } = {}): Promise<GeneratedCoop> {
  const zone = spec.timeZone ?? SCALE_TIME_ZONE;
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const today = DateTime.fromJSDate(now, { zone }).startOf('day');
  const opens = today.minus({ days: 35 });
  const closes = today.plus({ days: 25 });
  const { households, evaporators } = spec;
  const email = (who: string) => `${who}@${spec.domain}`;

  return sequelize.transaction(async (transaction) => {
    const q = (sql: string, replacements: Record<string, unknown> = {}) =>
      sequelize.query(sql, { replacements, transaction });
    const one = async <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
      (await sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction }))[0];

    await dropCoop(sequelize, spec.name, transaction);
    const { id: cooperativeId } = await one<{ id: string }>(
      `INSERT INTO cooperatives (name, time_zone, elevation_m, unit_system, currency)
       VALUES (:name, :zone, 280, :units, :currency) RETURNING id`,
      { name: spec.name, zone, units: spec.unitSystem ?? 'us', currency: spec.currency ?? 'USD' },
    );
    const { id: openSeasonId } = await one<{ id: string }>(
      `INSERT INTO seasons (cooperative_id, label, starts_on, ends_on, status, fuel_price_cents)
       VALUES (:cooperativeId, :label, :startsOn, :endsOn, 'open', ${OIL_CENTS_PER_L}) RETURNING id`,
      { cooperativeId, label: `Season ${opens.year}`, startsOn: opens.toISODate(), endsOn: closes.toISODate() },
    );
    const { id: lastSeasonId } = await one<{ id: string }>(
      `INSERT INTO seasons (cooperative_id, label, starts_on, ends_on, status, fuel_price_cents)
       VALUES (:cooperativeId, :label, :startsOn, :endsOn, 'settled', ${OIL_CENTS_PER_L - 8}) RETURNING id`,
      {
        cooperativeId,
        label: `Season ${opens.year - 1}`,
        startsOn: opens.minus({ years: 1 }).toISODate(),
        endsOn: closes.minus({ years: 1 }).toISODate(),
      },
    );
    // Large oil-fired evaporators: about 950 L of water an hour.
    await q(
      `INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind)
       SELECT :cooperativeId, 'Evaporator ' || lpad(g::text, 3, '0'), 950, 'oil' FROM generate_series(1, :evaporators) g`,
      { cooperativeId, evaporators },
    );
    await q(
      `INSERT INTO households (cooperative_id, name)
       SELECT :cooperativeId, 'Hillside ' || lpad(g::text, 5, '0') FROM generate_series(1, :households) g`,
      { cooperativeId, households },
    );
    await q(
      `INSERT INTO users (cooperative_id, household_id, name, email, password_hash, role)
       SELECT :cooperativeId, h.id, 'Member of ' || h.name, 'member-' || substr(h.name, 10) || '@' || :domain, :hash, 'member'
         FROM households h WHERE h.cooperative_id = :cooperativeId;
       INSERT INTO users (cooperative_id, household_id, name, email, password_hash, role) VALUES
         (:cooperativeId, NULL, 'Generated Coordinator', :coordinator, :hash, 'coordinator'),
         (:cooperativeId, NULL, 'Generated Sugarmaker', :sugarmaker, :hash, 'sugarmaker')`,
      { cooperativeId, domain: spec.domain, hash, coordinator: email('coordinator'), sugarmaker: email('sugarmaker') },
    );

    // Two slots a day on every evaporator across the whole season (07–12 and 13–18 local
    // time), crewed by the households in turn; past ones are done.
    await q(
      `WITH e AS (SELECT id, row_number() OVER (ORDER BY name) AS n FROM evaporators WHERE cooperative_id = :cooperativeId),
            h AS (SELECT id, row_number() OVER (ORDER BY name) - 1 AS n FROM households WHERE cooperative_id = :cooperativeId),
            s AS (
              SELECT e.id AS evaporator_id, e.n AS en, d, half,
                     ((:opens::date + d) + make_time(CASE half WHEN 0 THEN 7 ELSE 13 END, 0, 0)) AT TIME ZONE :zone AS starts_at
                FROM e, generate_series(0, :days) d, generate_series(0, 1) half)
       INSERT INTO boil_slots (cooperative_id, season_id, evaporator_id, household_id, starts_at, ends_at, crew, expected_sap_l, status)
       SELECT :cooperativeId, :openSeasonId, s.evaporator_id, h.id, s.starts_at, s.starts_at + interval '5 hours',
              ARRAY['Crew of ' || s.en], 2500 + 100 * ((s.d + s.en) % 10),
              (CASE WHEN s.starts_at + interval '5 hours' < :now THEN 'done' ELSE 'booked' END)::boil_slot_status
         FROM s JOIN h ON h.n = (s.d * 2 + s.half + s.en * 7) % :households`,
      {
        cooperativeId,
        openSeasonId,
        opens: opens.toISODate(),
        days: Math.round(closes.diff(opens, 'days').days),
        zone,
        households,
        now,
      },
    );

    const steps: [string, (ctx: StepContext) => Promise<void>][] = [];
    const ctx: StepContext = { sequelize, transaction, spec, zone, cooperativeId, openSeasonId, lastSeasonId, now, today, opens, q, one };
    for (const [table, step] of SCALE_STEPS) {
      if (await tableExists(sequelize, table, transaction)) steps.push([table, step]);
    }
    for (const [, step] of steps) await step(ctx);

    const counts: Record<string, number> = {};
    for (const table of ['households', 'users', 'evaporators', 'boil_slots', 'sap_deliveries', 'boil_runs', 'run_inputs', 'syrup_draws', 'fuel_uses', 'allocations']) {
      if (await tableExists(sequelize, table, transaction)) counts[table] = await count(sequelize, table, cooperativeId, transaction);
    }
    return {
      name: spec.name,
      cooperativeId,
      openSeasonId,
      lastSeasonId,
      coordinatorEmail: email('coordinator'),
      memberEmail: email('member-00001'),
      password: DEMO_PASSWORD,
      counts,
    };
  });
}

export interface StepContext {
  sequelize: Sequelize;
  transaction: Transaction;
  spec: CoopSpec;
  zone: string;
  cooperativeId: string;
  openSeasonId: string;
  lastSeasonId: string;
  now: Date;
  today: DateTime;
  opens: DateTime;
  q: (sql: string, replacements?: Record<string, unknown>) => Promise<unknown>;
  one: <T extends object>(sql: string, replacements?: Record<string, unknown>) => Promise<T>;
}

/**
 * Sap lots across the open season so far: every household delivers in turn, 150–650 L, its
 * own sweetness (1.4–3.2 °Bx, as from red-maple-heavy to sugar-maple-heavy bushes), collected
 * the day it arrives or the day before; one lot in 50 rejected as cloudy, with its reason.
 */
async function lots({ q, spec, zone, cooperativeId, openSeasonId, opens, now }: StepContext) {
  await q(
    `WITH h AS (SELECT id, row_number() OVER (ORDER BY name) - 1 AS n FROM households WHERE cooperative_id = :cooperativeId),
          sm AS (SELECT id FROM users WHERE cooperative_id = :cooperativeId AND role = 'sugarmaker' LIMIT 1),
          g AS (SELECT g, (:opens::timestamptz + (:now::timestamptz - :opens::timestamptz) * ((g - 0.5) / :total)) AS received_at
                  FROM generate_series(1, :total) g)
     INSERT INTO sap_deliveries (cooperative_id, season_id, household_id, received_at, collected_on, volume_l, brix, sap_temp_c,
                                 clarity, contamination, sugar_maple_pct, red_maple_pct, other_pct, recommendation, status,
                                 reason, logged_by, idempotency_key)
     SELECT :cooperativeId, :openSeasonId, h.id, g.received_at,
            ((g.received_at AT TIME ZONE :zone)::date - (g.g % 2)),
            150 + (g.g * 37) % 501,
            round(least(3.2, 1.4 + (h.n % 10) * 0.18 + ((g.g * 7) % 5) * 0.04)::numeric, 1),
            2 + (g.g % 5),
            (CASE WHEN g.g % 50 = 0 THEN 'cloudy' ELSE 'clear' END)::sap_clarity,
            'none',
            40 + (h.n % 10) * 6, 60 - (h.n % 10) * 6, 0,
            (CASE WHEN g.g % 50 = 0 THEN 'reject' ELSE 'accept' END)::delivery_decision,
            (CASE WHEN g.g % 50 = 0 THEN 'rejected' ELSE 'accepted' END)::delivery_status,
            CASE WHEN g.g % 50 = 0 THEN 'Cloudy sap: past its best.' END,
            (SELECT id FROM sm), 'generated-' || :cooperativeId || '-' || g.g
       FROM g JOIN h ON h.n = (g.g * 13) % :households`,
    {
      cooperativeId,
      openSeasonId,
      opens: opens.toISO(),
      now,
      total: spec.lots,
      households: spec.households,
      zone,
    },
  );
}

/**
 * Finished boil runs over the season so far: the accepted lots in order of arrival, about ten
 * whole lots a run, each run starting half an hour after its last lot arrived and lasting three
 * hours, on the evaporators in turn; the latest lots stay in the queue. Each run's syrup is 95 %
 * of what its sugar allows at 66.9 °Bx (lib/sugar), drawn off twice, lighter early in the
 * season and darker later; its oil is one litre per 40 L of water evaporated (from memory: the
 * order of an oil-fired evaporator's burn).
 */
async function runs({ q, sequelize, transaction, spec, cooperativeId, openSeasonId, opens, now }: StepContext) {
  // Which lots each run boils (the same rows for both statements below). Two statements joined
  // through boil_runs' unique (season, run number) index, not one joined to an INSERT's
  // RETURNING: the planner cannot estimate that and nested-looped 200,000 × 20,000 at ×100.
  const boil = `sm AS (SELECT id FROM users WHERE cooperative_id = :cooperativeId AND role = 'sugarmaker' LIMIT 1),
          lots AS (SELECT id, received_at, volume_l, row_number() OVER (ORDER BY received_at, id) AS i, count(*) OVER () AS n
                     FROM sap_deliveries WHERE cooperative_id = :cooperativeId AND season_id = :openSeasonId AND status = 'accepted'),
          boil AS (SELECT id, received_at, volume_l, ceil(i * :runs::numeric / (n - :waiting))::int AS r FROM lots WHERE i <= n - :waiting)`;
  const replacements = {
    cooperativeId,
    openSeasonId,
    runs: spec.runs,
    waiting: spec.waiting,
    evaporators: spec.evaporators,
    year: String(opens.year),
    now,
  };
  await q(
    `WITH ${boil},
          planned AS (SELECT r, max(received_at) + interval '30 minutes' AS started_at FROM boil GROUP BY r),
          e AS (SELECT id, row_number() OVER (ORDER BY name) - 1 AS k FROM evaporators WHERE cooperative_id = :cooperativeId)
     INSERT INTO boil_runs (cooperative_id, season_id, evaporator_id, run_number, lot_code, status, started_at, finished_at,
                            started_by_id, finished_by_id)
     SELECT :cooperativeId, :openSeasonId, e.id, p.r, :year || '-' || lpad(p.r::text, greatest(3, length(p.r::text)), '0'), 'finished', p.started_at,
            least(p.started_at + interval '3 hours', :now::timestamptz), (SELECT id FROM sm), (SELECT id FROM sm)
       FROM planned p JOIN e ON e.k = (p.r - 1) % :evaporators`,
    replacements,
  );
  await q(
    `WITH ${boil}
     INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres, taken_at, taken_by_id)
     SELECT :cooperativeId, made.id, b.id, b.volume_l, made.started_at, (SELECT id FROM sm)
       FROM boil b JOIN boil_runs made ON made.season_id = :openSeasonId AND made.run_number = b.r`,
    replacements,
  );

  const inputs = await sequelize.query<{ runId: string; startedAt: Date; finishedAt: Date; volumeL: number; brix: number }>(
    `SELECT r.id AS "runId", r.started_at AS "startedAt", r.finished_at AS "finishedAt", d.volume_l AS "volumeL", d.brix::float8 AS brix
       FROM run_inputs ri JOIN boil_runs r ON r.id = ri.run_id JOIN sap_deliveries d ON d.id = ri.delivery_id
      WHERE ri.cooperative_id = :cooperativeId ORDER BY r.id`,
    { replacements: { cooperativeId }, type: QueryTypes.SELECT, transaction },
  );
  const perRun = new Map<string, { startedAt: Date; finishedAt: Date; syrupL: number; waterL: number }>();
  for (const i of inputs) {
    const run = perRun.get(i.runId) ?? { startedAt: i.startedAt, finishedAt: i.finishedAt, syrupL: 0, waterL: 0 };
    run.syrupL += syrupLitres(i.volumeL, i.brix, SYRUP_BRIX);
    run.waterL += waterToEvaporateL(i.volumeL, i.brix, SYRUP_BRIX);
    perRun.set(i.runId, run);
  }
  const span = now.getTime() - opens.toMillis();
  const draws = { run: [] as string[], at: [] as Date[], litres: [] as number[], tr: [] as number[], grade: [] as string[] };
  const fuel = { run: [] as string[], at: [] as Date[], litres: [] as number[], cents: [] as number[] };
  for (const [runId, r] of perRun) {
    const progress = Math.min(1, Math.max(0, (r.startedAt.getTime() - opens.toMillis()) / span));
    const syrup = Math.round(r.syrupL * 0.95 * 1000) / 1000;
    const first = Math.round(syrup * 0.45 * 1000) / 1000;
    const mid = new Date((r.startedAt.getTime() + r.finishedAt.getTime()) / 2);
    for (const [at, litres, shade] of [
      [mid, first, 0],
      [r.finishedAt, Math.round((syrup - first) * 1000) / 1000, 4],
    ] as const) {
      const transmittance = Math.round((84 - 62 * progress - shade) * 10) / 10;
      draws.run.push(runId);
      draws.at.push(at);
      draws.litres.push(litres);
      draws.tr.push(transmittance);
      draws.grade.push(gradeClass(transmittance));
    }
    const oilL = Math.round((r.waterL / 40) * 10) / 10;
    fuel.run.push(runId);
    fuel.at.push(r.finishedAt);
    fuel.litres.push(oilL);
    fuel.cents.push(Math.round(oilL * OIL_CENTS_PER_L));
  }
  await sequelize.query(
    `INSERT INTO syrup_draws (cooperative_id, run_id, drawn_at, litres, brix, transmittance_pct, grade_class, temperature_c)
     SELECT $1, run, at, litres, ${SYRUP_BRIX}, tr, grade, 104
       FROM unnest($2::uuid[], $3::timestamptz[], $4::float8[], $5::float8[], $6::text[]) AS t(run, at, litres, tr, grade)`,
    { bind: [cooperativeId, draws.run, draws.at, draws.litres, draws.tr, draws.grade], transaction },
  );
  await sequelize.query(
    `INSERT INTO fuel_uses (cooperative_id, run_id, kind, quantity, unit, cost_cents, recorded_at)
     SELECT $1, run, 'oil', litres, 'litre', cents, at
       FROM unnest($2::uuid[], $3::timestamptz[], $4::float8[], $5::int[]) AS t(run, at, litres, cents)`,
    { bind: [cooperativeId, fuel.run, fuel.at, fuel.litres, fuel.cents], transaction },
  );
}

/**
 * Each finished run's allocation, as finishing it through the Runs API makes it: the season
 * ledger's own rule (lib/ledger/rules, by sugar through lib/sugar), stored in bulk.
 */
async function allocations({ sequelize, transaction, cooperativeId, openSeasonId }: StepContext) {
  const select = <T extends object>(sql: string) => sequelize.query<T>(sql, { replacements: { cooperativeId }, type: QueryTypes.SELECT, transaction });
  const inputs = await select<{ runId: string; householdId: string; litres: number; brix: number }>(
    `SELECT ri.run_id AS "runId", d.household_id AS "householdId", ri.litres, d.brix::float8 AS brix
       FROM run_inputs ri JOIN sap_deliveries d ON d.id = ri.delivery_id
      WHERE ri.cooperative_id = :cooperativeId AND d.status = 'accepted' ORDER BY ri.created_at, ri.id`,
  );
  const draws = await select<{ runId: string; litres: number; gradeClass: GradeClass }>(
    'SELECT run_id AS "runId", litres, grade_class AS "gradeClass" FROM syrup_draws WHERE cooperative_id = :cooperativeId',
  );
  const fuel = await select<{ runId: string; cents: string }>(
    'SELECT run_id AS "runId", sum(cost_cents) AS cents FROM fuel_uses WHERE cooperative_id = :cooperativeId GROUP BY run_id',
  );
  const group = <T extends { runId: string }>(xs: T[]) => {
    const m = new Map<string, T[]>();
    for (const x of xs) m.set(x.runId, [...(m.get(x.runId) ?? []), x]);
    return m;
  };
  const inputsOf = group(inputs);
  const drawsOf = group(draws);
  const fuelOf = new Map(fuel.map((f) => [f.runId, Number(f.cents)]));
  const cols = { run: [] as string[], household: [] as string[], sap: [] as number[], sugar: [] as number[], share: [] as number[] };
  const ml = { golden: [] as number[], amber: [] as number[], dark: [] as number[], veryDark: [] as number[], fuel: [] as number[] };
  for (const [runId, runInputs] of inputsOf) {
    for (const a of allocateRunRows(runInputs, drawsOf.get(runId) ?? [], fuelOf.get(runId) ?? 0)) {
      cols.run.push(runId);
      cols.household.push(a.householdId);
      cols.sap.push(a.sapL);
      cols.sugar.push(a.sugarKg);
      cols.share.push(a.share);
      ml.golden.push(a.syrupByClassMl.golden);
      ml.amber.push(a.syrupByClassMl.amber);
      ml.dark.push(a.syrupByClassMl.dark);
      ml.veryDark.push(a.syrupByClassMl['very-dark']);
      ml.fuel.push(a.fuelCents);
    }
  }
  await sequelize.query(
    `INSERT INTO allocations (cooperative_id, season_id, run_id, household_id, sap_l, sugar_kg, share,
                              syrup_golden_ml, syrup_amber_ml, syrup_dark_ml, syrup_very_dark_ml, fuel_cents)
     SELECT $1, $2, run, household, sap, sugar, share, g, a, d, v, f
       FROM unnest($3::uuid[], $4::uuid[], $5::float8[], $6::float8[], $7::float8[], $8::int[], $9::int[], $10::int[], $11::int[], $12::int[])
         AS t(run, household, sap, sugar, share, g, a, d, v, f)`,
    {
      bind: [cooperativeId, openSeasonId, cols.run, cols.household, cols.sap, cols.sugar, cols.share, ml.golden, ml.amber, ml.dark, ml.veryDark, ml.fuel],
      transaction,
    },
  );
}

/** Feature tables filled once they exist, in dependency order. */
const SCALE_STEPS: [string, (ctx: StepContext) => Promise<void>][] = [
  ['sap_deliveries', lots],
  ['boil_runs', runs],
  ['allocations', allocations],
];

