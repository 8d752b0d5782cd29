import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, rows } from './db';
import type { WorkedExample } from './ledger-fixture';
import { closedWorkedExample, statementIds } from './ledger-settle';
import { signedIn } from './http';
import { listMail } from '../mailbox';
import { sleep, startServer, until, type ServerProcess } from './processes';

// Fault test: the server process that queued the statements is killed without warning (SIGKILL)
// while the mail server is down and the statements are being retried. Its queued jobs are then
// removed as well, as if they had been lost with it. Started again, the server queues every
// statement that was queued but not sent, and each household gets its statement exactly once.

const smtpPort = process.env.SMTP_PORT ?? '1125';
const webPort = process.env.MAIL_WEB_PORT ?? '1180';
const maildev = (action: 'start' | 'stop') => execFileSync('bash', ['scripts/mail.sh', action, 'maildev-test', smtpPort, webPort], { stdio: 'inherit' });

let ex: WorkedExample;
/** The mail server is down on purpose here, so the server is up once its database is. */
const databaseUp = (h: { database?: string }) => h.database === 'up';
let server: ServerProcess | undefined;

const statementsTo = async (address: string) =>
  (await listMail()).filter((m) => m.subject.includes('statement for the') && m.to.some((t) => t.address === address));

const jobCount = async (ids: string[]) =>
  Number(
    (
      await rows<{ n: string }>(`SELECT count(*) AS n FROM pgboss.job WHERE name = 'statement-mail' AND data->>'settlementId' IN (:ids)`, { ids })
    )[0].n,
  );

beforeAll(async () => {
  ({ ex } = await closedWorkedExample());
}, 240_000);

afterAll(async () => {
  server?.stop();
  maildev('start');
  await closeTestDb();
});

describe('a server killed while it sends the statements', () => {
  it('queues the unsent statements again when it starts, and every household gets its statement once', { timeout: 720_000 }, async () => {
    maildev('stop');
    server = await startServer('statements-restart', process.env, 240_000, databaseUp);
    const coordinator = await signedIn(ex.emails.coordinator, server.url);
    const sent = await coordinator.post(`/api/seasons/${ex.seasonId}/settlement/send`);
    expect(sent.status).toBe(200);
    expect(sent.body.queued).toBe(3);
    const ids = Object.values(await statementIds(ex));

    // The jobs run and fail against the missing mail server.
    await until(
      'a statement job retried',
      async () =>
        Number(
          (
            await rows<{ n: string }>(
              `SELECT count(*) AS n FROM pgboss.job WHERE name = 'statement-mail' AND data->>'settlementId' IN (:ids) AND retry_count > 0`,
              { ids },
            )
          )[0].n,
        ) > 0,
      60_000,
      500,
    );

    // Killed without a chance to finish; its jobs go with it.
    const exited = new Promise((r) => server!.process.once('exit', r));
    server.process.kill('SIGKILL');
    await exited;
    await rows(`DELETE FROM pgboss.job WHERE name = 'statement-mail' AND data->>'settlementId' IN (:ids)`, { ids });
    expect(await jobCount(ids)).toBe(0);
    const [unsent] = await rows<{ n: string }>(`SELECT count(*) AS n FROM settlements WHERE season_id = :s AND sent_at IS NULL`, { s: ex.seasonId });
    expect(Number(unsent.n)).toBe(3);

    // Started again: the unsent statements are queued again before any mail can go.
    server = await startServer('statements-restart', process.env, 240_000, databaseUp);
    await until('the statements queued again', async () => (await jobCount(ids)) >= 3, 30_000, 250);

    maildev('start');
    const emails = [ex.emails.ash, ex.emails.birch, ex.emails.cedar];
    await until('every household’s statement delivered', async () => (await Promise.all(emails.map(statementsTo))).every((g) => g.length > 0), 120_000, 1000);
    // Give any duplicate time to show up before counting.
    await sleep(6000);
    const got = await Promise.all(emails.map(statementsTo));
    expect(got.map((g) => g.length)).toEqual([1, 1, 1]);
    const [done] = await rows<{ n: string }>(`SELECT count(*) AS n FROM settlements WHERE season_id = :s AND sent_at IS NOT NULL`, { s: ex.seasonId });
    expect(Number(done.n)).toBe(3);
  });
});
