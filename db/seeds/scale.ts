import bcrypt from 'bcryptjs';
import { DateTime } from 'luxon';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { DEMO_PASSWORD } from '@/db/seeds/demo';

/**
 * A generated large co-op for benchmarks: per unit of scale 20 households, 2,000 sap lots and
 * 200 boil runs (and the slots, evaporators and people around them). Invented data only; the
 * co-op is called "Scale ×N" so it is never mistaken for the demo. Rows go in with set-based
 * SQL (generate_series), so ×100 loads in seconds; each step only runs once the feature's
 * table exists, so the generator grows with the schema.
 */
export interface ScaleSeed {
  scale: number;
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

export const scaleCoopName = (scale: number) => `Scale ×${scale} Cooperative`;
export const scaleEmail = (scale: number, who: string) => `${who}@scale-${scale}.example`;

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
const OWNED_TABLES = ['delivery_revisions', 'sap_deliveries'];

/** Removes a generated co-op of this scale and everything of it. */
export async function dropScale(sequelize: Sequelize, scale: number, transaction: Transaction) {
  const [coop] = await sequelize.query<{ id: string }>('SELECT id FROM cooperatives WHERE name = :name', {
    replacements: { name: scaleCoopName(scale) },
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

/**
 * Generates (or regenerates) the co-op of scale `scale`. The open season began 35 days before
 * `now` and ends 25 days after; last year's season has the same shape and is settled.
 */
export async function seedScale(sequelize: Sequelize, scale: number, { now = new Date() }: { now?: Date } = {}): Promise<ScaleSeed> {
  if (!Number.isInteger(scale) || scale < 1 || scale > 1000) throw new RangeError('The scale is a whole number from 1 to 1000.');
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const today = DateTime.fromJSDate(now, { zone: SCALE_TIME_ZONE }).startOf('day');
  const opens = today.minus({ days: 35 });
  const closes = today.plus({ days: 25 });
  const households = HOUSEHOLDS_PER_UNIT * scale;
  const evaporators = EVAPORATORS_PER_UNIT * scale;

  return sequelize.transaction(async (transaction) => {
    const q = (sql: string, replacements: Record<string, unknown> = {}) =>
      sequelize.query(sql, { replacements, transaction });
    const one = async <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
      (await sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction }))[0];

    await dropScale(sequelize, scale, transaction);
    const { id: cooperativeId } = await one<{ id: string }>(
      `INSERT INTO cooperatives (name, time_zone, elevation_m, unit_system, currency)
       VALUES (:name, :zone, 280, 'us', 'USD') RETURNING id`,
      { name: scaleCoopName(scale), zone: SCALE_TIME_ZONE },
    );
    const { id: openSeasonId } = await one<{ id: string }>(
      `INSERT INTO seasons (cooperative_id, label, starts_on, ends_on, status, fuel_price_cents)
       VALUES (:cooperativeId, :label, :startsOn, :endsOn, 'open', 26000) RETURNING id`,
      { cooperativeId, label: `Season ${opens.year}`, startsOn: opens.toISODate(), endsOn: closes.toISODate() },
    );
    const { id: lastSeasonId } = await one<{ id: string }>(
      `INSERT INTO seasons (cooperative_id, label, starts_on, ends_on, status, fuel_price_cents)
       VALUES (:cooperativeId, :label, :startsOn, :endsOn, 'settled', 24500) RETURNING id`,
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
       SELECT :cooperativeId, h.id, 'Member of ' || h.name, 'member-' || substr(h.name, 10) || '@scale-' || :scale || '.example', :hash, 'member'
         FROM households h WHERE h.cooperative_id = :cooperativeId;
       INSERT INTO users (cooperative_id, household_id, name, email, password_hash, role) VALUES
         (:cooperativeId, NULL, 'Scale Coordinator', :coordinator, :hash, 'coordinator'),
         (:cooperativeId, NULL, 'Scale Sugarmaker', :sugarmaker, :hash, 'sugarmaker')`,
      { cooperativeId, scale, hash, coordinator: scaleEmail(scale, 'coordinator'), sugarmaker: scaleEmail(scale, 'sugarmaker') },
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
        zone: SCALE_TIME_ZONE,
        households,
        now,
      },
    );

    const steps: [string, (ctx: StepContext) => Promise<void>][] = [];
    const ctx: StepContext = { sequelize, transaction, scale, cooperativeId, openSeasonId, lastSeasonId, now, today, opens, q, one };
    for (const [table, step] of SCALE_STEPS) {
      if (await tableExists(sequelize, table, transaction)) steps.push([table, step]);
    }
    for (const [, step] of steps) await step(ctx);

    const counts: Record<string, number> = {};
    for (const table of ['households', 'users', 'evaporators', 'boil_slots', ...SCALE_STEPS.map(([t]) => t)]) {
      if (await tableExists(sequelize, table, transaction)) counts[table] = await count(sequelize, table, cooperativeId, transaction);
    }
    return {
      scale,
      cooperativeId,
      openSeasonId,
      lastSeasonId,
      coordinatorEmail: scaleEmail(scale, 'coordinator'),
      memberEmail: scaleEmail(scale, 'member-00001'),
      password: DEMO_PASSWORD,
      counts,
    };
  });
}

export interface StepContext {
  sequelize: Sequelize;
  transaction: Transaction;
  scale: number;
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
async function lots({ q, scale, cooperativeId, openSeasonId, opens, now }: StepContext) {
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
            (SELECT id FROM sm), 'scale-' || :scale || '-' || g.g
       FROM g JOIN h ON h.n = (g.g * 13) % :households`,
    {
      cooperativeId,
      openSeasonId,
      opens: opens.toISO(),
      now,
      total: LOTS_PER_UNIT * scale,
      households: HOUSEHOLDS_PER_UNIT * scale,
      zone: SCALE_TIME_ZONE,
      scale,
    },
  );
}

/** Feature tables filled once they exist, in dependency order. */
const SCALE_STEPS: [string, (ctx: StepContext) => Promise<void>][] = [['sap_deliveries', lots]];

export const SCALE_SHAPE = { HOUSEHOLDS_PER_UNIT, LOTS_PER_UNIT, RUNS_PER_UNIT, EVAPORATORS_PER_UNIT };
