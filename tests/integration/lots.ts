import { randomUUID } from 'node:crypto';
import { markChanged, rows, testDb } from './db';

/** The demo co-op's ids that the run and queue tests build on. */
export async function demoCoop() {
  const [c] = await rows<{ id: string; season_id: string; season_year: string }>(
    `SELECT c.id, s.id AS season_id, to_char(s.starts_on, 'YYYY') AS season_year
       FROM cooperatives c JOIN seasons s ON s.cooperative_id = c.id AND s.status = 'open'
      WHERE c.name = 'Larkspur Hollow Sugar Cooperative'`,
  );
  const households = await rows<{ id: string; name: string }>('SELECT id, name FROM households WHERE cooperative_id = :c ORDER BY name', { c: c.id });
  return { cooperativeId: c.id, seasonId: c.season_id, seasonYear: c.season_year, households };
}

/** An evaporator of the test's own, so its runs never meet another test's. */
export async function testEvaporator(cooperativeId: string, lph = 150): Promise<string> {
  const [e] = await rows<{ id: string }>(
    `INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind) VALUES (:c, :n, :lph, 'wood') RETURNING id`,
    { c: cooperativeId, n: `Test evaporator ${randomUUID().slice(0, 8)}`, lph },
  );
  return e.id;
}

/** A lot written straight into the table (the drop-off desk's own tests cover its form and API). */
export async function insertLot(
  co: { cooperativeId: string; seasonId: string },
  lot: { householdId: string; volumeL: number; brix: number; status?: 'accepted' | 'rejected'; collectedDaysAgo?: number; sapTempC?: number },
): Promise<string> {
  const rejected = lot.status === 'rejected';
  const [row] = await rows<{ id: string }>(
    `INSERT INTO sap_deliveries (cooperative_id, season_id, household_id, received_at, collected_on, volume_l, brix, sap_temp_c,
                                 clarity, contamination, recommendation, status, reason, idempotency_key)
     VALUES (:c, :s, :h, now(), (now() AT TIME ZONE 'America/New_York')::date - :days, :v, :b, :t,
             :clarity, 'none', :rec, :status, :reason, :key)
     RETURNING id`,
    {
      c: co.cooperativeId,
      s: co.seasonId,
      h: lot.householdId,
      days: lot.collectedDaysAgo ?? 1,
      v: lot.volumeL,
      b: lot.brix,
      t: lot.sapTempC ?? 3,
      clarity: rejected ? 'cloudy' : 'clear',
      rec: rejected ? 'reject' : 'accept',
      status: rejected ? 'rejected' : 'accepted',
      reason: rejected ? 'Cloudy sap' : null,
      key: `test-${randomUUID()}`,
    },
  );
  await markChanged(co.cooperativeId);
  return row.id;
}

export { testDb };
