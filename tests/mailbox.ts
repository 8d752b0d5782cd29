import { MAILDEV_URL } from './test-env';

/** One e-mail as maildev's REST API gives it. */
export interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  to: { address: string; name?: string }[];
  headers?: Record<string, string | string[]>;
  attachments?: { filename?: string; generatedFileName: string; contentType: string }[];
}

export async function listMail(): Promise<CaughtMail[]> {
  const res = await fetch(`${MAILDEV_URL}/api/email`);
  if (!res.ok) throw new Error(`maildev answered ${res.status}`);
  return res.json();
}

export async function clearMail() {
  await fetch(`${MAILDEV_URL}/api/email/all`, { method: 'DELETE' });
}

/** The text of one attachment of a caught e-mail. */
export async function attachmentText(mail: CaughtMail, fileName: string): Promise<string> {
  const a = mail.attachments?.find((x) => x.filename === fileName);
  if (!a) throw new Error(`no attachment ${fileName} (has: ${mail.attachments?.map((x) => x.filename).join(', ') || 'none'})`);
  const res = await fetch(`${MAILDEV_URL}/api/email/${mail.id}/attachment/${encodeURIComponent(a.generatedFileName)}`);
  if (!res.ok) throw new Error(`maildev answered ${res.status} for the attachment`);
  return res.text();
}

/** Waits (up to `timeoutMs`) for an e-mail to `to` whose subject contains `subject`. */
export async function waitForMail({ to, subject, timeoutMs = 15_000 }: { to: string; subject: string; timeoutMs?: number }): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const found = (await listMail()).find(
      (m) => m.subject.includes(subject) && m.to.some((t) => t.address.toLowerCase() === to.toLowerCase()),
    );
    if (found) return found;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`No e-mail to ${to} with “${subject}” within ${timeoutMs} ms`);
}
