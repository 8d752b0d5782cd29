import { describe, expect, it } from 'vitest';
import { spoilageDeadline, spoilageState } from '@/lib/sugar';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const F = (c: number) => ((c - 32) * 5) / 9;

// The shelf lives and warning thresholds are co-op settings with defaults; these tests check
// what the settings do, and hold the defaults only to outside limits: raw sap is perishable,
// unfrozen sap keeps about a week at most, sap should be held at or below about 38–40 °F
// (Cornell University, "Reducing Maple Sap Spoilage", 2025; common practice).
describe('spoilageDeadline (Cornell University, “Reducing Maple Sap Spoilage”, 2025; common practice)', () => {
  const collectedAt = new Date('2025-03-10T07:30:00-04:00');
  const left = (sapTempC: number, options = {}) => spoilageDeadline(collectedAt, { sapTempC, ...options }).getTime() - collectedAt.getTime();

  it('by default, cold sap (38 °F) keeps at most about a week and at least a day (Cornell 2025: about a week at most; common practice)', () => {
    expect(left(F(38))).toBeLessThanOrEqual(7 * DAY);
    expect(left(F(38))).toBeGreaterThanOrEqual(1 * DAY);
  });

  it('by default, sap held at 38–40 °F counts as cold and sap at 60 °F as warm, which keeps less (Cornell 2025; common practice)', () => {
    expect(left(F(40))).toBe(left(F(34)));
    expect(left(F(60))).toBeLessThan(left(F(40)));
    expect(left(F(60))).toBeGreaterThan(0);
  });

  it('the settings drive it: shelf days for cold sap, warm shelf days above the warm threshold, the threshold itself still cold (co-op settings; common practice)', () => {
    const settings = { shelfDays: 5, warmAboveC: 4, warmShelfDays: 1.5 };
    expect(left(2, settings)).toBe(5 * DAY);
    expect(left(4, settings)).toBe(5 * DAY);
    expect(left(4.1, settings)).toBe(1.5 * DAY);
    expect(left(2, { ...settings, shelfDays: 6 })).toBe(6 * DAY);
    expect(left(9, { ...settings, warmAboveC: 10 })).toBe(5 * DAY);
  });

  it('counts elapsed 24-hour days across a daylight-saving change (sap ages by the hour, not the calendar: common practice)', () => {
    const beforeDst = new Date('2025-03-05T18:00:00-05:00');
    expect(spoilageDeadline(beforeDst, { sapTempC: 2, shelfDays: 7 }).toISOString()).toBe('2025-03-12T23:00:00.000Z');
  });
});

describe('spoilageState (warning thresholds are co-op settings; common practice)', () => {
  const deadline = new Date('2025-03-17T12:00:00Z');
  const at = (hoursLeft: number) => new Date(deadline.getTime() - hoursLeft * HOUR);
  const settings = { urgentHours: 36, watchHours: 96 };

  it.each([
    [200, 'fresh'],
    [96, 'fresh'],
    [95.99, 'watch'],
    [36, 'watch'],
    [35.99, 'urgent'],
    [0.01, 'urgent'],
    [0, 'expired'],
    [-5, 'expired'],
  ] as const)('with urgent 36 h and watch 96 h: %f h left → %s (co-op settings; common practice)', (hoursLeft, state) => {
    expect(spoilageState(deadline, at(hoursLeft), settings)).toBe(state);
  });

  it('by default, moves fresh → watch → urgent → expired as the deadline nears, never back (common practice)', () => {
    const order = ['fresh', 'watch', 'urgent', 'expired'];
    let rank = 0;
    for (let h = 14 * 24; h >= -24; h -= 1) {
      const r = order.indexOf(spoilageState(deadline, at(h)));
      expect(r).toBeGreaterThanOrEqual(rank);
      rank = r;
    }
    expect(rank).toBe(3);
  });

  it('by default, a lot with a full week left is fresh, one with an hour left is urgent, and one past its deadline expired (Cornell 2025: boil within days; common practice)', () => {
    expect(spoilageState(deadline, at(7 * 24))).toBe('fresh');
    expect(spoilageState(deadline, at(1))).toBe('urgent');
    expect(spoilageState(deadline, at(-0.01))).toBe('expired');
  });
});
