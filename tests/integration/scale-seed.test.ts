import { afterAll, describe, expect, it } from 'vitest';
import { dropCoop, seedCoop, type CoopSpec } from '@/db/seeds/scale';
import { closeTestDb, rows, testDb } from './db';

// The benchmark's generated co-ops reach 2,000 runs a season at ×10 and 20,000 at ×100: their
// lot codes must stay distinct past run 999 (a three-digit pad once cut run 1240 to "124").
const MANY_RUNS: CoopSpec = {
  name: 'Thousand Runs Test Cooperative',
  domain: 'thousand-runs.example',
  households: 4,
  lots: 2_200,
  runs: 1_005,
  waiting: 10,
  evaporators: 2,
};

afterAll(async () => {
  await testDb().transaction((transaction) => dropCoop(testDb(), MANY_RUNS.name, transaction));
  await closeTestDb();
});

describe('generated co-ops (npm run db:seed -- --scale N)', () => {
  it('gives every run of a season past the 999th its own lot code, and never more syrup than its sugar allows', async () => {
    const coop = await seedCoop(testDb(), MANY_RUNS);
    expect(coop.counts.boil_runs).toBe(MANY_RUNS.runs);
    const [codes] = await rows<{ n: string; distinct: string; longest: number }>(
      `SELECT count(*) AS n, count(DISTINCT lot_code) AS distinct, max(length(lot_code)) AS longest
         FROM boil_runs WHERE cooperative_id = :id AND season_id = :season`,
      { id: coop.cooperativeId, season: coop.openSeasonId },
    );
    expect(Number(codes.distinct)).toBe(MANY_RUNS.runs);
    expect(codes.longest).toBe(9); // "YYYY-1005"
    const around = await rows<{ lot_code: string }>(
      `SELECT lot_code FROM boil_runs WHERE cooperative_id = :id AND run_number IN (100, 1000, 1005) ORDER BY run_number`,
      { id: coop.cooperativeId },
    );
    expect(around.map((r) => r.lot_code.slice(5))).toEqual(['100', '1000', '1005']);
    // Physically consistent: no run draws more syrup at 66.9 °Bx than the sugar it boiled
    // (sugar kg ÷ 0.669 of syrup mass, at about 1.33 kg/L: a loose bound, only to catch nonsense).
    const [worst] = await rows<{ ratio: number | null }>(
      `SELECT max(d.ml / 1000.0 * 1.33 * 0.669 / nullif(a.kg, 0))::float8 AS ratio
         FROM (SELECT run_id, sum(litres) * 1000 AS ml FROM syrup_draws WHERE cooperative_id = :id GROUP BY run_id) d
         JOIN (SELECT run_id, sum(sugar_kg) AS kg FROM allocations WHERE cooperative_id = :id GROUP BY run_id) a USING (run_id)`,
      { id: coop.cooperativeId },
    );
    expect(worst.ratio).not.toBeNull();
    expect(worst.ratio!).toBeLessThanOrEqual(1);
  }, 120_000);
});
