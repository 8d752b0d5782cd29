import { DateTime } from 'luxon';

const HOUR_MS = 3_600_000;
interface HourOffset {
  offsetMs: number;
  /** What luxon writes after the milliseconds: `-04:00`, `+00:00` or `Z`. */
  suffix: string;
}
// Per zone, the offset of each UTC hour met so far (null: the offset changes inside that hour).
const hourOffsets = new Map<string, Map<number, HourOffset | null>>();

function offsetOfHour(zone: string, hour: number): HourOffset | null {
  let hours = hourOffsets.get(zone);
  if (!hours) hourOffsets.set(zone, (hours = new Map()));
  let o = hours.get(hour);
  if (o === undefined) {
    const first = DateTime.fromMillis(hour * HOUR_MS, { zone });
    const last = DateTime.fromMillis((hour + 1) * HOUR_MS - 1, { zone });
    o = first.isValid && first.offset === last.offset ? { offsetMs: first.offset * 60_000, suffix: first.toISO()!.slice(23) } : null;
    if (hours.size >= 50_000) hours.clear();
    hours.set(hour, o);
  }
  return o;
}

/**
 * An instant as ISO 8601 with the offset it has in `zone` (e.g. 2027-03-14T09:00:00.000-04:00),
 * exactly as luxon writes it. Luxon works the zone's offset out once per hour of time met; every
 * other call is arithmetic, so a list of many rows formats at the cost of a few.
 */
export function toZonedIso(at: Date, zone: string): string {
  const ms = at.getTime();
  const o = Number.isFinite(ms) ? offsetOfHour(zone, Math.floor(ms / HOUR_MS)) : null;
  const local = o ? new Date(ms + o.offsetMs).toISOString() : '';
  // Years outside 0000–9999 and hours holding a clock change go through luxon itself.
  if (!o || local.length !== 24) return DateTime.fromJSDate(at, { zone }).toISO()!;
  return local.slice(0, 23) + o.suffix;
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

/**
 * The moment a wall clock in `day`'s zone shows `clock` ('HH:MM[:SS]' or minutes after midnight;
 * 24:00 is the next midnight) on `day`'s date. Clock time, not time elapsed since midnight: on the
 * days the clocks change, 09:00 stays 09:00 (midnight plus 540 minutes would be 10:00 in spring and
 * 08:00 in autumn). A time the spring change skips (02:30) moves forward by the gap.
 */
export function atClock(day: DateTime, clock: string | number): DateTime {
  const minutes = typeof clock === 'number' ? clock : clockMinutes(clock);
  const date = day.startOf('day').plus({ days: Math.floor(minutes / 1440) });
  const m = ((minutes % 1440) + 1440) % 1440;
  return date.set({ hour: Math.floor(m / 60), minute: m % 60, second: 0, millisecond: 0 });
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
