import PgBoss from 'pg-boss';
import type { Transaction } from 'sequelize';
import { env } from '@/lib/env';
import { mailTransport } from './transport';

export const MAIL_QUEUE = 'mail';

/** One e-mail as queued; attachments carry their content as text (iCalendar, CSV). */
export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: string; contentType: string }[];
}

const globalForBoss = globalThis as unknown as { __brixhouseBoss?: Promise<PgBoss> };

/**
 * Creates a pg-boss queue if it is not there. Creating is idempotent, but two server processes
 * starting together on a fresh database can deadlock on pg-boss's queue table (40P01) or race
 * on its key (23505): the loser tries again, a few times, after a short random pause.
 */
export async function createQueueOnce(boss: PgBoss, name: string, attempts = 6): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await boss.createQueue(name);
      return;
    } catch (err) {
      const code = (err as { code?: string }).code;
      if (attempt >= attempts || !(code === '40P01' || code === '40001' || code === '23505')) throw err;
      await new Promise((r) => setTimeout(r, 50 + Math.random() * 200 * attempt));
    }
  }
}

/** The queue of outgoing mail, kept in PostgreSQL by pg-boss (its own schema "pgboss"). */
export function mailQueue(): Promise<PgBoss> {
  globalForBoss.__brixhouseBoss ??= (async () => {
    const boss = new PgBoss({ connectionString: env().DATABASE_URL, max: 4, supervise: false, schedule: false });
    boss.on('error', (err) => console.error('mail queue:', err.message));
    await boss.start();
    await createQueueOnce(boss, MAIL_QUEUE);
    return boss;
  })();
  // A failed start is not kept: the next caller tries again.
  globalForBoss.__brixhouseBoss.catch(() => {
    globalForBoss.__brixhouseBoss = undefined;
  });
  return globalForBoss.__brixhouseBoss;
}

interface PgClientLike {
  query(text: string, values: unknown[]): Promise<{ rows: unknown[] }>;
}

/**
 * Queues an e-mail inside the caller's transaction: it is sent only if the write it belongs to
 * commits, and the worker retries it with back-off when the SMTP server is away.
 */
export async function enqueueMail(mail: OutgoingMail, transaction?: Transaction) {
  if (mail.to.length === 0) return;
  const boss = await mailQueue();
  const client = (transaction as unknown as { connection?: PgClientLike } | undefined)?.connection;
  // Queuing outside the caller's transaction would send mail for a write that may yet roll back.
  if (transaction && !client) throw new Error('The transaction has no open connection to queue mail on.');
  await boss.send(MAIL_QUEUE, mail as unknown as object, {
    retryLimit: 8,
    retryDelay: 5,
    retryBackoff: true,
    ...(client ? { db: { executeSql: (text: string, values: unknown[]) => client.query(text, values) as Promise<{ rows: unknown[] }> } } : {}),
  });
}

/** Sends queued mail; started once by server.ts. */
export async function startMailWorker() {
  const boss = await mailQueue();
  const from = env().MAIL_FROM;
  await boss.work<OutgoingMail>(MAIL_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
    for (const job of jobs) {
      const m = job.data;
      await mailTransport().sendMail({
        from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        attachments: m.attachments?.map((a) => ({ filename: a.filename, content: a.content, contentType: a.contentType })),
      });
    }
  });
}

export async function stopMailQueue() {
  const boss = await globalForBoss.__brixhouseBoss;
  if (boss) await boss.stop({ graceful: true, timeout: 3_000 });
  globalForBoss.__brixhouseBoss = undefined;
}
