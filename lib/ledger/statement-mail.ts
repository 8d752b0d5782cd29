// Server code (database, SMTP), without the 'server-only' marker: server.ts starts the worker
// under plain Node.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { getSequelize } from '@/db';
import { recordChange } from '@/lib/events';
import { appUrl, env } from '@/lib/env';
import { createQueueOnce, mailQueue } from '@/lib/mail/outbox';
import { mailTransport } from '@/lib/mail/transport';
import { formatMoney } from '@/lib/format/units';
import { statementLines } from './format';
import { statementPdf } from './pdf';
import { loadStatement } from './statement-data';
import type { Statement } from './types';

/** The queue of statement e-mails (pg-boss, in PostgreSQL): one job names one settlement row. */
export const STATEMENT_QUEUE = 'statement-mail';

const JOB_OPTIONS = { retryLimit: 14, retryDelay: 2, retryBackoff: true, expireInSeconds: 120 };

interface PgClientLike {
  query(text: string, values: unknown[]): Promise<{ rows: unknown[] }>;
}

const globalForQueue = globalThis as unknown as { __brixhouseStatementQueue?: Promise<void> };

async function ensureQueue() {
  globalForQueue.__brixhouseStatementQueue ??= mailQueue().then((boss) => createQueueOnce(boss, STATEMENT_QUEUE));
  try {
    await globalForQueue.__brixhouseStatementQueue;
  } catch (err) {
    // Not kept: the next caller tries again.
    globalForQueue.__brixhouseStatementQueue = undefined;
    throw err;
  }
}

/** Queues one job per statement inside the settlement's transaction (nothing if it rolls back). */
export async function enqueueStatements(ids: string[], transaction: Transaction) {
  if (ids.length === 0) return;
  await ensureQueue();
  const boss = await mailQueue();
  const client = (transaction as unknown as { connection?: PgClientLike }).connection;
  if (!client) throw new Error('The transaction has no open connection to queue statements on.');
  const db = { executeSql: (text: string, values: unknown[]) => client.query(text, values) as Promise<{ rows: unknown[] }> };
  for (const settlementId of ids) {
    await boss.send(STATEMENT_QUEUE, { settlementId }, { ...JOB_OPTIONS, db });
  }
}

/** Where a household pays its balance (sign-in first, then the payment service's page). */
export const payUrl = (statementId: string) => `${appUrl()}/statements/${statementId}/pay`;
export const statementUrl = (statementId: string) => `${appUrl()}/statements/${statementId}`;

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** The statement e-mail, plain text and HTML, in the co-op's units and currency. */
export function statementMail(s: Statement) {
  const lines = statementLines(s);
  const subject = `${s.seasonLabel} statement for the ${s.householdName} household`;
  const balance = formatMoney(s.balanceCents, s.currency);
  const payLine = s.balanceCents > 0 ? `Pay the balance of ${balance} online: ${payUrl(s.id)}` : 'Nothing is left to pay. Thank you.';
  const text =
    `Hello ${s.householdName} household,\n\n` +
    `${s.cooperativeName} has settled ${s.seasonLabel}. Your statement:\n\n` +
    lines.map((l) => `  ${l.label}: ${l.value}`).join('\n') +
    `\n\n${payLine}\n` +
    `The statement is attached as a PDF and always in the app: ${statementUrl(s.id)}\n\n` +
    `Syrup and fuel are split by the sugar your sap put into each boil, not by the litre.` +
    `\n\n— Brixhouse, the shared book of your sugarhouse`;
  const rows = lines
    .map(
      (l) =>
        `<tr><th scope="row" style="text-align:left;padding:4px 16px 4px 0;font-weight:${l.strong ? 700 : 400}">${escapeHtml(l.label)}</th>` +
        `<td style="text-align:right;padding:4px 0;font-variant-numeric:tabular-nums;font-weight:${l.strong ? 700 : 400}">${escapeHtml(l.value)}</td></tr>`,
    )
    .join('');
  const html =
    `<!doctype html><html lang="en"><body style="font-family:system-ui,sans-serif;color:#232c36;background:#f6f1e7;padding:16px">` +
    `<div style="max-width:560px;margin:0 auto;background:#fffcf6;border:1px solid #ddd3c1;border-radius:12px;padding:20px">` +
    `<h1 style="font-size:20px;margin:0 0 4px">${escapeHtml(s.seasonLabel)} statement</h1>` +
    `<p style="margin:0 0 16px">${escapeHtml(s.householdName)} household · ${escapeHtml(s.cooperativeName)}</p>` +
    `<table style="border-collapse:collapse;width:100%">${rows}</table>` +
    (s.balanceCents > 0
      ? `<p style="margin:20px 0"><a href="${escapeHtml(payUrl(s.id))}" style="display:inline-block;background:#1e5b43;color:#fffcf6;padding:12px 20px;border-radius:8px;text-decoration:none;font-weight:700">Pay ${escapeHtml(balance)}</a></p>`
      : `<p style="margin:20px 0;font-weight:700">Nothing is left to pay. Thank you.</p>`) +
    `<p style="font-size:14px;color:#545e69">The statement is attached as a PDF and always in the app: <a href="${escapeHtml(statementUrl(s.id))}">${escapeHtml(statementUrl(s.id))}</a>. ` +
    `Syrup and fuel are split by the sugar your sap put into each boil, not by the litre.</p></div></body></html>`;
  return { subject, text, html };
}

/**
 * One Message-ID per statement, the same on every attempt: if the server stops after the mail
 * server took a statement but before its `sent_at` committed, the job sends it again, and mail
 * servers and programs that drop a second message with an ID they already hold show it once.
 */
export function statementMessageId(settlementId: string, from: string = env().MAIL_FROM): string {
  const domain = /@([A-Za-z0-9.-]+)>?\s*$/.exec(from)?.[1] ?? 'brixhouse.invalid';
  return `<statement-${settlementId}@${domain}>`;
}

const fileName = (s: Statement) => `statement-${s.seasonLabel.replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}-${s.householdName.replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}.pdf`;

/**
 * Sends one statement unless it has gone already. The statement's row stays locked while the
 * mail goes out and `sent_at` is set in the same transaction, so two jobs for one statement
 * (a re-queue after a restart) send it once; a failed send rolls back and the job retries. A stop
 * between the mail server's answer and the commit sends it again, under the same Message-ID.
 */
export async function deliverStatement(settlementId: string, sequelize: Sequelize = getSequelize()): Promise<'sent' | 'already-sent' | 'missing'> {
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ cooperativeId: string; householdId: string; sentAt: Date | null }>(
      `SELECT cooperative_id AS "cooperativeId", household_id AS "householdId", sent_at AS "sentAt" FROM settlements WHERE id = :settlementId FOR UPDATE`,
      { replacements: { settlementId }, type: QueryTypes.SELECT, transaction },
    );
    if (!row) return 'missing';
    if (row.sentAt) return 'already-sent';
    const statement = await loadStatement(sequelize, settlementId, row.cooperativeId, transaction);
    if (!statement) return 'missing';
    const people = await sequelize.query<{ email: string; name: string }>(
      `SELECT email, name FROM users WHERE cooperative_id = :cooperativeId AND household_id = :householdId ORDER BY email`,
      { replacements: row, type: QueryTypes.SELECT, transaction },
    );
    if (people.length) {
      const mail = statementMail(statement);
      const pdf = await statementPdf(statement, payUrl(statement.id));
      await mailTransport().sendMail({
        from: env().MAIL_FROM,
        messageId: statementMessageId(settlementId),
        to: people.map((p) => ({ name: p.name, address: p.email })),
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        attachments: [{ filename: fileName(statement), content: pdf, contentType: 'application/pdf' }],
      });
    }
    await sequelize.query(`UPDATE settlements SET sent_at = now() WHERE id = :settlementId`, { replacements: { settlementId }, transaction });
    await recordChange({ cooperativeId: row.cooperativeId, transaction }, { type: 'statement.sent', settlementId });
    return 'sent';
  });
}

/**
 * Starts the statement worker (server.ts, once). Statements queued but not sent are queued again
 * first: a job that was running when the server stopped is not lost, and a duplicate job finds
 * the statement sent and does nothing.
 */
export async function startStatementWorker() {
  await ensureQueue();
  const boss = await mailQueue();
  const sequelize = getSequelize();
  const unsent = await sequelize.query<{ id: string }>(
    `SELECT id FROM settlements WHERE queued_at IS NOT NULL AND sent_at IS NULL`,
    { type: QueryTypes.SELECT },
  );
  for (const { id } of unsent) await boss.send(STATEMENT_QUEUE, { settlementId: id }, JOB_OPTIONS);
  await boss.work<{ settlementId: string }>(STATEMENT_QUEUE, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
    for (const job of jobs) await deliverStatement(job.data.settlementId, sequelize);
  });
}
