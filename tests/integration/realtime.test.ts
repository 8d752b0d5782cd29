import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { io as connect, type Socket } from 'socket.io-client';
import { BASE_URL } from '../test-env';
import bcrypt from 'bcryptjs';
import { Client, signedIn } from './http';
import { closeTestDb, testDb } from './db';
import { startServer, type ServerProcess } from './processes';

// A second server process on the same database (on a free port), as when the co-op runs more than one.
let second: ServerProcess;
let SECOND_URL = '';
const sockets: Socket[] = [];

function socketFor(url: string, cookie?: string): Socket {
  const s = connect(url, { path: '/realtime', transports: ['websocket'], extraHeaders: cookie ? { cookie } : {}, reconnection: false });
  sockets.push(s);
  return s;
}

const connected = (s: Socket) =>
  new Promise<void>((resolve, reject) => {
    s.once('connect', () => resolve());
    s.once('connect_error', (err) => reject(err));
  });

beforeAll(async () => {
  // Another invented co-op on the same deployment, whose screens must hear nothing of Larkspur's.
  await testDb().query(
    `WITH c AS (INSERT INTO cooperatives (name, time_zone, elevation_m, unit_system, currency)
                VALUES ('Stillwater Bend Cooperative', 'America/Halifax', 90, 'metric', 'CAD') RETURNING id)
     INSERT INTO users (cooperative_id, name, email, password_hash, role)
     SELECT id, 'Oona Reyes', 'coordinator@stillwater.example', :h, 'coordinator' FROM c`,
    { replacements: { h: await bcrypt.hash('another-co-op', 4) } },
  );
  second = await startServer('realtime-second', process.env);
  SECOND_URL = second.url;
}, 120_000);

afterAll(async () => {
  for (const s of sockets) s.close();
  second?.stop();
  await closeTestDb();
});

describe('live updates', () => {
  it('refuse a socket without a session', async () => {
    await expect(connected(socketFor(BASE_URL))).rejects.toThrow(/sign in/i);
  });

  it('reach a screen on one server process when a slot is booked through another', async () => {
    const watcher: Client = await signedIn('brennan@larkspur.example');
    const booker: Client = await signedIn('szabo@larkspur.example');
    const outsider = new Client();
    expect(await outsider.signIn('coordinator@stillwater.example', 'another-co-op')).toBe(true);

    const screen = socketFor(BASE_URL, watcher.cookieHeader);
    const otherCoop = socketFor(BASE_URL, outsider.cookieHeader);
    await Promise.all([connected(screen), connected(otherCoop)]);
    let leaked = false;
    otherCoop.on('slots:changed', () => (leaked = true));
    const heard = new Promise<{ id: string }>((resolve) => screen.once('slots:changed', resolve));

    // Booked on the second process; the screen is connected to the first.
    const evaporatorId = (await booker.get('/api/evaporators')).body[0].id;
    const day = DateTime.now().setZone('America/New_York').startOf('day').plus({ days: 23 });
    const res = await fetch(`${SECOND_URL}/api/slots`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie: booker.cookieHeader },
      body: JSON.stringify({ evaporatorId, startsAt: day.set({ hour: 8 }).toISO(), endsAt: day.set({ hour: 10 }).toISO() }),
    });
    expect(res.status).toBe(201);
    const slot = (await res.json()) as { id: string };
    const event = await Promise.race([heard, new Promise<never>((_, reject) => setTimeout(() => reject(new Error('no event within 2 s')), 2_000))]);
    expect(event.id).toBe(slot.id);
    await new Promise((r) => setTimeout(r, 300));
    expect(leaked).toBe(false);
  });
});
