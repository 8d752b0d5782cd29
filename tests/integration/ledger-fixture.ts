import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { DateTime } from 'luxon';
import { QueryTypes, type Transaction } from 'sequelize';
import { testDb } from './db';
import { DEMO_PASSWORD } from '../test-env';

/**
 * A small co-op of its own for the ledger tests (so the demo data never changes the figures):
 * three households, the worked example's lots and two finished runs, written straight to the
 * database as the drop-off desk and the Runs screen would; both runs are left running for the
 * test to finish through the Runs API. Dates are relative to now.
 */
export interface WorkedExample {
  cooperativeId: string;
  seasonId: string;
  evaporatorId: string;
  households: { ash: string; birch: string; cedar: string };
  emails: { coordinator: string; sugarmaker: string; ash: string; birch: string; cedar: string };
  lots: { ash: string; birch1: string; birch2: string; cedar: string; cedarRejected: string };
  runs: { run1: string; run2: string };
}

async function one<T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction): Promise<T> {
  const [row] = await testDb().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
  return row;
}

export async function makeWorkedExample({ currency = 'USD', unitSystem = 'metric' }: { currency?: string; unitSystem?: 'metric' | 'us' } = {}): Promise<WorkedExample> {
  const tag = randomUUID().slice(0, 8);
  const zone = 'America/New_York';
  const today = DateTime.now().setZone(zone).startOf('day');
  const hash = await bcrypt.hash(DEMO_PASSWORD, 4);
  return testDb().transaction(async (t) => {
    const q = <T extends object>(sql: string, r: Record<string, unknown>) => one<T>(sql, r, t);
    const { id: cooperativeId } = await q<{ id: string }>(
      `INSERT INTO cooperatives (name, time_zone, elevation_m, unit_system, currency) VALUES (:name, :zone, 300, :unitSystem, :currency) RETURNING id`,
      { name: `Thimbleberry Test Co-op ${tag}`, zone, unitSystem, currency },
    );
    const { id: seasonId } = await q<{ id: string }>(
      `INSERT INTO seasons (cooperative_id, label, starts_on, ends_on, status, fuel_price_cents)
       VALUES (:cooperativeId, :label, :starts, :ends, 'open', 26000) RETURNING id`,
      { cooperativeId, label: `Season ${today.year}`, starts: today.minus({ days: 12 }).toISODate(), ends: today.plus({ days: 20 }).toISODate() },
    );
    const { id: evaporatorId } = await q<{ id: string }>(
      `INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind) VALUES (:cooperativeId, 'Test arch', 150, 'wood') RETURNING id`,
      { cooperativeId },
    );
    const households = {} as WorkedExample['households'];
    const emails = {
      coordinator: `coordinator-${tag}@ledger-test.example`,
      sugarmaker: `sugarmaker-${tag}@ledger-test.example`,
    } as WorkedExample['emails'];
    for (const name of ['Ash', 'Birch', 'Cedar'] as const) {
      const key = name.toLowerCase() as 'ash' | 'birch' | 'cedar';
      households[key] = (await q<{ id: string }>(`INSERT INTO households (cooperative_id, name) VALUES (:cooperativeId, :name) RETURNING id`, { cooperativeId, name })).id;
      emails[key] = `${key}-${tag}@ledger-test.example`;
      await q(`INSERT INTO users (cooperative_id, household_id, name, email, password_hash, role) VALUES (:cooperativeId, :h, :name, :email, :hash, 'member') RETURNING id`, {
        cooperativeId,
        h: households[key],
        name: `${name} member`,
        email: emails[key],
        hash,
      });
    }
    for (const role of ['coordinator', 'sugarmaker'] as const) {
      await q(`INSERT INTO users (cooperative_id, name, email, password_hash, role) VALUES (:cooperativeId, :name, :email, :hash, :role) RETURNING id`, {
        cooperativeId,
        name: `Test ${role}`,
        email: emails[role],
        hash,
        role,
      });
    }
    const lot = async (household: string, volumeL: number, brix: number, daysAgo: number, status: 'accepted' | 'rejected' = 'accepted') =>
      (
        await q<{ id: string }>(
          `INSERT INTO sap_deliveries (cooperative_id, season_id, household_id, received_at, collected_on, volume_l, brix, sap_temp_c,
             clarity, contamination, recommendation, status, reason, idempotency_key)
           VALUES (:cooperativeId, :seasonId, :household, :receivedAt, :collectedOn, :volumeL, :brix, 3,
             :clarity, 'none', :recommendation, :status, :reason, :key) RETURNING id`,
          {
            cooperativeId,
            seasonId,
            household,
            receivedAt: today.minus({ days: daysAgo }).set({ hour: 9 }).toJSDate(),
            collectedOn: today.minus({ days: daysAgo }).toISODate(),
            volumeL,
            brix,
            clarity: status === 'rejected' ? 'cloudy' : 'clear',
            recommendation: status === 'rejected' ? 'reject' : 'accept',
            status,
            reason: status === 'rejected' ? 'Cloudy sap' : null,
            key: randomUUID(),
          },
        )
      ).id;
    const lots = {
      ash: await lot(households.ash, 400, 3.0, 8),
      birch1: await lot(households.birch, 200, 1.5, 8),
      birch2: await lot(households.birch, 200, 1.5, 4),
      cedar: await lot(households.cedar, 200, 2.0, 4),
      cedarRejected: await lot(households.cedar, 100, 2.5, 4, 'rejected'),
    };
    // Two evaporators, so both runs can be open for their finish through the Runs API.
    const { id: evaporator2 } = await q<{ id: string }>(
      `INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind) VALUES (:cooperativeId, 'Test arch 2', 150, 'wood') RETURNING id`,
      { cooperativeId },
    );
    const run = async (n: number, daysAgo: number) =>
      (
        await q<{ id: string }>(
          `INSERT INTO boil_runs (cooperative_id, season_id, evaporator_id, run_number, lot_code, status, started_at)
           VALUES (:cooperativeId, :seasonId, :evaporatorId, :n, :code, 'running', :startedAt) RETURNING id`,
          { cooperativeId, seasonId, evaporatorId: n === 1 ? evaporatorId : evaporator2, n, code: `${today.year}-${String(n).padStart(3, '0')}`, startedAt: today.minus({ days: daysAgo }).set({ hour: 8 }).toJSDate() },
        )
      ).id;
    const input = (runId: string, deliveryId: string, litres: number) =>
      q(`INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres) VALUES (:cooperativeId, :runId, :deliveryId, :litres) RETURNING id`, {
        cooperativeId,
        runId,
        deliveryId,
        litres,
      });
    const draw = (runId: string, litres: number, tc: number, gradeClass: string) =>
      q(`INSERT INTO syrup_draws (cooperative_id, run_id, drawn_at, litres, brix, transmittance_pct, grade_class) VALUES (:cooperativeId, :runId, now(), :litres, 66.9, :tc, :gradeClass) RETURNING id`, {
        cooperativeId,
        runId,
        litres,
        tc,
        gradeClass,
      });
    const fuel = (runId: string, cords: number, cents: number) =>
      q(`INSERT INTO fuel_uses (cooperative_id, run_id, kind, quantity, unit, cost_cents) VALUES (:cooperativeId, :runId, 'wood', :cords, 'cord', :cents) RETURNING id`, {
        cooperativeId,
        runId,
        cords,
        cents,
      });
    const run1 = await run(1, 7);
    await input(run1, lots.ash, 400);
    await input(run1, lots.birch1, 200);
    await draw(run1, 6.0, 80, 'golden');
    await draw(run1, 9.9, 60, 'amber');
    await fuel(run1, 0.5, 13000);
    const run2 = await run(2, 3);
    await input(run2, lots.birch2, 200);
    await input(run2, lots.cedar, 200);
    await draw(run2, 7.5, 30, 'dark');
    await fuel(run2, 0.25, 6500);
    await q(`INSERT INTO season_fees (season_id, cooperative_id, household_id, fee_cents) VALUES (:seasonId, :cooperativeId, :ash, 2500), (:seasonId, :cooperativeId, :cedar, 2500) RETURNING season_id`, {
      seasonId,
      cooperativeId,
      ash: households.ash,
      cedar: households.cedar,
    });
    return { cooperativeId, seasonId, evaporatorId, households, emails, lots, runs: { run1, run2 } };
  });
}
