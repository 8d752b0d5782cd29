import { describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { formatSlotRange, localDay, localMinutes, toZonedIso } from '@/lib/time';

// Offsets and the 2027 spring change (14 March, 02:00 EST → 03:00 EDT) from the IANA tz database.
describe('times in the co-op’s zone', () => {
  it('gives the offset each side of the spring change', () => {
    expect(toZonedIso(new Date('2027-03-14T06:59:00Z'), 'America/New_York')).toBe('2027-03-14T01:59:00.000-05:00');
    expect(toZonedIso(new Date('2027-03-14T07:00:00Z'), 'America/New_York')).toBe('2027-03-14T03:00:00.000-04:00');
  });

  it('reads local days and minutes in the zone, not in UTC', () => {
    const lateEvening = new Date('2027-03-02T03:30:00Z');
    expect(localDay(lateEvening, 'America/New_York')).toBe('2027-03-01');
    expect(localMinutes(lateEvening, 'America/New_York')).toBe(22 * 60 + 30);
  });

  it('prints a slot across the change with both days and the new zone name', () => {
    expect(formatSlotRange('2027-03-13T22:00:00-05:00', '2027-03-14T06:00:00-04:00', 'America/New_York')).toBe(
      'Sat 13 Mar, 22:00 – Sun 14 Mar, 06:00 EDT',
    );
    expect(formatSlotRange(new Date('2027-03-16T13:00:00Z'), new Date('2027-03-16T17:00:00Z'), 'America/New_York')).toBe(
      'Tue 16 Mar, 09:00 – 13:00 EDT',
    );
  });
});

// The fast path of toZonedIso (offsets cached per hour) must write what luxon writes, also in the
// hours that hold a clock change: Lord Howe Island changes by 30 minutes at 02:00 local, which is
// half past a UTC hour (IANA tz database).
describe('toZonedIso matches luxon for many rows', () => {
  const zones = ['America/New_York', 'America/Halifax', 'Australia/Lord_Howe', 'Asia/Kathmandu', 'Europe/London', 'UTC'];
  const spans = [
    ['2027-03-13T00:00:00Z', '2027-03-16T00:00:00Z'],
    ['2027-03-27T00:00:00Z', '2027-03-30T00:00:00Z'],
    ['2027-04-02T00:00:00Z', '2027-04-05T00:00:00Z'],
    ['2027-10-02T00:00:00Z', '2027-10-05T00:00:00Z'],
    ['2027-10-30T00:00:00Z', '2027-11-02T00:00:00Z'],
    ['2027-11-06T00:00:00Z', '2027-11-09T00:00:00Z'],
  ];
  it.each(zones)('%s', (zone) => {
    let compared = 0;
    for (const [from, to] of spans) {
      for (let t = Date.parse(from); t < Date.parse(to); t += 7 * 60_000 + 13_007) {
        const at = new Date(t);
        expect(toZonedIso(at, zone)).toBe(DateTime.fromJSDate(at, { zone }).toISO());
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(3000);
  });

  it('writes Z for UTC and the zone offset elsewhere', () => {
    expect(toZonedIso(new Date('2027-01-10T12:00:00Z'), 'UTC')).toBe('2027-01-10T12:00:00.000Z');
    expect(toZonedIso(new Date('2027-01-10T12:00:00Z'), 'Europe/London')).toBe('2027-01-10T12:00:00.000+00:00');
    expect(toZonedIso(new Date('2027-01-10T12:00:00Z'), 'Asia/Kathmandu')).toBe('2027-01-10T17:45:00.000+05:45');
  });
});
