import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/db/models';
import type { Ctx } from '@/lib/server/context';
import { planBoiling, type WaitingLot } from '@/lib/planning/rules';
import { collectionStart } from '@/lib/deliveries/rules';
import { spoilageDeadline } from '@/lib/sugar';
import type { PlanningDto } from './types';
import { keptJson, processCache } from '@/lib/server/versioned-cache';
export type { PlanningDto };

interface PlanningRow {
  timeZone: string;
  syrupBrix: number;
  shelfDays: number;
  warmAboveC: number;
  warmShelfDays: number;
  evaporatorId: string | null;
  evaporationLph: number | null;
  /** [litres left, °Brix, collected on, sap °C] of each waiting lot. */
  lots: [number, number, string, number][] | null;
  /** [starts, ends] of each booked slot still ahead, in epoch milliseconds. */
  slots: [number, number][] | null;
}

// One statement: the co-op's settings, its first evaporator, the sap waiting and the booked time ahead.
// Accepted sap not yet boiled counts: the litres of every accepted lot of the open season not yet
// taken into a run (rejected lots never count).
const PLANNING_SQL = `
WITH e AS (
  SELECT id, evaporation_lph FROM evaporators WHERE cooperative_id = $cooperativeId ORDER BY name LIMIT 1
)
SELECT c.time_zone AS "timeZone", c.syrup_brix AS "syrupBrix", c.shelf_days AS "shelfDays",
       c.warm_above_c AS "warmAboveC", c.warm_shelf_days AS "warmShelfDays",
       e.id AS "evaporatorId", e.evaporation_lph AS "evaporationLph",
       (SELECT json_agg(json_build_array(d.volume_l - d.litres_boiled, d.brix::float8, d.collected_on, d.sap_temp_c))
          FROM sap_deliveries d JOIN seasons s ON s.id = d.season_id AND s.status = 'open'
         WHERE d.cooperative_id = c.id AND d.status = 'accepted' AND d.litres_boiled < d.volume_l AND d.brix > 0) AS lots,
       (SELECT json_agg(json_build_array((extract(epoch FROM b.starts_at) * 1000)::float8, (extract(epoch FROM b.ends_at) * 1000)::float8))
          FROM boil_slots b
         WHERE b.cooperative_id = c.id AND b.evaporator_id = e.id AND b.status = 'booked' AND b.ends_at > $now) AS slots
  FROM cooperatives c LEFT JOIN e ON true
 WHERE c.id = $cooperativeId`;

// One co-op's planning strip is a few kilobytes of JSON.
const plans = processCache<string>('planning', 4 * 2 ** 20, (json) => 2 * json.length);
/** The strip's times run from the moment it is worked out: a kept one serves for this long. */
const PLAN_FRESH_MS = 5_000;

/**
 * `GET /api/planning` as JSON text, kept per co-op change version (lots, runs, bookings and
 * settings all bump it) for at most five seconds, since its times count from the present.
 * `knownVersion` is the version read with the person in this request.
 */
export async function planningJson(ctx: Ctx, { knownVersion, now = new Date() }: { knownVersion?: string; now?: Date } = {}): Promise<string> {
  const key = `${ctx.cooperativeId}|${Math.floor(now.getTime() / PLAN_FRESH_MS)}`;
  return keptJson(plans, key, { knownVersion, transaction: ctx.transaction }, () => getPlanning(ctx, { now }));
}

/** The planning strip of the Boil calendar for a co-op's first evaporator: one query, plain rows. */
export async function getPlanning(ctx: Ctx, { now = new Date() }: { now?: Date } = {}): Promise<PlanningDto> {
  const [row] = await db().sequelize.query<PlanningRow>(PLANNING_SQL, {
    bind: { cooperativeId: ctx.cooperativeId, now: now.toISOString() },
    type: QueryTypes.SELECT,
    transaction: ctx.transaction,
  });
  const lots: WaitingLot[] = [];
  if (row?.lots) {
    const spoilage = { shelfDays: row.shelfDays, warmAboveC: row.warmAboveC, warmShelfDays: Math.min(row.warmShelfDays, row.shelfDays) };
    // Lots share a few collection days: each day's start in the co-op's zone is worked out once.
    const dayStarts = new Map<string, Date>();
    for (const [litres, brix, collectedOn, sapTempC] of row.lots) {
      let start = dayStarts.get(collectedOn);
      if (!start) dayStarts.set(collectedOn, (start = collectionStart(collectedOn, row.timeZone)));
      lots.push({ litres, brix, deadline: spoilageDeadline(start, { ...spoilage, sapTempC }) });
    }
  }
  const plan = planBoiling({
    lots,
    slots: (row?.slots ?? []).map(([s, e]) => ({ startsAt: new Date(s), endsAt: new Date(e) })),
    evaporationLph: row?.evaporationLph ?? 1,
    syrupBrix: row?.syrupBrix ?? 66.9,
    now,
  });
  return { ...plan, evaporatorId: row?.evaporatorId ?? null, evaporationLph: row?.evaporationLph ?? null };
}
