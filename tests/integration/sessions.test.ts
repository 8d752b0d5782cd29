import { afterAll, describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { io as connect, type Socket } from 'socket.io-client';
import { BASE_URL } from '../test-env';
import { Client, signedIn } from './http';
import { closeTestDb, rows, testDb } from './db';

const sockets: Socket[] = [];
afterAll(async () => {
  sockets.forEach((s) => s.close());
  await closeTestDb();
});

const idOf = async (email: string) => (await rows<{ id: string }>('SELECT id FROM users WHERE email = :email', { email }))[0].id;

describe('sessions follow the database', { timeout: 120_000 }, () => {
  it('acts on the new role at the very next request, and disconnects the changed person’s socket', async () => {
    const coordinator = await signedIn('coordinator@larkspur.example');
    const sm2 = await signedIn('sugarmaker2@larkspur.example');
    const sm2Id = await idOf('sugarmaker2@larkspur.example');
    expect((await sm2.get('/api/households')).status).toBe(403);
    expect((await coordinator.patch(`/api/people/${sm2Id}`, { role: 'coordinator' })).status).toBe(200);
    expect((await sm2.get('/api/households')).status).toBe(200);

    const socket = connect(BASE_URL, { path: '/realtime', transports: ['websocket'], extraHeaders: { cookie: sm2.cookieHeader }, reconnection: false });
    sockets.push(socket);
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', () => resolve());
      socket.once('connect_error', reject);
    });
    const dropped = new Promise<string>((resolve) => socket.once('disconnect', (reason) => resolve(reason)));
    expect((await coordinator.patch(`/api/people/${sm2Id}`, { role: 'sugarmaker' })).status).toBe(200);
    expect((await sm2.get('/api/households')).status).toBe(403);
    expect(await dropped).toBe('io server disconnect');
  });

  it('acts for the new household at once', async () => {
    const coordinator = await signedIn('coordinator@larkspur.example');
    const households = (await coordinator.get('/api/households')).body as { id: string; name: string; people: { id: string; email: string }[] }[];
    const from = households.find((h) => h.people.some((p) => p.email.endsWith('@larkspur.example') && p.email !== 'coordinator@larkspur.example'))!;
    const person = from.people[0];
    const to = households.find((h) => h.id !== from.id)!;
    const member = await signedIn(person.email);
    expect((await coordinator.patch(`/api/people/${person.id}`, { role: 'member', householdId: to.id })).status).toBe(200);
    const evaporatorId = (await member.get('/api/evaporators')).body[0].id as string;
    // Booking for the old household is now someone else's household: refused.
    // Two days from now, inside the open demo season and the co-op's booking hours.
    const day = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);
    const r = await member.post('/api/slots', { evaporatorId, householdId: from.id, startsAt: `${day}T15:00:00Z`, endsAt: `${day}T17:00:00Z` });
    expect(r.status).toBe(403);
    expect((await coordinator.patch(`/api/people/${person.id}`, { role: 'member', householdId: from.id })).status).toBe(200);
  });

  it('after “sign out everywhere” an old session cookie answers 401', async () => {
    const a = await signedIn('sugarmaker@larkspur.example');
    const b = await signedIn('sugarmaker@larkspur.example');
    expect((await b.get('/api/seasons')).status).toBe(200);
    expect((await a.post('/api/account/sign-out-everywhere')).status).toBe(200);
    expect((await a.get('/api/seasons')).status).toBe(401);
    expect((await b.get('/api/seasons')).status).toBe(401);
    expect((await new Client().signIn('sugarmaker@larkspur.example'))).toBe(true);
  });

  it('a validly signed token for a deleted person answers 401', async () => {
    const [{ id: coopId }] = await rows<{ id: string }>("SELECT id FROM cooperatives WHERE name LIKE 'Larkspur%'");
    await testDb().query(
      `INSERT INTO users (cooperative_id, name, email, password_hash, role) VALUES (:coopId, 'Tamsin Ode', 'gone@larkspur.example', :h, 'sugarmaker')`,
      { replacements: { coopId, h: await bcrypt.hash('syrup-season', 4) } },
    );
    const gone = await signedIn('gone@larkspur.example');
    expect((await gone.get('/api/seasons')).status).toBe(200);
    await testDb().query("DELETE FROM users WHERE email = 'gone@larkspur.example'");
    const r = await gone.get('/api/seasons');
    expect(r.status).toBe(401);
    expect(r.body.error.code).toBe('unauthenticated');
  });

  it('two coordinators demoting each other at once leave one coordinator, and neither answers 500', async () => {
    const coordinator = await signedIn('coordinator@larkspur.example');
    const sm2Id = await idOf('sugarmaker2@larkspur.example');
    const meId = await idOf('coordinator@larkspur.example');
    expect((await coordinator.patch(`/api/people/${sm2Id}`, { role: 'coordinator' })).status).toBe(200);
    const sm2 = await signedIn('sugarmaker2@larkspur.example');
    const [x, y] = await Promise.all([
      coordinator.patch(`/api/people/${sm2Id}`, { role: 'sugarmaker' }),
      sm2.patch(`/api/people/${meId}`, { role: 'sugarmaker' }),
    ]);
    expect(x.status).not.toBe(500);
    expect(y.status).not.toBe(500);
    expect([x.status, y.status].filter((s) => s === 200)).toHaveLength(1);
    const [{ n }] = await rows<{ n: number }>("SELECT count(*)::int AS n FROM users u JOIN cooperatives c ON c.id = u.cooperative_id WHERE c.name LIKE 'Larkspur%' AND u.role = 'coordinator'");
    expect(n).toBe(1);
    // Put the demo back: the one left makes the other coordinator again, then sugarmaker2 returns to sugarmaker.
    const left = x.status === 200 ? coordinator : sm2;
    await left.patch(`/api/people/${x.status === 200 ? sm2Id : meId}`, { role: 'coordinator' });
    expect((await coordinator.patch(`/api/people/${sm2Id}`, { role: 'sugarmaker' })).status).toBe(200);
  });
});
