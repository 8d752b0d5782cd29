import { describe, expect, it } from 'vitest';
import { SPOILAGE_DEFAULTS, SPOILAGE_STATE_DEFAULTS, spoilageDeadline, spoilageState } from '@/lib/sugar';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

// Shelf lives are trade practice and cooperative settings; Cornell, "Reducing Maple Sap
// Spoilage" (2025) for how perishable raw sap is (unfrozen sap keeps about a week at most).
describe('spoilageDeadline (trade practice; Cornell, "Reducing Maple Sap Spoilage", 2025)', () => {
  const collectedAt = new Date('2025-03-10T07:30:00-04:00');

  it('cold sap keeps 7 days by default', () => {
    expect(SPOILAGE_DEFAULTS).toEqual({ shelfDays: 7, warmAboveC: 7, warmShelfDays: 3 });
    expect(spoilageDeadline(collectedAt, { sapTempC: 3 }).toISOString()).toBe('2025-03-17T11:30:00.000Z');
  });

  it('sap warmer than 7 °C keeps 3 days', () => {
    expect(spoilageDeadline(collectedAt, { sapTempC: 8 }).getTime()).toBe(collectedAt.getTime() + 3 * DAY);
  });

  it('sap at exactly 7 °C still counts as cold', () => {
    expect(spoilageDeadline(collectedAt, { sapTempC: 7 }).getTime()).toBe(collectedAt.getTime() + 7 * DAY);
  });

  it('uses the cooperative settings when given', () => {
    const options = { sapTempC: 5, shelfDays: 5, warmAboveC: 4, warmShelfDays: 1.5 };
    expect(spoilageDeadline(collectedAt, options).getTime()).toBe(collectedAt.getTime() + 1.5 * DAY);
    expect(spoilageDeadline(collectedAt, { ...options, sapTempC: 2 }).getTime()).toBe(collectedAt.getTime() + 5 * DAY);
  });

  it('counts elapsed hours across a daylight-saving change (7 × 24 h)', () => {
    const beforeDst = new Date('2025-03-05T18:00:00-05:00');
    expect(spoilageDeadline(beforeDst, { sapTempC: 2 }).toISOString()).toBe('2025-03-12T23:00:00.000Z');
  });
});

describe('spoilageState (thresholds: trade practice, cooperative settings)', () => {
  const deadline = new Date('2025-03-17T12:00:00Z');
  const at = (hoursLeft: number) => new Date(deadline.getTime() - hoursLeft * HOUR);

  it('defaults: urgent under 24 h, watch under 72 h', () => {
    expect(SPOILAGE_STATE_DEFAULTS).toEqual({ urgentHours: 24, watchHours: 72 });
  });

  it.each([
    [200, 'fresh'],
    [72, 'fresh'],
    [71.99, 'watch'],
    [24, 'watch'],
    [23.99, 'urgent'],
    [0.01, 'urgent'],
    [0, 'expired'],
    [-5, 'expired'],
  ] as const)('%f h left → %s', (hoursLeft, state) => {
    expect(spoilageState(deadline, at(hoursLeft))).toBe(state);
  });

  it('takes custom thresholds', () => {
    expect(spoilageState(deadline, at(30), { urgentHours: 36, watchHours: 96 })).toBe('urgent');
    expect(spoilageState(deadline, at(90), { urgentHours: 36, watchHours: 96 })).toBe('watch');
  });
});
