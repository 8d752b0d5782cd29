import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { DateTime } from 'luxon';
import { db } from '@/db/models';
import { appUrl } from '@/lib/env';
import { enqueueMail } from '@/lib/mail/outbox';
import { type UnitSystem } from '@/lib/sugar';
import { showBrix, showTemperature, showVolume } from '@/lib/figures';

export interface RejectedLot {
  id: string;
  householdId: string;
  receivedAt: Date;
  collectedOn: string;
  volumeL: number;
  brix: number;
  sapTempC: number;
  reason: string;
}

export interface MailCoop {
  id: string;
  name: string;
  timeZone: string;
  unitSystem: UnitSystem;
}

/** The rejection e-mail's subject and text (exported for tests and previews). */
export function rejectionText(lot: RejectedLot, householdName: string, coop: MailCoop) {
  const when = DateTime.fromJSDate(lot.receivedAt, { zone: coop.timeZone }).toFormat("ccc d LLL yyyy, HH:mm ZZZZ");
  // The same figures as the desk shows: "52.8 gal", not "52.83 gal".
  const volume = showVolume(lot.volumeL, coop.unitSystem);
  const subject = `Sap drop-off not accepted: ${volume} on ${DateTime.fromJSDate(lot.receivedAt, { zone: coop.timeZone }).toFormat('ccc d LLL')}`;
  const text =
    `Hello ${householdName} household,\n\n` +
    `The sap your household brought to ${coop.name} was not accepted, and it will not count toward your sugar or your share of the syrup.\n\n` +
    `Reason: ${lot.reason}\n\n` +
    `Lot: ${volume} at ${showBrix(lot.brix)}, ${showTemperature(lot.sapTempC, coop.unitSystem)} at the tank, collected ${lot.collectedOn}, received ${when}.\n\n` +
    `Sap keeps best cold (at or below about 3–4 °C / 38–40 °F), in clean covered containers, and brought in within a day or two of collection. ` +
    `If you think this is a mistake, speak to the sugarmaker on duty; corrections are kept on record.\n\n` +
    `Your drop-offs: ${appUrl()}/deliveries\n\n— Brixhouse, the shared book of your sugarhouse`;
  return { subject, text };
}

/** Queues the rejection e-mail to every person of the household, inside the write's transaction. */
export async function queueRejectionMail(lot: RejectedLot, coop: MailCoop, transaction: Transaction) {
  const { sequelize } = db();
  const people = await sequelize.query<{ email: string; household_name: string }>(
    `SELECT u.email, h.name AS household_name FROM households h JOIN users u ON u.household_id = h.id AND u.cooperative_id = h.cooperative_id
      WHERE h.id = :householdId AND h.cooperative_id = :cooperativeId ORDER BY u.email`,
    { replacements: { householdId: lot.householdId, cooperativeId: coop.id }, type: QueryTypes.SELECT, transaction },
  );
  if (!people.length) return;
  const { subject, text } = rejectionText(lot, people[0].household_name, coop);
  await enqueueMail({ to: people.map((p) => p.email), subject, text }, transaction);
}
