import { describe, expect, it } from 'vitest';
import { planBoiling } from '@/lib/planning/rules';
import { boilHours } from '@/lib/sugar';

const now = new Date('2027-03-01T12:00:00Z');
const h = (hours: number) => new Date(now.getTime() + hours * 3_600_000);

describe('planBoiling', () => {
  it('shows nothing waiting and every booked hour ahead when no sap waits', () => {
    const plan = planBoiling({ lots: [], slots: [{ startsAt: h(2), endsAt: h(6) }, { startsAt: h(-3), endsAt: h(1) }], evaporationLph: 150, syrupBrix: 66.9, now });
    expect(plan).toMatchObject({ waitingL: 0, hoursNeeded: 0, oldestDeadline: null, shortfallHours: 0, short: false });
    // The slot already under way counts only from now: 1 h of it plus the 4 h one.
    expect(plan.hoursBookedBeforeDeadline).toBeCloseTo(5, 9);
  });

  it('warns when the hours booked before the oldest deadline fall short of the boiling needed', () => {
    const lots = [
      { litres: 1200, brix: 2.0, deadline: h(30) },
      { litres: 800, brix: 1.5, deadline: h(60) },
    ];
    const need = boilHours(1200, 2.0, 150, 66.9) + boilHours(800, 1.5, 150, 66.9);
    const plan = planBoiling({ lots, slots: [{ startsAt: h(4), endsAt: h(9) }, { startsAt: h(40), endsAt: h(50) }], evaporationLph: 150, syrupBrix: 66.9, now });
    expect(plan.waitingL).toBe(2000);
    expect(plan.hoursNeeded).toBeCloseTo(need, 9);
    expect(plan.oldestDeadline).toBe(h(30).toISOString());
    // Only the slot before the 30 h deadline counts.
    expect(plan.hoursBookedBeforeDeadline).toBeCloseTo(5, 9);
    expect(plan.short).toBe(true);
    expect(plan.shortfallHours).toBeCloseTo(need - 5, 9);
  });

  it('is not short when the booking covers the need, and clips a slot at the deadline', () => {
    const lots = [{ litres: 300, brix: 2.5, deadline: h(10) }];
    const plan = planBoiling({ lots, slots: [{ startsAt: h(1), endsAt: h(12) }], evaporationLph: 150, syrupBrix: 66.9, now });
    expect(plan.hoursBookedBeforeDeadline).toBeCloseTo(9, 9);
    expect(plan.short).toBe(false);
    expect(plan.shortfallHours).toBe(0);
  });
});
