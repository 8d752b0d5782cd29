import { execFileSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import { enqueueMail, MAIL_QUEUE, stopMailQueue } from '@/lib/mail/outbox';
import { waitForMail } from '../mailbox';

const sequelize = getSequelize();
const jobsFor = (subject: string) =>
  sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM pgboss.job WHERE name = :q AND data->>'subject' = :s`, {
    replacements: { q: MAIL_QUEUE, s: subject },
    type: QueryTypes.SELECT,
  });

const smtpPort = process.env.SMTP_PORT ?? '1125';
const webPort = process.env.MAIL_WEB_PORT ?? '1180';
const maildev = (action: 'start' | 'stop') =>
  execFileSync('bash', ['scripts/mail.sh', action, 'maildev-test', smtpPort, webPort], { stdio: 'inherit' });

afterAll(async () => {
  maildev('start');
  await stopMailQueue();
  await sequelize.close();
});

describe('the mail outbox', () => {
  it('queues nothing when the write it belongs to rolls back', async () => {
    const subject = `Rolled back ${Date.now()}`;
    await expect(
      sequelize.transaction(async (transaction) => {
        await enqueueMail({ to: ['brennan@larkspur.example'], subject, text: 'never sent' }, transaction);
        expect(Number((await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM pgboss.job WHERE data->>'subject' = :s`, { replacements: { s: subject }, type: QueryTypes.SELECT, transaction }))[0].n)).toBe(1);
        throw new Error('the write fails');
      }),
    ).rejects.toThrow('the write fails');
    expect(Number((await jobsFor(subject))[0].n)).toBe(0);
  });

  it('sends what a committed write queued, through the server’s worker to the SMTP server', async () => {
    const subject = `Committed ${Date.now()}`;
    await sequelize.transaction(async (transaction) => {
      await enqueueMail({ to: ['szabo@larkspur.example'], subject, text: 'on its way' }, transaction);
    });
    expect(Number((await jobsFor(subject))[0].n)).toBe(1);
    const mail = await waitForMail({ to: 'szabo@larkspur.example', subject });
    expect(mail.text.trim()).toBe('on its way');
  });

  it('retries with back-off while the SMTP server is away, and delivers once it is back', { timeout: 90_000 }, async () => {
    const subject = `Retried ${Date.now()}`;
    maildev('stop');
    await sequelize.transaction(async (transaction) => {
      await enqueueMail({ to: ['ferreira@larkspur.example'], subject, text: 'second time lucky' }, transaction);
    });
    // Give the worker time to try and fail at least once.
    const until = Date.now() + 20_000;
    let retried = 0;
    while (Date.now() < until && retried === 0) {
      await new Promise((r) => setTimeout(r, 500));
      const [job] = await sequelize.query<{ retry_count: number }>(
        `SELECT retry_count FROM pgboss.job WHERE data->>'subject' = :s`,
        { replacements: { s: subject }, type: QueryTypes.SELECT },
      );
      retried = job?.retry_count ?? 0;
    }
    expect(retried).toBeGreaterThan(0);
    maildev('start');
    const mail = await waitForMail({ to: 'ferreira@larkspur.example', subject, timeoutMs: 60_000 });
    expect(mail.text.trim()).toBe('second time lucky');
  });
});
