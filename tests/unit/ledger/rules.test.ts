import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { allocateRunRows, coopMeanBrix, settle, settlementRow, splitByVolume, sugarByWeek, type AllocationRow } from '@/lib/ledger/rules';
import { GRADE_CLASSES } from '@/lib/sugar';

/*
 * A worked example of three households, by hand.
 * Sugar in a lot = litres × density(°Brix) × °Brix / 100, density of sucrose solutions at 20 °C
 * from the CRC Handbook of Chemistry and Physics, "Concentrative properties of aqueous
 * solutions" (after NBS Circular C440, 1942): 1 °Bx 1.0021, 2 °Bx 1.0060, 3 °Bx 1.0099 g/cm³;
 * 1.5 °Bx interpolated: 1.00405.
 *   Ash (sugar maples)   400 L at 3.0 °Bx → 400 × 1.0099 × 0.030 = 12.1188 kg
 *   Birch (red maples)   400 L at 1.5 °Bx → 400 × 1.00405 × 0.015 = 6.0243 kg (200 L into each run)
 *   Cedar (mixed)        200 L at 2.0 °Bx → 200 × 1.0060 × 0.020 = 4.024 kg
 * Run 1: Ash 400 L (12.1188 kg) + Birch 200 L (3.01215 kg) = 15.13095 kg;
 *   syrup 6.000 L Golden + 9.900 L Amber, fuel ½ cord at $260 = 13,000 ¢.
 *   Ash's share 12.1188 / 15.13095 = 0.800928.
 *   Golden 6000 mL: quotas 4805.57 / 1194.43 → 4805 + 1194, the one left to Ash (.57) → 4806 / 1194.
 *   Amber 9900 mL: 7929.19 / 1970.81 → 7929 + 1970, one left to Birch (.81) → 7929 / 1971.
 *   Fuel 13000 ¢: 10412.06 / 2587.94 → 10412 + 2587, one left to Birch → 10412 / 2588.
 * Run 2: Birch 200 L (3.01215 kg) + Cedar 200 L (4.024 kg) = 7.03615 kg;
 *   syrup 7.500 L Dark, fuel ¼ cord = 6,500 ¢. Birch's share 3.01215 / 7.03615 = 0.428096.
 *   Dark 7500 mL: 3210.72 / 4289.28 → 3210 + 4289, one left to Birch → 3211 / 4289.
 *   Fuel 6500 ¢: 2782.63 / 3717.37 → 2782 + 3717, one left to Birch → 2783 / 3717.
 * Season: sugar 22.1671 kg; Ash 12735 mL, 10412 ¢; Birch 6376 mL, 5371 ¢; Cedar 4289 mL, 3717 ¢.
 *   Shares 12.1188 / 22.1671 = 0.546702, 6.0243 / 22.1671 = 0.271768, 4.024 / 22.1671 = 0.181530.
 *   Fees Ash 2500 ¢, Cedar 2500 ¢ → due 12912 ¢, 5371 ¢, 6217 ¢.
 * By volume instead (run 1 split 400 : 200, run 2 200 : 200):
 *   Run 1 15900 mL → 10600 / 5300, 13000 ¢ → 8667 / 4333; run 2 7500 mL → 3750 / 3750, 6500 ¢ → 3250 / 3250.
 *   Birch would get 9050 mL (22.6 mL per litre) instead of 6376 mL (15.9 mL per litre).
 */
const run1 = allocateRunRows(
  [
    { householdId: 'ash', litres: 400, brix: 3 },
    { householdId: 'birch', litres: 200, brix: 1.5 },
  ],
  [
    { litres: 6, gradeClass: 'golden' },
    { litres: 9.9, gradeClass: 'amber' },
  ],
  13000,
);
const run2 = allocateRunRows(
  [
    { householdId: 'birch', litres: 200, brix: 1.5 },
    { householdId: 'cedar', litres: 200, brix: 2 },
  ],
  [{ litres: 7.5, gradeClass: 'dark' }],
  6500,
);
const allocations: AllocationRow[] = [...run1.map((r) => ({ ...r, runId: 'r1' })), ...run2.map((r) => ({ ...r, runId: 'r2' }))];
const households = [
  { householdId: 'ash', name: 'Ash' },
  { householdId: 'birch', name: 'Birch' },
  { householdId: 'cedar', name: 'Cedar' },
];

describe('allocation of one run by sugar', () => {
  it('matches the hand-worked shares of run 1 to the millilitre and the cent', () => {
    expect(run1.map((r) => [r.householdId, r.syrupByClassMl.golden, r.syrupByClassMl.amber, r.fuelCents])).toEqual([
      ['ash', 4806, 7929, 10412],
      ['birch', 1194, 1971, 2588],
    ]);
    expect(run1[0].sugarKg).toBeCloseTo(12.1188, 10);
    expect(run1[1].sugarKg).toBeCloseTo(3.01215, 10);
    expect(run1[0].share).toBeCloseTo(0.800928, 6);
  });

  it('matches run 2', () => {
    expect(run2.map((r) => [r.householdId, r.syrupMl, r.fuelCents])).toEqual([
      ['birch', 3211, 2783],
      ['cedar', 4289, 3717],
    ]);
  });

  it('refuses syrup with no sugar to share it over', () => {
    expect(() => allocateRunRows([], [{ litres: 1, gradeClass: 'amber' }], 0)).toThrow(/no sap/);
  });

  test.prop([
    fc.array(fc.record({ householdId: fc.constantFrom('a', 'b', 'c', 'd'), litres: fc.double({ min: 0.5, max: 2000, noNaN: true }), brix: fc.double({ min: 0.5, max: 4, noNaN: true }) }), { minLength: 1, maxLength: 8 }),
    fc.array(fc.record({ litres: fc.double({ min: 0.001, max: 80, noNaN: true }), gradeClass: fc.constantFrom(...GRADE_CLASSES) }), { maxLength: 6 }),
    fc.integer({ min: 0, max: 1_000_000 }),
  ], { seed: 12 })('conserves every colour class and the fuel exactly', (inputs, draws, fuel) => {
    const rows = allocateRunRows(inputs, draws, fuel);
    for (const c of GRADE_CLASSES) {
      expect(rows.reduce((s, r) => s + r.syrupByClassMl[c], 0)).toBe(draws.filter((d) => d.gradeClass === c).reduce((s, d) => s + Math.round(d.litres * 1000), 0));
    }
    expect(rows.reduce((s, r) => s + r.fuelCents, 0)).toBe(fuel);
  });
});

describe('settlement of the season', () => {
  const rejectedLot = { householdId: 'cedar', volumeL: 100, brix: 2.5, status: 'rejected' as const, receivedAt: '2027-03-10T10:00:00-04:00' };
  const deliveries = [
    { householdId: 'ash', volumeL: 400, brix: 3, status: 'accepted' as const, receivedAt: '2027-03-08T10:00:00-05:00' },
    { householdId: 'birch', volumeL: 400, brix: 1.5, status: 'accepted' as const, receivedAt: '2027-03-09T10:00:00-05:00' },
    { householdId: 'cedar', volumeL: 200, brix: 2, status: 'accepted' as const, receivedAt: '2027-03-16T10:00:00-04:00' },
    rejectedLot,
  ];
  const result = settle({ households, deliveries, allocations, fees: { ash: 2500, cedar: 2500 }, paid: { cedar: 6217 } });

  it('gives the hand-worked settlement', () => {
    expect(result.households.map(settlementRow)).toEqual([
      { householdId: 'ash', name: 'Ash', sapL: 400, sugarKg: 12.1188, share: 0.546702, syrupMl: 12735, fuelCents: 10412, feeCents: 2500, dueCents: 12912 },
      { householdId: 'birch', name: 'Birch', sapL: 400, sugarKg: 6.0243, share: 0.271768, syrupMl: 6376, fuelCents: 5371, feeCents: 0, dueCents: 5371 },
      { householdId: 'cedar', name: 'Cedar', sapL: 200, sugarKg: 4.024, share: 0.18153, syrupMl: 4289, fuelCents: 3717, feeCents: 2500, dueCents: 6217 },
    ]);
    expect(result.totals.syrupMl).toBe(6000 + 9900 + 7500);
    expect(result.totals.fuelCents).toBe(13000 + 6500);
    expect(result.totals.sugarKg).toBeCloseTo(22.1671, 10);
  });

  it('keeps the rejected lot out of sap, mean °Brix and sugar, but reports it', () => {
    const cedar = result.households[2];
    expect(cedar.rejectedL).toBe(100);
    expect(cedar.sapL).toBe(200);
    expect(cedar.meanBrix).toBe(2);
    expect(cedar.sugarDeliveredKg).toBeCloseTo(4.024, 10);
  });

  it('gives the co-op a mean °Brix weighted by accepted litres, the rejected lot left out', () => {
    // (400 × 3.0 + 400 × 1.5 + 200 × 2.0) / 1,000 L; Cedar's rejected 100 L at 2.5 °Bx counts nowhere.
    expect(coopMeanBrix(result.households)).toBeCloseTo(2.2, 12);
    // A household without accepted sap weighs nothing; a co-op without any has no mean.
    expect(coopMeanBrix([{ sapL: 0, meanBrix: null }, { sapL: 50, meanBrix: 2.4 }])).toBeCloseTo(2.4, 12);
    expect(coopMeanBrix([{ sapL: 0, meanBrix: null }])).toBeNull();
  });

  it('shows paid and balance', () => {
    expect(result.households[2].balanceCents).toBe(0);
    expect(result.households[0].balanceCents).toBe(12912);
  });

  it('splits by volume beside it: the low-sugar household gets less syrup per litre by sugar', () => {
    const v = splitByVolume(allocations);
    expect(v.get('ash')).toEqual({ share: 0.4, syrupMl: 10600, fuelCents: 8667 });
    expect(v.get('birch')).toEqual({ share: 0.4, syrupMl: 9050, fuelCents: 7583 });
    expect(v.get('cedar')).toEqual({ share: 0.2, syrupMl: 3750, fuelCents: 3250 });
    const birch = result.households[1];
    expect(birch.syrupMl / birch.boiledL).toBeLessThan(birch.byVolume.syrupMl / birch.boiledL);
  });

  it('sums sugar by week in the co-op’s time zone, Monday first, accepted lots only', () => {
    const weeks = sugarByWeek(deliveries, 'America/New_York');
    expect(weeks.map((w) => w.week)).toEqual(['2027-03-08', '2027-03-15']);
    expect(weeks[0].sugarKg.ash).toBeCloseTo(12.1188, 10);
    expect(weeks[0].sugarKg.cedar).toBeUndefined();
    expect(weeks[1].sugarKg.cedar).toBeCloseTo(4.024, 10);
  });
});
