import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sugarKg } from '@/lib/sugar';
import { Client, signedIn } from './http';
import { closeTestDb, rows, testDb } from './db';
import { makeWorkedExample, type WorkedExample } from './ledger-fixture';
import { BASE_URL } from '../test-env';

/*
 * The worked example of three households (the same one is worked by hand in
 * tests/unit/ledger/rules.test.ts). Sugar from the density table of sucrose solutions at 20 °C,
 * CRC Handbook of Chemistry and Physics, "Concentrative properties of aqueous solutions" (after
 * NBS Circular C440, 1942): 1.0099 g/cm³ at 3 °Bx, 1.0060 at 2 °Bx, 1.00405 at 1.5 °Bx
 * (between the 1 and 2 °Bx rows).
 *   Ash    one lot of 400 L at 3.0 °Bx            → 400 × 1.0099 × 0.030  = 12.1188 kg
 *   Birch  two lots of 200 L at 1.5 °Bx           → 2 × 200 × 1.00405 × 0.015 = 6.0243 kg
 *   Cedar  200 L at 2.0 °Bx (and 100 L rejected)  → 200 × 1.0060 × 0.020  = 4.024 kg
 * Run 1 (Ash 400 L + Birch 200 L = 15.13095 kg): 6.000 L Golden, 9.900 L Amber, ½ cord = 13,000 ¢.
 *   Ash's share 0.800928 → Golden 4805.57 → 4806 mL (largest remainder), Birch 1194;
 *   Amber 7929.19 / 1970.81 → 7929 / 1971; fuel 10412.06 / 2587.94 → 10412 / 2588 ¢.
 * Run 2 (Birch 200 L + Cedar 200 L = 7.03615 kg): 7.500 L Dark, ¼ cord = 6,500 ¢.
 *   Birch's share 0.428096 → Dark 3210.72 / 4289.28 → 3211 / 4289 mL; fuel 2782.63 / 3717.37 → 2783 / 3717 ¢.
 * Season: Ash 12735 mL, 10412 ¢ + 2500 ¢ fee = 12912 ¢; Birch 6376 mL, 5371 ¢; Cedar 4289 mL,
 * 3717 ¢ + 2500 ¢ = 6217 ¢. Shares of 22.1671 kg: 0.546702, 0.271768, 0.181530.
 * By volume Birch would have had 9050 mL for its 400 L (22.6 mL/L) instead of 6376 mL (15.9 mL/L).
 */

let ex: WorkedExample;
let coordinator: Client;
let birch: Client;

let sugarmaker: Client;

/** Finishes a run through the Runs API, whose finish transaction allocates it. */
async function finishRun(runId: string) {
  const res = await sugarmaker.post(`/api/runs/${runId}/finish`, {});
  expect(res.status).toBe(200);
}

beforeAll(async () => {
  ex = await makeWorkedExample();
  coordinator = await signedIn(ex.emails.coordinator);
  sugarmaker = await signedIn(ex.emails.sugarmaker);
  birch = await signedIn(ex.emails.birch);
  await finishRun(ex.runs.run1);
  await finishRun(ex.runs.run2);
}, 240_000);

afterAll(closeTestDb);

describe('the settlement by sugar (worked example of three households)', () => {
  it('matches the hand-worked figures to the millilitre and the cent', async () => {
    const res = await coordinator.get(`/api/seasons/${ex.seasonId}/settlement`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      seasonId: ex.seasonId,
      households: [
        { householdId: ex.households.ash, name: 'Ash', sapL: 400, sugarKg: 12.1188, share: 0.546702, syrupMl: 12735, fuelCents: 10412, feeCents: 2500, dueCents: 12912 },
        { householdId: ex.households.birch, name: 'Birch', sapL: 400, sugarKg: 6.0243, share: 0.271768, syrupMl: 6376, fuelCents: 5371, feeCents: 0, dueCents: 5371 },
        { householdId: ex.households.cedar, name: 'Cedar', sapL: 200, sugarKg: 4.024, share: 0.18153, syrupMl: 4289, fuelCents: 3717, feeCents: 2500, dueCents: 6217 },
      ],
      totals: { sugarKg: 22.1671, syrupMl: 23400, fuelCents: 19500 },
    });
    // The lots' sugar agrees with lib/sugar's own figure.
    expect(sugarKg(400, 3)).toBeCloseTo(12.1188, 10);
  });

  it('conserves the runs’ syrup and fuel exactly', async () => {
    const [drawn] = await rows<{ ml: string }>(`SELECT sum(round(litres * 1000)) AS ml FROM syrup_draws d JOIN boil_runs r ON r.id = d.run_id WHERE r.season_id = :s`, { s: ex.seasonId });
    const [fuel] = await rows<{ c: string }>(`SELECT sum(cost_cents) AS c FROM fuel_uses f JOIN boil_runs r ON r.id = f.run_id WHERE r.season_id = :s`, { s: ex.seasonId });
    const [alloc] = await rows<{ ml: string; c: string }>(`SELECT sum(syrup_ml) AS ml, sum(fuel_cents) AS c FROM allocations WHERE season_id = :s`, { s: ex.seasonId });
    expect(Number(alloc.ml)).toBe(Number(drawn.ml));
    expect(Number(alloc.c)).toBe(Number(fuel.c));
    // Per run and per colour class too.
    const perRun = await rows<{ run_id: string; golden: string; amber: string; dark: string }>(
      `SELECT run_id, sum(syrup_golden_ml) AS golden, sum(syrup_amber_ml) AS amber, sum(syrup_dark_ml) AS dark FROM allocations WHERE season_id = :s GROUP BY run_id`,
      { s: ex.seasonId },
    );
    const run1 = perRun.find((r) => r.run_id === ex.runs.run1)!;
    expect([Number(run1.golden), Number(run1.amber), Number(run1.dark)]).toEqual([6000, 9900, 0]);
  });

  it('gives the low-sugar household less syrup per litre than a split by volume would', async () => {
    const res = await birch.get(`/api/seasons/${ex.seasonId}/ledger`);
    expect(res.status).toBe(200);
    const [own] = res.body.households;
    expect(own.name).toBe('Birch');
    expect(own.syrupMl).toBe(6376);
    expect(own.byVolume.syrupMl).toBe(9050);
    expect(own.syrupMl / own.boiledL).toBeLessThan(own.byVolume.syrupMl / own.boiledL);
    // And the sweet sap's household gets more by sugar than by volume.
    const all = (await coordinator.get(`/api/seasons/${ex.seasonId}/ledger`)).body;
    const ash = all.households.find((h: { name: string }) => h.name === 'Ash');
    expect(ash.syrupMl).toBeGreaterThan(ash.byVolume.syrupMl);
  });

  it('counts a rejected lot nowhere', async () => {
    const all = (await coordinator.get(`/api/seasons/${ex.seasonId}/ledger`)).body;
    const cedar = all.households.find((h: { name: string }) => h.name === 'Cedar');
    expect(cedar.rejectedL).toBe(100);
    expect(cedar.sapL).toBe(200);
    expect(cedar.meanBrix).toBe(2);
    // The co-op's mean is over accepted litres only: (400 × 3.0 + 400 × 1.5 + 200 × 2.0) / 1,000 L.
    expect(all.totals.meanBrix).toBeCloseTo(2.2, 10);
    expect(cedar.sugarKg).toBeCloseTo(4.024, 10);
    expect(cedar.sugarDeliveredKg).toBeCloseTo(4.024, 10);
    expect(all.weeks.reduce((s: number, w: { sugarKg: Record<string, number> }) => s + (w.sugarKg[ex.households.cedar] ?? 0), 0)).toBeCloseTo(4.024, 10);
    // The database itself refuses to boil a rejected lot.
    await expect(
      testDb().query(`INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres) VALUES (:c, :r, :d, 10)`, {
        replacements: { c: ex.cooperativeId, r: ex.runs.run2, d: ex.lots.cedarRejected },
      }),
    ).rejects.toThrow(/sap_deliveries_boiled_only_accepted/);
  });

  it('lists each run with its totals and answers its split run by run, to the millilitre and the cent', async () => {
    const l = (await coordinator.get(`/api/seasons/${ex.seasonId}/ledger`)).body;
    expect(l.runs.map(({ runId, syrupMl, fuelCents, households, allocations }: Record<string, unknown>) => ({ runId, syrupMl, fuelCents, households, allocations }))).toEqual([
      { runId: ex.runs.run1, syrupMl: 15900, fuelCents: 13000, households: 2, allocations: undefined },
      { runId: ex.runs.run2, syrupMl: 7500, fuelCents: 6500, households: 2, allocations: undefined },
    ]);
    const split = async (runId: string) => {
      const res = await coordinator.get(`/api/seasons/${ex.seasonId}/ledger/runs/${runId}`);
      expect(res.status).toBe(200);
      const byHousehold = Object.fromEntries(
        res.body.allocations.map((a: { householdId: string; syrupByClassMl: Record<string, number>; fuelCents: number }) => [a.householdId, { ...a.syrupByClassMl, fuel: a.fuelCents }]),
      );
      return { ...res.body, byHousehold };
    };
    // The hand-worked split at the top of this file.
    const run1 = await split(ex.runs.run1);
    expect(run1).toMatchObject({ runId: ex.runs.run1, syrupMl: 15900, fuelCents: 13000 });
    expect(run1.byHousehold).toEqual({
      [ex.households.ash]: { golden: 4806, amber: 7929, dark: 0, 'very-dark': 0, fuel: 10412 },
      [ex.households.birch]: { golden: 1194, amber: 1971, dark: 0, 'very-dark': 0, fuel: 2588 },
    });
    const run2 = await split(ex.runs.run2);
    expect(run2.byHousehold).toEqual({
      [ex.households.birch]: { golden: 0, amber: 0, dark: 3211, 'very-dark': 0, fuel: 2783 },
      [ex.households.cedar]: { golden: 0, amber: 0, dark: 4289, 'very-dark': 0, fuel: 3717 },
    });
    // A run of another season, or no run at all: not found.
    expect((await coordinator.get(`/api/seasons/${ex.seasonId}/ledger/runs/${ex.lots.cedarRejected}`)).status).toBe(404);
    expect((await coordinator.get(`/api/seasons/${ex.seasonId}/ledger/runs/not-a-run`)).status).toBe(404);
  });

  it('shows a member its own household only, with the others’ names and the co-op totals', async () => {
    const s = await birch.get(`/api/seasons/${ex.seasonId}/settlement`);
    expect(s.body.households.map((h: { name: string }) => h.name)).toEqual(['Birch']);
    expect(s.body.totals).toEqual({ sugarKg: 22.1671, syrupMl: 23400, fuelCents: 19500 });
    const l = (await birch.get(`/api/seasons/${ex.seasonId}/ledger`)).body;
    expect(l.householdNames.map((h: { name: string }) => h.name)).toEqual(['Ash', 'Birch', 'Cedar']);
    expect(l.runs.map((r: { runId: string }) => r.runId)).toEqual([ex.runs.run1, ex.runs.run2]);
    for (const runId of [ex.runs.run1, ex.runs.run2]) {
      const split = await birch.get(`/api/seasons/${ex.seasonId}/ledger/runs/${runId}`);
      expect(split.status).toBe(200);
      expect(split.body.allocations.map((a: { householdId: string }) => a.householdId)).toEqual([ex.households.birch]);
    }
    expect(JSON.stringify(l)).not.toContain('"name":"Ash","sapL"');
    // Ash's sap went into run 1 only: its list holds that run, and run 2's split is not found for it.
    const ash = await signedIn(ex.emails.ash);
    const ashLedger = (await ash.get(`/api/seasons/${ex.seasonId}/ledger`)).body;
    expect(ashLedger.runs.map((r: { runId: string; households: number }) => [r.runId, r.households])).toEqual([[ex.runs.run1, 1]]);
    expect((await ash.get(`/api/seasons/${ex.seasonId}/ledger/runs/${ex.runs.run2}`)).status).toBe(404);
    const ashRun1 = (await ash.get(`/api/seasons/${ex.seasonId}/ledger/runs/${ex.runs.run1}`)).body;
    expect(ashRun1).toMatchObject({ runId: ex.runs.run1, syrupMl: 15900, fuelCents: 13000 });
    expect(ashRun1.allocations.map((a: { householdId: string; fuelCents: number }) => [a.householdId, a.fuelCents])).toEqual([[ex.households.ash, 10412]]);
    expect(Object.keys(l.weeks.reduce((a: object, w: { sugarKg: object }) => ({ ...a, ...w.sugarKg }), {}))).toEqual([ex.households.birch]);
  });

  it('keeps other co-ops out: the demo coordinator gets 404 for this season', async () => {
    const demo = await signedIn('coordinator@larkspur.example');
    expect((await demo.get(`/api/seasons/${ex.seasonId}/settlement`)).status).toBe(404);
    expect((await demo.get(`/api/seasons/${ex.seasonId}/ledger`)).status).toBe(404);
    expect((await new Client().get(`/api/seasons/${ex.seasonId}/settlement`)).status).toBe(401);
  });

  it('exports the ledger as CSV and PDF', async () => {
    const csv = await coordinator.request('GET', `/api/seasons/${ex.seasonId}/ledger?format=csv`);
    expect(csv.status).toBe(200);
    const lines = String(csv.body).trim().split(/\r?\n/);
    expect(lines[0]).toContain('household,sap_l,rejected_l,mean_brix,sugar_kg,share,syrup_ml');
    expect(lines[1]).toMatch(/^Ash,400,0,3,12\.1188,0\.546702,12735,4806,7929,0,0,10412,2500,12912,/);
    expect(lines).toHaveLength(5);
    const pdf = await fetch(`${BASE_URL}/api/seasons/${ex.seasonId}/ledger?format=pdf`, { headers: { cookie: coordinator.cookieHeader } });
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await pdf.arrayBuffer()).subarray(0, 5).toString()).toBe('%PDF-');
  });
});

describe('reopening and finishing a run again', () => {
  it('recomputes that run’s allocation and nothing else, with who changed what', async () => {
    const before = await rows<Record<string, unknown>>(`SELECT * FROM allocations WHERE season_id = :s ORDER BY run_id, household_id`, { s: ex.seasonId });
    const run1Before = before.filter((r) => r.run_id === ex.runs.run1);

    expect((await birch.post(`/api/runs/${ex.runs.run2}/reopen`, { reason: 'A draw-off was missed' })).status).toBe(403);
    expect((await coordinator.post(`/api/runs/${ex.runs.run2}/reopen`, {})).status).toBe(422);
    const reopened = await coordinator.post(`/api/runs/${ex.runs.run2}/reopen`, { reason: 'A draw-off was missed' });
    expect(reopened.status).toBe(200);
    expect(reopened.body.status).toBe('running');
    // While reopened the allocation stands unchanged.
    expect(await rows(`SELECT * FROM allocations WHERE season_id = :s ORDER BY run_id, household_id`, { s: ex.seasonId })).toEqual(before);

    // The missed draw-off: 1.000 L more Dark syrup.
    expect((await sugarmaker.post(`/api/runs/${ex.runs.run2}/draws`, { litres: 1.0, brix: 67, transmittancePct: 30 })).status).toBeLessThan(300);
    await finishRun(ex.runs.run2);

    const after = await rows<Record<string, unknown>>(`SELECT * FROM allocations WHERE season_id = :s ORDER BY run_id, household_id`, { s: ex.seasonId });
    expect(after.filter((r) => r.run_id === ex.runs.run1)).toEqual(run1Before);
    // 8500 mL Dark by 0.428096 / 0.571904: 3638.82 / 4861.18 → 3638 / 4861, one left to Birch (.82) → 3639 / 4861.
    const run2 = after.filter((r) => r.run_id === ex.runs.run2);
    expect(Object.fromEntries(run2.map((r) => [r.household_id, r.syrup_dark_ml]))).toEqual({ [ex.households.birch]: 3639, [ex.households.cedar]: 4861 });

    const history = await rows<{ event: string; reason: string | null; changed_by_id: string | null; before: unknown[]; after: unknown[] }>(
      `SELECT event, reason, changed_by_id, before, after FROM allocation_revisions WHERE run_id = :r ORDER BY changed_at, event`,
      { r: ex.runs.run2 },
    );
    expect(history.map((h) => h.event)).toEqual(['finished', 'reopened', 'refinished']);
    expect(history[1].reason).toBe('A draw-off was missed');
    expect(history[1].changed_by_id).not.toBeNull();
    expect(history[2].changed_by_id).not.toBeNull();
    expect(history[2].before).toHaveLength(2);
    expect((history[2].after as { dark: number }[]).map((a) => a.dark).sort()).toEqual([3639, 4861]);
    const run1History = await rows(`SELECT event FROM allocation_revisions WHERE run_id = :r`, { r: ex.runs.run1 });
    expect(run1History).toHaveLength(1);

    const s = (await coordinator.get(`/api/seasons/${ex.seasonId}/settlement`)).body;
    expect(s.totals.syrupMl).toBe(24400);
  });
});

describe('closing the season', () => {
  it('is for coordinators, refuses while a run boils, then stops runs being reopened', async () => {
    expect((await birch.post(`/api/seasons/${ex.seasonId}/close`)).status).toBe(403);
    const [{ id: running }] = await testDb().query<{ id: string }>(
      `INSERT INTO boil_runs (cooperative_id, season_id, evaporator_id, run_number, lot_code, status, started_at)
       VALUES (:c, :s, :e, 3, :code, 'running', now()) RETURNING id`,
      { replacements: { c: ex.cooperativeId, s: ex.seasonId, e: ex.evaporatorId, code: `${new Date().getFullYear()}-003` }, type: QueryTypes.SELECT },
    );
    const refused = await coordinator.post(`/api/seasons/${ex.seasonId}/close`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('run_running');
    await testDb().query(`DELETE FROM boil_runs WHERE id = :id`, { replacements: { id: running } });

    // The season list (kept per change of the co-op) is read first, so a kept copy exists.
    const statusIn = async (who: Client) => ((await who.get('/api/seasons')).body as { id: string; status: string }[]).find((x) => x.id === ex.seasonId)?.status;
    expect(await statusIn(coordinator)).toBe('open');
    expect(await statusIn(birch)).toBe('open');
    const closed = await coordinator.post(`/api/seasons/${ex.seasonId}/close`);
    expect(closed.status).toBe(200);
    expect(closed.body.status).toBe('closed');
    expect(await statusIn(coordinator)).toBe('closed');
    expect(await statusIn(birch)).toBe('closed');
    const reopen = await coordinator.post(`/api/runs/${ex.runs.run1}/reopen`, { reason: 'too late' });
    expect(reopen.status).toBe(409);
    expect(reopen.body.error.code).toBe('season_not_open');
  });
});

describe('the ledger as the season changes', () => {
  // The ledger is built once per change of the co-op and shared; every write it shows must
  // bump the co-op's change version, or these reads would answer the ledger from before it.
  const ledger = async (who: Client = coordinator) => {
    const res = await who.get(`/api/seasons/${ex.seasonId}/ledger`);
    expect(res.status).toBe(200);
    return res.body as { season: { status: string }; householdNames: { name: string }[]; households: { name: string; feeCents: number; fuelCents: number; dueCents: number }[] };
  };

  it('answers a fee, a new household and the season closing at once, to coordinator and member alike', async () => {
    expect((await ledger()).season.status).toBe('closed');
    const before = await ledger();
    const birchBefore = before.households.find((h) => h.name === 'Birch')!;
    expect(birchBefore.feeCents).toBe(0);
    expect((await ledger(birch)).households.map((h) => h.feeCents)).toEqual([0]);

    const fee = await coordinator.request('PUT', `/api/seasons/${ex.seasonId}/fees`, { householdId: ex.households.birch, feeCents: 1500 });
    expect(fee.status).toBe(200);
    const afterFee = (await ledger()).households.find((h) => h.name === 'Birch')!;
    expect(afterFee).toMatchObject({ feeCents: 1500, dueCents: birchBefore.fuelCents + 1500 });
    expect((await ledger(birch)).households.map((h) => h.dueCents)).toEqual([birchBefore.fuelCents + 1500]);

    expect((await coordinator.post('/api/households', { name: 'Dogwood' })).status).toBe(201);
    const afterHousehold = await ledger();
    expect(afterHousehold.householdNames.map((h) => h.name)).toEqual(['Ash', 'Birch', 'Cedar', 'Dogwood']);
    expect(afterHousehold.households.find((h) => h.name === 'Dogwood')).toMatchObject({ feeCents: 0, fuelCents: 0, dueCents: 0 });
  });
});
