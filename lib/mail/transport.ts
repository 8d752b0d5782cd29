import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

const globalForMail = globalThis as unknown as { __brixhouseMail?: Transporter };

/** The SMTP transport, configured from SMTP_HOST / SMTP_PORT (maildev on loopback locally). */
export function mailTransport(): Transporter {
  if (!globalForMail.__brixhouseMail) {
    const e = env();
    globalForMail.__brixhouseMail = nodemailer.createTransport({
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: false,
      ignoreTLS: e.SMTP_HOST === '127.0.0.1' || e.SMTP_HOST === 'localhost',
      connectionTimeout: 5_000,
    });
  }
  return globalForMail.__brixhouseMail;
}

const HEALTH_TTL_MS = 5_000;
const globalForHealth = globalThis as unknown as { __brixhouseMailHealth?: { at: number; check: Promise<boolean> } };

/**
 * True when the SMTP server answers within two seconds. The answer is kept for five seconds
 * (and shared by concurrent callers), so a busy health endpoint opens at most one SMTP session
 * every five seconds.
 */
export function mailHealthy(): Promise<boolean> {
  const cached = globalForHealth.__brixhouseMailHealth;
  if (cached && Date.now() - cached.at < HEALTH_TTL_MS) return cached.check;
  const check = verifyMail();
  globalForHealth.__brixhouseMailHealth = { at: Date.now(), check };
  return check;
}

async function verifyMail(): Promise<boolean> {
  try {
    await Promise.race([
      mailTransport().verify(),
      new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2_000)),
    ]);
    return true;
  } catch {
    return false;
  }
}
