import { describe, expect, it } from 'vitest';
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
