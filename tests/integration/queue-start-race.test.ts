import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import PgBoss from 'pg-boss';
import { createQueueOnce } from '@/lib/mail/outbox';
import { closeTestDb, rows } from './db';
import { TEST_DATABASE_URL } from '../test-env';

// Two server processes starting together on one database each create the mail queues. pg-boss's
// queue creation can deadlock (40P01) when two connections create the same queues at once; the
// start must survive it, as a second process on a fresh database showed.

const bosses: PgBoss[] = [];
const names = Array.from({ length: 12 }, (_, i) => `start-race-${randomUUID().slice(0, 8)}-${i}`);

afterAll(async () => {
  await rows('DELETE FROM pgboss.queue WHERE name IN (:names)', { names }).catch(() => undefined);
  await Promise.all(bosses.map((b) => b.stop({ graceful: false, timeout: 1_000 })));
  await closeTestDb();
});

describe('two processes creating the mail queues at once', () => {
  it('both finish, and each queue exists once', { timeout: 60_000 }, async () => {
    for (let i = 0; i < 2; i++) {
      const boss = new PgBoss({ connectionString: TEST_DATABASE_URL, max: 4, supervise: false, schedule: false });
      boss.on('error', () => undefined);
      await boss.start();
      bosses.push(boss);
    }
    // The same queues in the same order from both, as two starting servers do.
    const [a, b] = bosses;
    await Promise.all([
      (async () => {
        for (const n of names) await createQueueOnce(a, n);
      })(),
      (async () => {
        for (const n of names) await createQueueOnce(b, n);
      })(),
    ]);
    const made = await rows<{ name: string }>('SELECT name FROM pgboss.queue WHERE name IN (:names)', { names });
    expect(made.map((r) => r.name).sort()).toEqual([...names].sort());
  });
});
