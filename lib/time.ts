import { DateTime } from 'luxon';

/** An instant as ISO 8601 with the offset it has in `zone` (e.g. 2027-03-14T09:00:00.000-04:00). */
export function toZonedIso(at: Date, zone: string): string {
  return DateTime.fromJSDate(at, { zone }).toISO()!;
}

/** The calendar day (YYYY-MM-DD) of an instant in `zone`. */
export function localDay(at: Date, zone: string): string {
  return DateTime.fromJSDate(at, { zone }).toISODate()!;
}

/** Minutes after local midnight of an instant in `zone`. */
export function localMinutes(at: Date, zone: string): number {
  const t = DateTime.fromJSDate(at, { zone });
  return t.hour * 60 + t.minute;
}

/** 'HH:MM[:SS]' to minutes after midnight. */
export function clockMinutes(hhmm: string): number {
  const [h, m] = hhmm.split(':').map(Number);
  return h * 60 + m;
}

/** 'HH:MM' of a time-of-day column value. */
export const clockLabel = (hhmm: string) => hhmm.slice(0, 5);

/** A slot as people read it, in the co-op's time zone: "Sat 13 Mar, 22:00 – Sun 14 Mar, 06:00 EDT". */
export function formatSlotRange(startsAt: Date | string, endsAt: Date | string, zone: string): string {
  const s = typeof startsAt === 'string' ? DateTime.fromISO(startsAt, { zone }) : DateTime.fromJSDate(startsAt, { zone });
  const e = typeof endsAt === 'string' ? DateTime.fromISO(endsAt, { zone }) : DateTime.fromJSDate(endsAt, { zone });
  const day = 'ccc d LLL';
  const sameDay = s.hasSame(e, 'day');
  const left = `${s.toFormat(day)}, ${s.toFormat('HH:mm')}`;
  const right = sameDay ? e.toFormat('HH:mm') : `${e.toFormat(day)}, ${e.toFormat('HH:mm')}`;
  return `${left} – ${right} ${e.toFormat('ZZZZ')}`;
}
