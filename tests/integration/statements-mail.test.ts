import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeTestDb, rows } from './db';
import type { WorkedExample } from './ledger-fixture';
import { closedWorkedExample, statementIds } from './ledger-settle';
import { listMail, type CaughtMail } from '../mailbox';
import { MAILDEV_URL } from '../test-env';
import type { Client } from './http';

const smtpPort = process.env.SMTP_PORT ?? '1125';
const webPort = process.env.MAIL_WEB_PORT ?? '1180';
const maildev = (action: 'start' | 'stop') => execFileSync('bash', ['scripts/mail.sh', action, 'maildev-test', smtpPort, webPort], { stdio: 'inherit' });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

let ex: WorkedExample;
let coordinator: Client;

const statementsTo = async (address: string) =>
  (await listMail()).filter((m) => m.subject.includes('statement for the') && m.to.some((t) => t.address === address));

beforeAll(async () => {
  ({ ex, coordinator } = await closedWorkedExample());
}, 240_000);

afterAll(async () => {
  maildev('start');
  await closeTestDb();
});

describe('sending the statements while the mail server is down', () => {
  it('fails softly, then every household gets its statement once, also when send was pressed twice', { timeout: 150_000 }, async () => {
    maildev('stop');
    // Pressed twice at once, and once more after.
    const [a, b] = await Promise.all([
      coordinator.post(`/api/seasons/${ex.seasonId}/settlement/send`),
      coordinator.post(`/api/seasons/${ex.seasonId}/settlement/send`),
    ]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect([a.body.queued, b.body.queued].sort()).toEqual([0, 3]);
    expect((await coordinator.post(`/api/seasons/${ex.seasonId}/settlement/send`)).body).toEqual({ queued: 0 });
    const ids = await statementIds(ex);

    // The worker tries, fails and retries; nothing is marked sent.
    let retried = 0;
    for (let i = 0; i < 60 && retried === 0; i++) {
      await sleep(500);
      const [r] = await rows<{ n: string }>(
        `SELECT count(*) AS n FROM pgboss.job WHERE name = 'statement-mail' AND data->>'settlementId' IN (:ids) AND retry_count > 0`,
        { ids: Object.values(ids) },
      );
      retried = Number(r.n);
    }
    expect(retried).toBeGreaterThan(0);
    const [unsent] = await rows<{ n: string }>(`SELECT count(*) AS n FROM settlements WHERE season_id = :s AND sent_at IS NULL`, { s: ex.seasonId });
    expect(Number(unsent.n)).toBe(3);
    const ledgerStatements = async () =>
      ((await coordinator.get(`/api/seasons/${ex.seasonId}/ledger`)).body.statements as { sentAt: string | null }[]).map((st) => st.sentAt !== null);
    expect(await ledgerStatements()).toEqual([false, false, false]);

    maildev('start');
    const until = Date.now() + 120_000;
    let got: CaughtMail[][] = [];
    while (Date.now() < until) {
      got = await Promise.all([ex.emails.ash, ex.emails.birch, ex.emails.cedar].map(statementsTo));
      if (got.every((g) => g.length > 0)) break;
      await sleep(1000);
    }
    // Give any duplicate time to show up before counting.
    await sleep(6000);
    got = await Promise.all([ex.emails.ash, ex.emails.birch, ex.emails.cedar].map(statementsTo));
    expect(got.map((g) => g.length)).toEqual([1, 1, 1]);
    const [sent] = await rows<{ n: string }>(`SELECT count(*) AS n FROM settlements WHERE season_id = :s AND sent_at IS NOT NULL`, { s: ex.seasonId });
    expect(Number(sent.n)).toBe(3);
    // The ledger (built once per change of the co-op) shows them sent as soon as they are.
    expect(await ledgerStatements()).toEqual([true, true, true]);

    // The statement carries the household's figures, the pay link and the PDF.
    const ash = got[0][0];
    expect(ash.text).toContain('Total due: $129.12');
    expect(ash.text).toContain('Syrup owed: 12.74 L');
    expect(ash.text).toContain(`/statements/${ids.ash}/pay`);
    // Every attempt at one statement carries the same Message-ID (MAIL_FROM's domain).
    expect(ash.headers?.['message-id']).toBe(`<statement-${ids.ash}@brixhouse.example>`);
    expect(new Set(got.map((g) => g[0].headers?.['message-id'])).size).toBe(3);
    const pdf = ash.attachments?.find((x) => x.contentType === 'application/pdf');
    expect(pdf).toBeTruthy();
    const file = await fetch(`${MAILDEV_URL}/api/email/${ash.id}/attachment/${encodeURIComponent(pdf!.generatedFileName)}`);
    expect(Buffer.from(await file.arrayBuffer()).subarray(0, 5).toString()).toBe('%PDF-');
  });
});
