import { litresToGallons, type UnitSystem } from '@/lib/sugar';
import { formatVolume } from '@/lib/format/units';
import { showBrix, showMass, showVolume } from '@/lib/figures';

const dateTimeFormats = new Map<string, Intl.DateTimeFormat>();

/** "Tue 1 Dec, 09:14" in the co-op's zone; the same text on the server and in the browser. */
export function formatWhen(iso: string, timeZone: string, withYear = false): string {
  const id = `${timeZone}|${withYear}`;
  let f = dateTimeFormats.get(id);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      ...(withYear ? { year: 'numeric' } : {}),
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
    });
    dateTimeFormats.set(id, f);
  }
  return f.format(new Date(iso));
}

/** "Tue 1 Dec" of a calendar day 'YYYY-MM-DD'. */
export function formatDay(day: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', weekday: 'short', day: 'numeric', month: 'short' }).format(new Date(`${day}T12:00:00Z`));
}

export const volumeUnit = (units: UnitSystem) => (units === 'us' ? 'gal' : 'L');
export const massUnit = (units: UnitSystem) => (units === 'us' ? 'lb' : 'kg');
export const tempUnit = (units: UnitSystem) => (units === 'us' ? '°F' : '°C');

/** Safe formatters: a figure out of range shows a dash instead of throwing in a render. */
export const vol = (litres: number, units: UnitSystem, digits?: number) => safe(() => (digits === undefined ? showVolume(litres, units) : formatVolume(litres, units, { digits })));
export const mass = (kg: number, units: UnitSystem) => safe(() => showMass(kg, units));
export const brix = (b: number) => safe(() => showBrix(b));
/** A volume in the co-op's unit as a plain number, for CSV. */
export const volumeNumber = (litres: number, units: UnitSystem) => (units === 'us' ? litresToGallons(litres) : litres);

function safe(f: () => string): string {
  try {
    return f();
  } catch {
    return '—';
  }
}
