import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from './http';
import { closeTestDb, rows } from './db';
import { demoCoop, insertLot, testEvaporator } from './lots';
import { sugarKg } from '@/lib/sugar';

let staff: Client;
let member: Client;
let co: Awaited<ReturnType<typeof demoCoop>>;

beforeAll(async () => {
  [staff, member] = await Promise.all([signedIn('sugarmaker@larkspur.example'), signedIn('okafor@larkspur.example')]);
  co = await demoCoop();
});

afterAll(closeTestDb);

const count = async (table: string) => Number((await rows<{ n: string }>(`SELECT count(*) AS n FROM ${table}`))[0].n);

// Generous per-test time: the machine is shared and a development server compiles routes on first use.
describe('boil runs', { timeout: 120_000 }, () => {
  it('are written by sugarmakers only: a member gets 403 and nothing is written', async () => {
    const evaporatorId = await testEvaporator(co.cooperativeId);
    const before = await count('boil_runs');
    const res = await member.post('/api/runs', { evaporatorId });
    expect(res.status).toBe(403);
    expect(await count('boil_runs')).toBe(before);
    const run = await staff.post('/api/runs', { evaporatorId, slotId: null });
    expect(run.status).toBe(201);
    for (const [path, body] of [
      ['inputs', { deliveryId: run.body.id }],
      ['draws', { litres: 1, brix: 66.9, transmittancePct: 60 }],
      ['fuel', { quantity: 0.1 }],
      ['finish', {}],
    ] as const) {
      expect((await member.post(`/api/runs/${run.body.id}/${path}`, body)).status).toBe(403);
    }
    // Members read runs.
    const read = await member.get(`/api/runs/${run.body.id}`);
    expect(read.status).toBe(200);
    expect(read.body.lotCode).toBe(run.body.lotCode);
  });

  it('number their lot codes by season year and run, and refuse a second running run on one evaporator', async () => {
    const evaporatorId = await testEvaporator(co.cooperativeId);
    const first = await staff.post('/api/runs', { evaporatorId });
    expect(first.status).toBe(201);
    expect(first.body.lotCode).toMatch(new RegExp(`^${co.seasonYear}-\\d{3}$`));
    expect(first.body.status).toBe('running');
    const second = await staff.post('/api/runs', { evaporatorId });
    expect(second.status).toBe(409);
    expect(second.body.error.message).toContain(first.body.lotCode);
    expect((await rows('SELECT id FROM boil_runs WHERE evaporator_id = :e', { e: evaporatorId })).length).toBe(1);
  });

  it('never draw a lot beyond its litres, even from two concurrent requests (409 with a message)', async () => {
    const evaporatorId = await testEvaporator(co.cooperativeId);
    const lot = await insertLot(co, { householdId: co.households[0].id, volumeL: 100, brix: 2.4 });
    const a = (await staff.post('/api/runs', { evaporatorId })).body;
    const otherEvaporator = await testEvaporator(co.cooperativeId);
    const b = (await staff.post('/api/runs', { evaporatorId: otherEvaporator })).body;

    const answers = await Promise.all([
      staff.post(`/api/runs/${a.id}/inputs`, { deliveryId: lot, litres: 70 }),
      staff.post(`/api/runs/${b.id}/inputs`, { deliveryId: lot, litres: 70 }),
    ]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
    const refused = answers.find((r) => r.status === 409)!;
    expect(refused.body.error.message).toBe('Only 30 L of that lot are left to boil.');
    expect(refused.body.error.fields.litres).toBeTruthy();
    const [{ litres_boiled }] = await rows<{ litres_boiled: number }>('SELECT litres_boiled FROM sap_deliveries WHERE id = :id', { id: lot });
    expect(litres_boiled).toBe(70);
    expect(await rows('SELECT 1 FROM run_inputs WHERE delivery_id = :id', { id: lot })).toHaveLength(1);

    // The rest, whole: omitting litres takes what is left.
    const rest = await staff.post(`/api/runs/${b.id}/inputs`, { deliveryId: lot });
    expect(rest.status).toBe(201);
    const [{ sum }] = await rows<{ sum: number }>('SELECT sum(litres) AS sum FROM run_inputs WHERE delivery_id = :id', { id: lot });
    expect(sum).toBeCloseTo(100, 9);
    const last = rest.body.inputs.at(-1);
    expect(last.litres).toBeCloseTo(30, 9);
    expect(last.sugarKg).toBeCloseTo(sugarKg(30, 2.4), 9);
    const none = await staff.post(`/api/runs/${a.id}/inputs`, { deliveryId: lot, litres: 0.5 });
    expect(none.status).toBe(409);
    expect(none.body.error.message).toBe('That lot has already been boiled in full.');
  });

  it('are refused by the database itself when a write would over-draw a lot', async () => {
    const evaporatorId = await testEvaporator(co.cooperativeId);
    const lot = await insertLot(co, { householdId: co.households[1].id, volumeL: 40, brix: 2 });
    const run = (await staff.post('/api/runs', { evaporatorId })).body;
    await expect(
      rows(`INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres) VALUES (:c, :r, :d, 40.5) RETURNING id`, {
        c: co.cooperativeId,
        r: run.id,
        d: lot,
      }),
    ).rejects.toThrow(/sap_deliveries_not_overdrawn/);
  });

  it('never take or show a rejected lot', async () => {
    const evaporatorId = await testEvaporator(co.cooperativeId);
    const rejected = await insertLot(co, { householdId: co.households[2].id, volumeL: 55, brix: 2.1, status: 'rejected' });
    const run = (await staff.post('/api/runs', { evaporatorId })).body;
    const res = await staff.post(`/api/runs/${run.id}/inputs`, { deliveryId: rejected });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.deliveryId).toBeTruthy();
    const queue = await member.get('/api/queue');
    expect(queue.status).toBe(200);
    expect(queue.body.lots.map((l: { deliveryId: string }) => l.deliveryId)).not.toContain(rejected);
    // Nor can SQL boil it.
    await expect(
      rows(`INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres) VALUES (:c, :r, :d, 1) RETURNING id`, {
        c: co.cooperativeId,
        r: run.id,
        d: rejected,
      }),
    ).rejects.toThrow(/sap_deliveries_boiled_only_accepted/);
  });

  it('record draw-offs with their colour class, fuel at the season’s price, and finish', async () => {
    const evaporatorId = await testEvaporator(co.cooperativeId);
    const lot = await insertLot(co, { householdId: co.households[3].id, volumeL: 400, brix: 2.5 });
    const run = (await staff.post('/api/runs', { evaporatorId })).body;
    expect((await staff.post(`/api/runs/${run.id}/finish`)).status).toBe(422); // nothing taken in yet
    await staff.post(`/api/runs/${run.id}/inputs`, { inputs: [{ deliveryId: lot }] });

    // 62 %Tc is Amber (50.0–74.9 %Tc: USDA AMS, United States Standards for Grades of Maple Syrup, 2015).
    const draw = await staff.post(`/api/runs/${run.id}/draws`, { litres: 6.5, brix: 67.1, transmittancePct: 62, temperatureC: 103.6 });
    expect(draw.status).toBe(201);
    expect(draw.body.draws[0]).toMatchObject({ litres: 6.5, brix: 67.1, transmittancePct: 62, gradeClass: 'amber' });
    const mismatch = await staff.post(`/api/runs/${run.id}/draws`, { litres: 1, brix: 67, transmittancePct: 80, gradeClass: 'dark' });
    expect(mismatch.status).toBe(422);
    expect(mismatch.body.error.fields.gradeClass).toMatch(/golden/);
    const bad = await staff.post(`/api/runs/${run.id}/draws`, { litres: -1, brix: 90 });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['litres', 'brix']));

    // Half a cord at the demo season's $260 a cord.
    const fuel = await staff.post(`/api/runs/${run.id}/fuel`, { quantity: 0.5 });
    expect(fuel.status).toBe(201);
    expect(fuel.body.fuel[0]).toMatchObject({ kind: 'wood', unit: 'cord', quantity: 0.5, costCents: 13000 });
    expect((await staff.post(`/api/runs/${run.id}/fuel`, { quantity: 20, kind: 'wood', unit: 'litre' })).status).toBe(422);

    const done = await staff.post(`/api/runs/${run.id}/finish`, {});
    expect(done.status).toBe(200);
    expect(done.body.status).toBe('finished');
    expect(done.body.totals).toMatchObject({ inputL: 400, syrupDrawnL: 6.5, fuelCostCents: 13000 });
    expect((await staff.post(`/api/runs/${run.id}/draws`, { litres: 1, brix: 67, gradeClass: 'amber' })).status).toBe(409);

    const list = await member.get(`/api/runs?seasonId=${co.seasonId}`);
    expect(list.status).toBe(200);
    expect(list.body.find((r: { id: string }) => r.id === run.id)).toMatchObject({ lotCode: run.lotCode, status: 'finished' });
  });
});
