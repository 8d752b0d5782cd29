import { appUrl } from '@/lib/env';
import type { OutgoingMail } from '@/lib/mail/outbox';

export const RESET_MINUTES = 60;

/** The e-mail with a one-time link to choose a new password. */
export function resetMail(p: { to: string; name: string; token: string }): OutgoingMail {
  const link = `${appUrl()}/reset-password/${p.token}`;
  return {
    to: [p.to],
    subject: 'Choose a new Brixhouse password',
    text:
      `Hello ${p.name},\n\nSomeone (we hope you) asked to reset the password of this Brixhouse account. ` +
      `Choose a new one here; the link works once, for ${RESET_MINUTES} minutes:\n${link}\n\n` +
      `If you did not ask for this, ignore this e-mail: your password stays as it is.` +
      `\n\n— Brixhouse, the shared book of your sugarhouse`,
  };
}
