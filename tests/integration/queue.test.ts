import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import { BASE_URL } from '../test-env';
import { Client, signedIn } from './http';
import { closeTestDb, rows } from './db';
import { demoCoop, insertLot } from './lots';
import { computeQueue } from '@/lib/queue/rules';
import type { QueueSnapshot } from '@/lib/queue/types';
import { densityFromBrix, sugarKg } from '@/lib/sugar';

let member: Client;
let coordinator: Client;
let co: Awaited<ReturnType<typeof demoCoop>>;
const sockets: Socket[] = [];

beforeAll(async () => {
  [member, coordinator] = await Promise.all([signedIn('lindqvist@larkspur.example'), signedIn('coordinator@larkspur.example')]);
  co = await demoCoop();
});

afterAll(async () => {
  for (const s of sockets) s.close();
  await closeTestDb();
});

/** The queue's inputs read with plain queries of the test's own, to check the service's one-statement read. */
async function inputsFromTables(now: Date) {
  const [coop] = await rows<{ version: string; syrup_brix: number; shelf_days: number; warm_above_c: number; warm_shelf_days: number; time_zone: string }>(
    'SELECT change_version AS version, syrup_brix, shelf_days, warm_above_c, warm_shelf_days, time_zone FROM cooperatives WHERE id = :c',
    { c: co.cooperativeId },
  );
  const [evaporator] = await rows<{ id: string; name: string; evaporation_lph: number }>(
    'SELECT id, name, evaporation_lph FROM evaporators WHERE cooperative_id = :c ORDER BY name LIMIT 1',
    { c: co.cooperativeId },
  );
  const lots = await rows<{ id: string; household_id: string; name: string; received_at: Date; collected_on: string; collected_at: Date; volume_l: number; litres_boiled: number; brix: number; sap_temp_c: number }>(
    `SELECT d.id, d.household_id, h.name, d.received_at, d.collected_on::text, (d.collected_on::timestamp AT TIME ZONE :tz) AS collected_at,
            d.volume_l, d.litres_boiled, d.brix::float8 AS brix, d.sap_temp_c
       FROM sap_deliveries d JOIN households h ON h.id = d.household_id JOIN seasons s ON s.id = d.season_id
      WHERE d.cooperative_id = :c AND d.status = 'accepted' AND s.status = 'open'`,
    { c: co.cooperativeId, tz: coop.time_zone },
  );
  const slots = await rows<{ starts_at: Date; ends_at: Date }>(
    `SELECT starts_at, ends_at FROM boil_slots WHERE cooperative_id = :c AND status = 'booked' AND ends_at > :now`,
    { c: co.cooperativeId, now },
  );
  const running = await rows('SELECT id FROM boil_runs WHERE cooperative_id = :c AND status = :s', { c: co.cooperativeId, s: 'running' });
  return {
    version: Number(coop.version),
    now,
    evaporator: { id: evaporator.id, name: evaporator.name, evaporationLph: evaporator.evaporation_lph },
    syrupBrix: coop.syrup_brix,
    spoilage: { shelfDays: coop.shelf_days, warmAboveC: coop.warm_above_c, warmShelfDays: coop.warm_shelf_days },
    lots: lots.map((l) => ({
      deliveryId: l.id,
      householdId: l.household_id,
      householdName: l.name,
      receivedAt: new Date(l.received_at),
      collectedOn: l.collected_on,
      collectedAt: new Date(l.collected_at),
      litresLeft: l.volume_l - l.litres_boiled,
      brix: l.brix,
      sapTempC: l.sap_temp_c,
    })),
    run: null,
    bookedSlots: slots.map((s) => ({ startsAt: new Date(s.starts_at), endsAt: new Date(s.ends_at) })),
    syrupDrawnTodayL: 0,
    runningRuns: running.length,
  };
}

describe('the Boil queue API', { timeout: 120_000 }, () => {
  it('answers what the unit computation gives for the demo data', async () => {
    const res = await member.get('/api/queue');
    expect(res.status).toBe(200);
    const snap = res.body as QueueSnapshot;
    const { runningRuns, ...input } = await inputsFromTables(new Date(snap.computedAt));
    expect(runningRuns).toBe(0); // the demo has finished runs only, so the queue starts now
    const expected = computeQueue({ ...input, syrupDrawnTodayL: snap.totals.syrupDrawnTodayL });
    expect(snap.version).toBe(expected.version);
    expect(snap.lots.length).toBeGreaterThan(3);
    expect(snap.lots.map((l) => l.deliveryId)).toEqual(expected.lots.map((l) => l.deliveryId));
    for (const [i, lot] of snap.lots.entries()) {
      const e = expected.lots[i];
      expect(lot).toMatchObject({ householdId: e.householdId, deadline: e.deadline, state: e.state, etaStart: e.etaStart, etaEnd: e.etaEnd, spoilsBeforeTurn: e.spoilsBeforeTurn });
      expect(lot.litresLeft).toBeCloseTo(e.litresLeft, 9);
    }
    expect(snap.totals.litresWaiting).toBeCloseTo(expected.totals.litresWaiting, 6);
    expect(snap.totals.hoursNeeded).toBeCloseTo(expected.totals.hoursNeeded, 9);
    expect(snap.totals.hoursBookedAhead).toBeCloseTo(expected.totals.hoursBookedAhead, 9);
  });

  it('is gzipped once for a client that takes gzip, and plain for one that does not', async () => {
    const ask = (encoding: string) => fetch(`${BASE_URL}/api/queue`, { headers: { cookie: member.cookieHeader, 'accept-encoding': encoding } });
    const zipped = await ask('gzip, deflate, br');
    expect(zipped.headers.get('content-encoding')).toBe('gzip');
    // fetch unzips once: zipped twice, this would not be JSON.
    const a = (await zipped.json()) as QueueSnapshot;
    const plain = await ask('identity');
    expect(plain.headers.get('content-encoding')).toBeNull();
    const b = (await plain.json()) as QueueSnapshot;
    expect(a.lots.length).toBeGreaterThan(3);
    expect(b.version).toBe(a.version);
    expect(b.lots).toEqual(a.lots);
  });

  it('is signed-in only', async () => {
    expect((await new Client().get('/api/queue')).status).toBe(401);
  });

  it('grows its version with each change and shows a new lot', async () => {
    const before = (await member.get('/api/queue')).body as QueueSnapshot;
    const lot = await insertLot(co, { householdId: co.households[0].id, volumeL: 80, brix: 2.2 });
    // A lot written straight into the table is no change event: the version is unchanged until one happens.
    const staff = await signedIn('sugarmaker@larkspur.example');
    const run = await staff.post('/api/runs', { evaporatorId: (await staff.get('/api/evaporators')).body[0].id, slotId: null });
    expect(run.status).toBe(201);
    const after = (await member.get('/api/queue')).body as QueueSnapshot;
    expect(after.version).toBeGreaterThan(before.version);
    expect(after.lots.map((l) => l.deliveryId)).toContain(lot);
    expect(after.run?.lotCode).toBe(run.body.lotCode);
    // The run is on the evaporator now: the queue starts when its (empty) sap is boiled, i.e. now.
    const taken = await staff.post(`/api/runs/${run.body.id}/inputs`, { deliveryId: lot });
    expect(taken.status).toBe(201);
    const later = (await member.get('/api/queue')).body as QueueSnapshot;
    expect(later.lots.map((l) => l.deliveryId)).not.toContain(lot);
    expect(later.run?.inputL).toBeCloseTo(80, 9);
    expect(Date.parse(later.lots[0].etaStart)).toBeGreaterThan(Date.parse(later.computedAt));
    await staff.post(`/api/runs/${run.body.id}/finish`, {});
  });
});

describe('demo runs', () => {
  it('make 92–98 % of the syrup their sugar allows at each draw-off °Brix, and leave recent lots waiting', async () => {
    const runs = await rows<{ id: string; lot_code: string }>(
      `SELECT r.id, r.lot_code FROM boil_runs r JOIN seasons s ON s.id = r.season_id
        WHERE r.cooperative_id = :c AND r.status = 'finished'
          AND NOT EXISTS (SELECT 1 FROM evaporators e WHERE e.id = r.evaporator_id AND e.name LIKE 'Test evaporator%')`,
      { c: co.cooperativeId },
    );
    expect(runs.length).toBeGreaterThan(20);
    for (const run of runs) {
      const inputs = await rows<{ litres: number; brix: number }>('SELECT i.litres, d.brix::float8 AS brix FROM run_inputs i JOIN sap_deliveries d ON d.id = i.delivery_id WHERE i.run_id = :r', { r: run.id });
      const draws = await rows<{ litres: number; brix: number }>('SELECT litres, brix FROM syrup_draws WHERE run_id = :r', { r: run.id });
      if (!draws.length) continue;
      const sugarIn = inputs.reduce((s, i) => s + sugarKg(i.litres, i.brix), 0);
      // Sugar in the syrup: litres × density(°Bx) × °Bx / 100 (CRC Handbook sucrose density table, via lib/sugar).
      const sugarOut = draws.reduce((s, d) => s + (d.litres * densityFromBrix(d.brix) * d.brix) / 100, 0);
      const ratio = sugarOut / sugarIn;
      expect(ratio, run.lot_code).toBeGreaterThanOrEqual(0.92);
      expect(ratio, run.lot_code).toBeLessThanOrEqual(0.98);
    }
    const classes = await rows<{ grade_class: string }>(
      `SELECT DISTINCT d.grade_class FROM syrup_draws d JOIN boil_runs r ON r.id = d.run_id JOIN seasons s ON s.id = r.season_id WHERE s.id = :s`,
      { s: co.seasonId },
    );
    expect(classes.length).toBeGreaterThanOrEqual(2);
  });
});

describe('display links', { timeout: 120_000 }, () => {
  const socketWith = (displayToken: string) => {
    const s = connect(BASE_URL, { path: '/realtime', transports: ['websocket'], auth: { displayToken }, reconnection: false });
    sockets.push(s);
    return s;
  };

  it('open the co-op’s live queue without signing in until revoked; then the page is 404 and the socket is refused', async () => {
    expect((await member.post('/api/display-links', { name: 'Member screen' })).status).toBe(403);
    expect((await coordinator.post('/api/display-links', { name: '  ' })).status).toBe(422);
    const made = await coordinator.post('/api/display-links', { name: 'Sugarhouse TV' });
    expect(made.status).toBe(201);
    const token = new URL(made.body.url).pathname.split('/').pop()!;
    // Stored hashed only.
    const stored = await rows<{ token_hash: string }>('SELECT token_hash FROM display_links WHERE id = :id', { id: made.body.id });
    expect(stored[0].token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored[0].token_hash).not.toContain(token);

    const page = await fetch(`${BASE_URL}/display/${token}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Next to boil');

    const screen = socketWith(token);
    const first = await new Promise<QueueSnapshot>((resolve, reject) => {
      screen.once('queue', resolve);
      screen.once('connect_error', reject);
    });
    expect(first.version).toBeGreaterThanOrEqual(0);
    expect(Array.isArray(first.lots)).toBe(true);
    const dropped = new Promise<string>((resolve) => screen.once('disconnect', resolve));

    const revoked = await coordinator.delete(`/api/display-links/${made.body.id}`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.revokedAt).toBeTruthy();
    expect(await dropped).toBe('io server disconnect');
    expect((await fetch(`${BASE_URL}/display/${token}`)).status).toBe(404);
    const refused = socketWith(token);
    await expect(
      new Promise<void>((resolve, reject) => {
        refused.once('connect', () => resolve());
        refused.once('connect_error', reject);
      }),
    ).rejects.toThrow(/not valid/);
    expect((await fetch(`${BASE_URL}/display/not-a-token-at-all-nope`)).status).toBe(404);
  });
});
