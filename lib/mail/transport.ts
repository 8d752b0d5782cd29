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

/** True when the SMTP server answers within two seconds. */
export async function mailHealthy(): Promise<boolean> {
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
