// Server code without the 'server-only' marker: server.ts (plain Node) computes snapshots too.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { getSequelize } from '@/db';
import { currentVersion } from '@/lib/events';
import type { GradeClass } from '@/lib/sugar';
import { computeQueue, type QueueInput } from './rules';
import type { QueueSnapshot } from './types';

interface Row {
  coop: { version: string; syrup_brix: number; shelf_days: number; warm_above_c: number; warm_shelf_days: number } | null;
  evaporator: { id: string; name: string; evaporation_lph: number } | null;
  run: { id: string; lot_code: string; evaporator_id: string; name: string; evaporation_lph: number; started_at: string } | null;
  run_inputs: [number, number][] | null;
  run_draws: [string, string, number, number, number | null, GradeClass][] | null;
  lots: [string, string, string, string, string, string, number, number, number][] | null;
  slots: [string, string][] | null;
  drawn_today: number | null;
}

// One statement, so every part is read from the same database snapshot as the version it carries.
const SQL = `
WITH c AS (
  SELECT id, change_version::text AS version, time_zone, syrup_brix, shelf_days, warm_above_c, warm_shelf_days
    FROM cooperatives WHERE id = :coop
), run AS (
  SELECT r.id, r.lot_code, r.evaporator_id, e.name, e.evaporation_lph, r.started_at
    FROM boil_runs r JOIN evaporators e ON e.id = r.evaporator_id
   WHERE r.cooperative_id = :coop AND r.status = 'running'
   ORDER BY r.started_at LIMIT 1
)
SELECT
  (SELECT json_build_object('version', version, 'syrup_brix', syrup_brix, 'shelf_days', shelf_days,
          'warm_above_c', warm_above_c, 'warm_shelf_days', warm_shelf_days) FROM c) AS coop,
  (SELECT json_build_object('id', id, 'name', name, 'evaporation_lph', evaporation_lph)
     FROM evaporators WHERE cooperative_id = :coop ORDER BY name LIMIT 1) AS evaporator,
  (SELECT row_to_json(run) FROM run) AS run,
  (SELECT json_agg(json_build_array(i.litres, d.brix::float8))
     FROM run_inputs i JOIN sap_deliveries d ON d.id = i.delivery_id
    WHERE i.run_id = (SELECT id FROM run)) AS run_inputs,
  (SELECT json_agg(json_build_array(s.id, s.drawn_at, s.litres, s.brix, s.transmittance_pct, s.grade_class) ORDER BY s.drawn_at)
     FROM syrup_draws s WHERE s.run_id = (SELECT id FROM run)) AS run_draws,
  (SELECT json_agg(json_build_array(d.id, d.household_id, h.name, d.received_at, d.collected_on,
            (d.collected_on::timestamp AT TIME ZONE (SELECT time_zone FROM c)),
            d.volume_l - d.litres_boiled, d.brix::float8, d.sap_temp_c))
     FROM sap_deliveries d
     JOIN households h ON h.id = d.household_id
     JOIN seasons s ON s.id = d.season_id AND s.status IN ('planned', 'open')
    WHERE d.cooperative_id = :coop AND d.status = 'accepted' AND d.litres_boiled < d.volume_l) AS lots,
  (SELECT json_agg(json_build_array(starts_at, ends_at))
     FROM boil_slots WHERE cooperative_id = :coop AND status = 'booked' AND ends_at > :now) AS slots,
  (SELECT sum(litres) FROM syrup_draws
    WHERE cooperative_id = :coop
      AND drawn_at >= (date_trunc('day', :now::timestamptz AT TIME ZONE (SELECT time_zone FROM c)) AT TIME ZONE (SELECT time_zone FROM c))) AS drawn_today
`;

/** Reads what the queue is computed from, in one SQL statement. */
export async function loadQueueInput(cooperativeId: string, now: Date, transaction?: Transaction, sequelize: Sequelize = getSequelize()): Promise<QueueInput | null> {
  const [row] = await sequelize.query<Row>(SQL, {
    replacements: { coop: cooperativeId, now: now.toISOString() },
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!row?.coop) return null;
  const { coop } = row;
  return {
    version: Number(coop.version),
    now,
    evaporator: row.evaporator && { id: row.evaporator.id, name: row.evaporator.name, evaporationLph: row.evaporator.evaporation_lph },
    syrupBrix: coop.syrup_brix,
    spoilage: { shelfDays: coop.shelf_days, warmAboveC: coop.warm_above_c, warmShelfDays: coop.warm_shelf_days },
    run: row.run && {
      id: row.run.id,
      lotCode: row.run.lot_code,
      evaporatorId: row.run.evaporator_id,
      evaporatorName: row.run.name,
      evaporationLph: row.run.evaporation_lph,
      startedAt: new Date(row.run.started_at),
      inputs: (row.run_inputs ?? []).map(([litres, brix]) => ({ litres, brix })),
      draws: (row.run_draws ?? []).map(([id, drawnAt, litres, brix, transmittancePct, gradeClass]) => ({
        id,
        drawnAt: new Date(drawnAt),
        litres,
        brix,
        transmittancePct,
        gradeClass,
      })),
    },
    lots: (row.lots ?? []).map(([deliveryId, householdId, householdName, receivedAt, collectedOn, collectedAt, litresLeft, brix, sapTempC]) => ({
      deliveryId,
      householdId,
      householdName,
      receivedAt: new Date(receivedAt),
      collectedOn,
      collectedAt: new Date(collectedAt),
      litresLeft,
      brix,
      sapTempC,
    })),
    bookedSlots: (row.slots ?? []).map(([s, e]) => ({ startsAt: new Date(s), endsAt: new Date(e) })),
    syrupDrawnTodayL: Number(row.drawn_today ?? 0),
  };
}

/** Computes a fresh snapshot from the database. */
export async function computeSnapshot(cooperativeId: string, now = new Date(), sequelize?: Sequelize): Promise<QueueSnapshot | null> {
  const input = await loadQueueInput(cooperativeId, now, undefined, sequelize);
  return input ? computeQueue(input) : null;
}

interface Cached {
  snapshot: QueueSnapshot;
  json: string;
  at: number;
}

// The latest snapshot per co-op, shared by server.ts and the route handlers' bundle.
const globalForQueue = globalThis as unknown as { __brixhouseQueueCache?: Map<string, Cached> };
const cache = () => (globalForQueue.__brixhouseQueueCache ??= new Map());

/** How long a snapshot stays good without a change: deadline states and ETAs move with the clock. */
const FRESH_MS = 15_000;

/** Keeps a snapshot unless a newer version is already cached. */
export function rememberSnapshot(cooperativeId: string, snapshot: QueueSnapshot): Cached {
  const prev = cache().get(cooperativeId);
  const entry = { snapshot, json: JSON.stringify(snapshot), at: Date.now() };
  if (!prev || prev.snapshot.version <= snapshot.version) cache().set(cooperativeId, entry);
  return entry;
}

/**
 * The co-op's current queue: the cached snapshot when its version is still the database's and it
 * is fresh (one cheap query, none when the caller read the version already), otherwise a new one. Answers the JSON text too, so a
 * busy GET formats nothing.
 */
export async function currentSnapshot(cooperativeId: string, knownVersion?: string): Promise<Cached | null> {
  const hit = cache().get(cooperativeId);
  if (hit && Date.now() - hit.at < FRESH_MS) {
    // A route handler read the version with the person already: a snapshot at it or later will do.
    if (knownVersion !== undefined && hit.snapshot.version >= Number(knownVersion)) return hit;
    const version = await currentVersion(getSequelize(), cooperativeId);
    if (version === hit.snapshot.version) return hit;
  }
  const snapshot = await computeSnapshot(cooperativeId);
  return snapshot ? rememberSnapshot(cooperativeId, snapshot) : null;
}
