import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { allocate, allocateRun, type Weight } from '@/lib/sugar';

const sum = (xs: readonly number[]) => xs.reduce((s, x) => s + x, 0);

const weightsArb = fc.uniqueArray(
  fc.record({
    key: fc.string({ minLength: 1, maxLength: 6 }),
    weight: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1e6, noNaN: true }), fc.integer({ min: 0, max: 50 })),
  }),
  { selector: (w) => w.key, minLength: 1, maxLength: 30 },
);
const totalArb = fc.integer({ min: 0, max: 1_000_000 });
const withSomeWeight = (ws: readonly Weight[]) => ws.some((w) => w.weight > 0);

// Hamilton's method spelled out on small integer weights, where Number arithmetic is exact.
function integerHamilton(ws: readonly Weight[], total: number): number[] {
  const s = sum(ws.map((w) => w.weight));
  const floors = ws.map((w) => Math.floor((total * w.weight) / s));
  const rems = ws.map((w) => (total * w.weight) % s);
  const order = ws
    .map((_, i) => i)
    .sort((a, b) => rems[b] - rems[a] || ws[b].weight - ws[a].weight || (ws[a].key < ws[b].key ? -1 : 1));
  let left = total - sum(floors);
  for (const i of order) if (left-- > 0) floors[i] += 1;
  return floors;
}

describe('allocate: largest remainder (Hamilton method)', () => {
  it('shares 10 units 5 : 3 : 2 exactly (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    expect(allocate([{ key: 'Okafor', weight: 5 }, { key: 'Lindqvist', weight: 3 }, { key: 'Szabo', weight: 2 }], 10)).toEqual([
      { key: 'Okafor', amount: 5 },
      { key: 'Lindqvist', amount: 3 },
      { key: 'Szabo', amount: 2 },
    ]);
  });

  it('gives the leftover units to the largest remainders (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    // quotas 100·(0.41, 0.335, 0.255) over 7 → 5.857, 4.786, 3.643 → floors 5, 4, 3, two left.
    const out = allocate([{ key: 'a', weight: 0.41 }, { key: 'b', weight: 0.335 }, { key: 'c', weight: 0.255 }], 14);
    expect(out.map((r) => r.amount)).toEqual([6, 5, 3]);
  });

  it('breaks a remainder tie by the larger weight (co-op rule; common practice)', () => {
    // 2 units over weights 1 and 3: quotas 0.5 and 1.5, equal remainders.
    expect(allocate([{ key: 'a', weight: 1 }, { key: 'b', weight: 3 }], 2).map((r) => r.amount)).toEqual([0, 2]);
  });

  it('breaks a full tie by key, whatever the input order (co-op rule; common practice)', () => {
    const a = allocate([{ key: 'Nakamura', weight: 1 }, { key: 'Brennan', weight: 1 }, { key: 'Ferreira', weight: 1 }], 2);
    expect(a).toEqual([
      { key: 'Nakamura', amount: 0 },
      { key: 'Brennan', amount: 1 },
      { key: 'Ferreira', amount: 1 },
    ]);
  });

  it('compares remainders exactly where floating point mis-orders them (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    // 900 units over 1.5 : 5.625 : 4.375 (= 12 : 45 : 35 of 92): quotas 117 + 36/92,
    // 440 + 20/92 and 342 + 36/92. The first and last remainders tie exactly, so the one
    // unit left goes to the larger weight. Computed as doubles, total·w/Σw makes the
    // first remainder look larger and would hand the unit to it instead.
    const out = allocate([{ key: 'Lindqvist', weight: 1.5 }, { key: 'Nakamura', weight: 5.625 }, { key: 'Brennan', weight: 4.375 }], 900);
    expect(out.map((r) => r.amount)).toEqual([117, 440, 343]);
    const q = (w: number) => (900 * w) / 11.5;
    expect(q(1.5) - Math.floor(q(1.5))).toBeGreaterThan(q(4.375) - Math.floor(q(4.375)));
  });

  it('zero total gives zeros, also with all-zero or no weights (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    expect(allocate([{ key: 'a', weight: 0 }, { key: 'b', weight: 0 }], 0)).toEqual([
      { key: 'a', amount: 0 },
      { key: 'b', amount: 0 },
    ]);
    expect(allocate([], 0)).toEqual([]);
  });

  test.prop([weightsArb, totalArb])('always sums to total (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', (ws, total) => {
    fc.pre(withSomeWeight(ws));
    expect(sum(allocate(ws, total).map((r) => r.amount))).toBe(total);
  });

  test.prop([weightsArb, totalArb])('gives 0 to weight 0 and whole, non-negative amounts to all (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', (ws, total) => {
    fc.pre(withSomeWeight(ws));
    allocate(ws, total).forEach((r, i) => {
      expect(Number.isSafeInteger(r.amount) && r.amount >= 0).toBe(true);
      if (ws[i].weight === 0) expect(r.amount).toBe(0);
    });
  });

  test.prop([weightsArb, totalArb])('never gives a larger weight less than a smaller one (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', (ws, total) => {
    fc.pre(withSomeWeight(ws));
    const out = allocate(ws, total);
    for (let i = 0; i < ws.length; i++) {
      for (let j = 0; j < ws.length; j++) {
        if (ws[i].weight > ws[j].weight) expect(out[i].amount).toBeGreaterThanOrEqual(out[j].amount);
      }
    }
  });

  test.prop([weightsArb, totalArb, fc.infiniteStream(fc.double({ min: 0, max: 1, noNaN: true }))])(
    'is independent of input order (co-op rule; common practice)',
    (ws, total, randoms) => {
      fc.pre(withSomeWeight(ws));
      const shuffled = ws
        .map((w) => ({ w, r: randoms.next().value as number }))
        .sort((x, y) => x.r - y.r)
        .map((x) => x.w);
      const byKey = (rows: { key: string; amount: number }[]) => Object.fromEntries(rows.map((r) => [r.key, r.amount]));
      expect(byKey(allocate(shuffled, total))).toEqual(byKey(allocate(ws, total)));
    },
  );

  test.prop([weightsArb, totalArb, fc.integer({ min: -30, max: 30 })])(
    'is unchanged when every weight is scaled by a power of two (exact arithmetic; Hamilton’s method is scale-free, Balinski & Young 1982)',
    (ws, total, k) => {
      fc.pre(withSomeWeight(ws));
      const scaled = ws.map((w) => ({ key: w.key, weight: w.weight * 2 ** k }));
      fc.pre(scaled.every((w, i) => w.weight / 2 ** k === ws[i].weight)); // no underflow to subnormals
      expect(allocate(scaled, total)).toEqual(allocate(ws, total));
    },
  );

  test.prop([
    fc.uniqueArray(fc.record({ key: fc.string({ minLength: 1, maxLength: 4 }), weight: fc.integer({ min: 0, max: 1000 }) }), {
      selector: (w) => w.key,
      minLength: 1,
      maxLength: 12,
    }),
    fc.integer({ min: 0, max: 100_000 }),
  ])('matches Hamilton\'s method spelled out on integer weights (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', (ws, total) => {
    fc.pre(withSomeWeight(ws));
    expect(allocate(ws, total).map((r) => r.amount)).toEqual(integerHamilton(ws, total));
  });
});

describe('allocateRun: a run\'s syrup (mL) and fuel (cents) by sugar delivered', () => {
  it('splits exactly and merges a household\'s several inputs (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    const rows = allocateRun(
      [
        { household: 'Okafor', sugarKg: 2.5 },
        { household: 'Tremblay-Haddad', sugarKg: 1.25 },
        { household: 'Okafor', sugarKg: 1.25 },
      ],
      { syrupMl: 7001, fuelCents: 2600 },
    );
    expect(rows).toEqual([
      { household: 'Okafor', sugarKg: 3.75, share: 0.75, syrupMl: 5251, fuelCents: 1950 },
      { household: 'Tremblay-Haddad', sugarKg: 1.25, share: 0.25, syrupMl: 1750, fuelCents: 650 },
    ]);
  });

  test.prop([
    fc.array(
      fc.record({
        household: fc.constantFrom('Okafor', 'Lindqvist', 'Tremblay-Haddad', 'Nakamura', 'Brennan', 'Szabo', 'Ferreira'),
        sugarKg: fc.double({ min: 0.001, max: 80, noNaN: true }),
      }),
      { minLength: 1, maxLength: 40 },
    ),
    fc.integer({ min: 0, max: 500_000 }),
    fc.integer({ min: 0, max: 10_000_000 }),
  ])('conserves both totals and the sugar, with shares summing to 1 (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', (inputs, syrupMl, fuelCents) => {
    const rows = allocateRun(inputs, { syrupMl, fuelCents });
    expect(new Set(rows.map((r) => r.household)).size).toBe(rows.length);
    expect(sum(rows.map((r) => r.syrupMl))).toBe(syrupMl);
    expect(sum(rows.map((r) => r.fuelCents))).toBe(fuelCents);
    expect(sum(rows.map((r) => r.share))).toBeCloseTo(1, 9);
    expect(sum(rows.map((r) => r.sugarKg))).toBeCloseTo(sum(inputs.map((i) => i.sugarKg)), 9);
  });

  it('merging is exact: split inputs allocate as their sum (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    const split = allocateRun(
      [
        { household: 'Szabo', sugarKg: 0.5 },
        { household: 'Ferreira', sugarKg: 1 },
        { household: 'Szabo', sugarKg: 0.5 },
      ],
      { syrupMl: 3, fuelCents: 1 },
    );
    const whole = allocateRun(
      [
        { household: 'Szabo', sugarKg: 1 },
        { household: 'Ferreira', sugarKg: 1 },
      ],
      { syrupMl: 3, fuelCents: 1 },
    );
    expect(split).toEqual(whole);
    // Equal sugar: the odd unit goes by household name, Ferreira before Szabo.
    expect(whole.map((r) => [r.household, r.syrupMl, r.fuelCents])).toEqual([
      ['Szabo', 1, 0],
      ['Ferreira', 2, 1],
    ]);
  });

  it('a run with no syrup and no fuel yet gives zeros and zero shares (Hamilton’s method, Balinski & Young, Fair Representation, Yale University Press, 1982)', () => {
    expect(allocateRun([{ household: 'Brennan', sugarKg: 0 }], { syrupMl: 0, fuelCents: 0 })).toEqual([
      { household: 'Brennan', sugarKg: 0, share: 0, syrupMl: 0, fuelCents: 0 },
    ]);
  });
});
