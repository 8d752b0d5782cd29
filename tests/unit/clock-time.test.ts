import { describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { atClock } from '@/lib/time';
import { closingOn, defaultEnd, defaultStart } from '@/components/calendar/slot-time';

// The United States' changes of clock in America/New_York — second Sunday of March 02:00 EST →
// 03:00 EDT, first Sunday of November 02:00 EDT → 01:00 EST — from the IANA time zone database
// (tzdata, IANA, 2024; rule set by the Energy Policy Act of 2005). 2027: 14 March and 7 November.
const ZONE = 'America/New_York';
const day = (iso: string) => DateTime.fromISO(iso, { zone: ZONE });
const SPRING = day('2027-03-14');
const AUTUMN = day('2027-11-07');

describe('clock time on the days the clocks change', () => {
  it('keeps 09:00 at 09:00 on the spring change, where midnight plus nine hours is 10:00', () => {
    expect(SPRING.startOf('day').plus({ minutes: 540 }).toFormat('HH:mm')).toBe('10:00');
    expect(atClock(SPRING, '09:00').toISO()).toBe('2027-03-14T09:00:00.000-04:00');
  });

  it('keeps 09:00 at 09:00 on the autumn change, where midnight plus nine hours is 08:00', () => {
    expect(AUTUMN.startOf('day').plus({ minutes: 540 }).toFormat('HH:mm')).toBe('08:00');
    expect(atClock(AUTUMN, '09:00').toISO()).toBe('2027-11-07T09:00:00.000-05:00');
  });

  it('reads minutes after midnight and 24:00 as clock times too', () => {
    expect(atClock(SPRING, 17 * 60 + 30).toISO()).toBe('2027-03-14T17:30:00.000-04:00');
    expect(atClock(AUTUMN, '24:00:00').toISO()).toBe('2027-11-08T00:00:00.000-05:00');
    expect(atClock(AUTUMN.set({ hour: 15 }), '06:00').toISO()).toBe('2027-11-07T06:00:00.000-05:00');
  });

  it('moves a time the spring change skips forward by the hour it skips', () => {
    expect(atClock(SPRING, '02:30').toISO()).toBe('2027-03-14T03:30:00.000-04:00');
  });

  it('gives the same wall-clock hour on every day of a year, across both changes', () => {
    const wrong: string[] = [];
    for (let d = day('2027-01-01'); d < day('2028-01-01'); d = d.plus({ days: 1 })) {
      const t = atClock(d, '09:15');
      if (t.toFormat('HH:mm') !== '09:15' || t.toISODate() !== d.toISODate()) wrong.push(d.toISODate()!);
    }
    expect(wrong).toEqual([]);
  });
});

describe('the calendar’s default booking times on both change days', () => {
  const rules = { closesAt: '17:00:00', slotMinMinutes: 120 };

  for (const [name, d] of [['spring', SPRING], ['autumn', AUTUMN]] as const) {
    it(`start at 09:00, or opening time when later, on the ${name} change`, () => {
      expect(defaultStart(d, '06:00:00').toFormat('yyyy-MM-dd HH:mm')).toBe(`${d.toISODate()} 09:00`);
      expect(defaultStart(d, '10:30:00').toFormat('yyyy-MM-dd HH:mm')).toBe(`${d.toISODate()} 10:30`);
    });

    it(`end three hours on, kept inside closing time at 17:00, on the ${name} change`, () => {
      expect(defaultEnd(atClock(d, '09:00'), rules).toFormat('HH:mm')).toBe('12:00');
      expect(closingOn(atClock(d, '15:00'), rules.closesAt).toFormat('HH:mm')).toBe('17:00');
      expect(defaultEnd(atClock(d, '15:00'), rules).toFormat('HH:mm')).toBe('17:00');
    });
  }
});
