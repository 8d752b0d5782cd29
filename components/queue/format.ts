import type { SpoilageState } from '@/lib/sugar';

const formats = new Map<string, Intl.DateTimeFormat>();

/** "Wed 14:05" in the co-op's zone (the same text on the server and in the browser). */
export function clock(iso: string, zone: string, withDay = true): string {
  const key = `${zone}|${withDay}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', { timeZone: zone, weekday: withDay ? 'short' : undefined, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
    formats.set(key, f);
  }
  return f.format(new Date(iso)).replace(',', '');
}

/** "2 h 05 min" / "35 min". */
export function duration(hours: number): string {
  const total = Math.max(0, Math.round(hours * 60));
  const h = Math.floor(total / 60);
  const m = total % 60;
  return h ? `${h} h ${String(m).padStart(2, '0')} min` : `${m} min`;
}

export const STATE_LABEL: Record<SpoilageState, string> = {
  fresh: 'Fresh',
  watch: 'Boil soon',
  urgent: 'Urgent',
  expired: 'Past deadline',
};

export const STATE_BADGE: Record<SpoilageState, 'neutral' | 'spruce' | 'ember'> = {
  fresh: 'spruce',
  watch: 'neutral',
  urgent: 'ember',
  expired: 'ember',
};
