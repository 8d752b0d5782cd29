import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { Client, signedIn } from './http';
import { closeTestDb, rows } from './db';

let coordinator: Client;
let member: Client;
let original: Record<string, unknown>;

beforeAll(async () => {
  coordinator = await signedIn('coordinator@larkspur.example');
  member = await signedIn('brennan@larkspur.example');
  original = (await coordinator.get('/api/settings')).body;
});

afterAll(async () => {
  await coordinator.patch('/api/settings', original);
  await closeTestDb();
});

describe('co-op settings', () => {
  it('are for coordinators only', async () => {
    expect((await member.get('/api/settings')).status).toBe(403);
    expect((await member.patch('/api/settings', original)).status).toBe(403);
    expect((await new Client().get('/api/settings')).status).toBe(401);
  });

  it('refuse values outside the rules, field by field, and change nothing', async () => {
    const r = await coordinator.patch('/api/settings', { ...original, closesAt: '05:00', syrupBrix: 64, slotMinMinutes: 5 });
    expect(r.status).toBe(422);
    expect(r.body.error.fields).toMatchObject({
      syrupBrix: expect.stringMatching(/66\.0 °Bx/),
      slotMinMinutes: expect.stringMatching(/15 minutes/),
    });
    const crossed = await coordinator.patch('/api/settings', { ...original, opensAt: '20:00', closesAt: '08:00' });
    expect(crossed.status).toBe(422);
    expect(crossed.body.error.fields.closesAt).toMatch(/after opening/);
    const [coop] = await rows<{ closes_at: string; syrup_brix: number }>("SELECT closes_at, syrup_brix FROM cooperatives WHERE name LIKE 'Larkspur%'");
    expect(coop.closes_at).toBe('22:00:00');
    expect(coop.syrup_brix).toBe(66.9);
  });

  it('apply at once to bookings: shorter sugarhouse hours refuse a member’s evening slot', async () => {
    const saved = await coordinator.patch('/api/settings', { ...original, closesAt: '18:00' });
    expect(saved.status).toBe(200);
    expect(saved.body.closesAt).toBe('18:00');
    const evaporatorId = (await member.get('/api/evaporators')).body[0].id;
    const day = DateTime.now().setZone('America/New_York').startOf('day').plus({ days: 22 });
    const r = await member.post('/api/slots', {
      evaporatorId,
      startsAt: day.set({ hour: 17 }).toISO(),
      endsAt: day.set({ hour: 19 }).toISO(),
    });
    expect(r.status).toBe(422);
    expect(r.body.error.fields.startsAt).toMatch(/06:00–18:00/);
  });
});
