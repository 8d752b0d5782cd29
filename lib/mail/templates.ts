import { appUrl } from '@/lib/env';
import type { OutgoingMail } from './outbox';

const SIGN_OFF = '\n\n— Brixhouse, the shared book of your sugarhouse';

/** The welcome e-mail with the one-time link to choose a password. */
export function welcomeMail(p: { to: string; name: string; cooperative: string; role: string; token: string }): OutgoingMail {
  const link = `${appUrl()}/welcome/${p.token}`;
  return {
    to: [p.to],
    subject: `Welcome to ${p.cooperative} on Brixhouse`,
    text:
      `Hello ${p.name},\n\nYou have been added to ${p.cooperative} as a ${p.role}. ` +
      `Choose your password here (the link works for 7 days):\n${link}\n\n` +
      `Then sign in with this e-mail address to book boil slots and follow your sap.` +
      SIGN_OFF,
  };
}
