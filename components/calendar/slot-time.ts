import { DateTime } from 'luxon';
import { atClock, clockMinutes } from '@/lib/time';

/** A wall-clock moment as the date and time inputs hold it. */
export interface LocalParts {
  date: string;
  time: string;
}

export function toLocalParts(at: DateTime): LocalParts {
  return { date: at.toFormat('yyyy-MM-dd'), time: at.toFormat('HH:mm') };
}

/** Date and time inputs read in the co-op's zone; null when either is missing or invalid. */
export function fromLocalParts({ date, time }: LocalParts, zone: string): DateTime | null {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || !/^\d{2}:\d{2}$/.test(time)) return null;
  const at = DateTime.fromISO(`${date}T${time}`, { zone });
  return at.isValid ? at : null;
}

/** ISO 8601 with the zone's offset, as the API wants it. */
export const toApiIso = (at: DateTime) => at.toISO({ suppressMilliseconds: true })!;

/** Where a booking picked by the day alone starts: 09:00 on the clock, or opening time if later. */
export function defaultStart(day: DateTime, opensAt: string): DateTime {
  return atClock(day, Math.max(clockMinutes(opensAt), 9 * 60));
}

/** Closing time on the clock, on the day of `at`. */
export const closingOn = (at: DateTime, closesAt: string) => atClock(at, closesAt);

/**
 * A sensible end for a start picked with one click: a few hours on, kept inside the sugarhouse
 * hours when that still leaves the shortest allowed slot.
 */
export function defaultEnd(start: DateTime, { closesAt, slotMinMinutes }: { closesAt: string; slotMinMinutes: number }): DateTime {
  const wanted = start.plus({ minutes: Math.max(slotMinMinutes, 180) });
  const closing = closingOn(start, closesAt);
  if (wanted > closing && closing.diff(start, 'minutes').minutes >= slotMinMinutes) return closing;
  return wanted;
}

/** "3.5", "12": hours to a tenth, without a trailing ".0". */
export function hourCount(hours: number): string {
  const rounded = Math.round(hours * 10) / 10;
  return Number.isInteger(rounded) ? rounded.toFixed(0) : rounded.toFixed(1);
}

/** "3.5 h", "12 h". */
export const formatHours = (hours: number) => `${hourCount(hours)} h`;

/** "Tue 4 Mar 18:00" in the co-op's zone. */
export function formatMoment(iso: string, zone: string): string {
  // One locale, so the server's first render and the browser's agree.
  return DateTime.fromISO(iso, { zone, locale: 'en-US' }).toFormat('ccc d LLL HH:mm');
}
