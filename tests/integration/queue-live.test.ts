import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import { BASE_URL, TEST_PORT } from '../test-env';
import { signedIn, type Client } from './http';
import { closeTestDb, markChanged, testDb } from './db';
import { demoCoop, testEvaporator } from './lots';
import type { QueueSnapshot } from '@/lib/queue/types';

// A second server process on the same database, as when the co-op runs more than one.
const SECOND_PORT = TEST_PORT + 2;
const SECOND_URL = `http://127.0.0.1:${SECOND_PORT}`;
let second: ChildProcess;
const sockets: Socket[] = [];
let staff: Client;
let member: Client;

beforeAll(async () => {
  [staff, member] = await Promise.all([signedIn('sugarmaker@larkspur.example'), signedIn('nakamura@larkspur.example')]);
  second = spawn('node', ['--import', 'tsx', 'server.ts'], {
    env: { ...process.env, PORT: String(SECOND_PORT), NODE_ENV: 'production', NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? '.next-test' },
    stdio: 'ignore',
  });
  for (let i = 0; i < 480; i++) {
    try {
      if ((await fetch(`${SECOND_URL}/api/health`)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('the second server did not start');
}, 150_000);

/** The run this test starts (it takes no sap, so it cannot be finished): removed after, for the files that follow. */
let leftRun: { runId: string; cooperativeId: string } | null = null;

afterAll(async () => {
  for (const s of sockets) s.close();
  second?.kill('SIGTERM');
  if (leftRun) {
    await testDb().query('DELETE FROM syrup_draws WHERE run_id = :r', { replacements: { r: leftRun.runId } });
    await testDb().query('DELETE FROM boil_runs WHERE id = :r', { replacements: { r: leftRun.runId } });
    await markChanged(leftRun.cooperativeId);
  }
  await closeTestDb();
});

const post = (url: string, path: string, body: unknown) =>
  fetch(`${url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: staff.cookieHeader }, body: JSON.stringify(body) });

describe('the live queue across two server processes', { timeout: 120_000 }, () => {
  it('reaches a screen on one process when the change is posted through the other, versions only growing', async () => {
    const co = await demoCoop();
    const screen = connect(BASE_URL, { path: '/realtime', transports: ['websocket'], extraHeaders: { cookie: member.cookieHeader }, reconnection: false });
    sockets.push(screen);
    const received: QueueSnapshot[] = [];
    screen.on('queue', (s: QueueSnapshot) => received.push(s));
    // The current snapshot arrives as soon as the socket joins.
    await expect.poll(() => received.length, { timeout: 10_000 }).toBeGreaterThan(0);
    const joined = received[0].version;

    const evaporatorId = await testEvaporator(co.cooperativeId);
    const started = await post(SECOND_URL, '/api/runs', { evaporatorId, slotId: null });
    expect(started.status).toBe(201);
    const run = (await started.json()) as { id: string; lotCode: string };
    leftRun = { runId: run.id, cooperativeId: co.cooperativeId };
    await expect.poll(() => received.some((s) => s.version > joined), { timeout: 2_000 }).toBe(true);

    // A burst of draw-offs through the second process: each version reaches the first process's screen in order.
    const base = received.at(-1)!.totals.syrupDrawnTodayL;
    for (let i = 0; i < 3; i++) {
      const res = await post(SECOND_URL, `/api/runs/${run.id}/draws`, { litres: 1 + i, brix: 67, transmittancePct: 70 - i * 10 });
      expect(res.status).toBe(201);
    }
    await expect.poll(() => received.at(-1)!.totals.syrupDrawnTodayL - base, { timeout: 2_000 }).toBeCloseTo(6, 9);
    const versions = received.map((s) => s.version);
    expect(versions).toEqual([...versions].sort((a, b) => a - b));
    // Broadcasts: one snapshot per version, not one per process.
    const broadcast = versions.slice(1);
    expect(new Set(broadcast).size).toBe(broadcast.length);

    const finish = await post(SECOND_URL, `/api/runs/${run.id}/finish`, {});
    expect(finish.status).toBe(422); // nothing taken in: refused, and no broadcast claims otherwise
  });
});
