import { nonNegative, nonNegativeInteger } from './guards';

export interface Weight {
  key: string;
  weight: number;
}

export interface Allotment {
  key: string;
  amount: number;
}

// Every finite double is m·2^e with integer m; scaling all weights to the smallest e
// turns them into exact integers, so quotas and remainders compare without rounding.
const scratch = new DataView(new ArrayBuffer(8));

function decompose(x: number): { mantissa: bigint; exponent: number } {
  if (x === 0) return { mantissa: 0n, exponent: 0 };
  scratch.setFloat64(0, x);
  const hi = scratch.getUint32(0);
  const lo = scratch.getUint32(4);
  const biased = (hi >>> 20) & 0x7ff;
  const fraction = (BigInt(hi & 0xfffff) << 32n) | BigInt(lo);
  return biased === 0
    ? { mantissa: fraction, exponent: -1074 }
    : { mantissa: fraction | (1n << 52n), exponent: biased - 1075 };
}

function toExactIntegers(values: readonly number[]): bigint[] {
  const parts = values.map(decompose);
  let minExponent = Infinity;
  for (const p of parts) if (p.mantissa !== 0n && p.exponent < minExponent) minExponent = p.exponent;
  return parts.map((p) => (p.mantissa === 0n ? 0n : p.mantissa << BigInt(p.exponent - minExponent)));
}

/** Largest-remainder apportionment of `total` over exact integer weights. */
function apportion(
  keys: readonly string[],
  weights: readonly bigint[],
  total: number,
  names: { weights: string; total: string },
): number[] {
  let sum = 0n;
  for (const w of weights) sum += w;
  const amounts = new Array<number>(keys.length).fill(0);
  if (total === 0) return amounts;
  if (sum === 0n) {
    throw new RangeError(
      `${names.weights} must include a positive weight when ${names.total} is more than 0 (got ${total} to share over zero weight)`,
    );
  }
  const t = BigInt(total);
  const remainders: bigint[] = [];
  let given = 0;
  for (let i = 0; i < keys.length; i++) {
    const share = t * weights[i];
    const whole = Number(share / sum);
    amounts[i] = whole;
    given += whole;
    remainders.push(share % sum);
  }
  let left = total - given;
  if (left === 0) return amounts;
  const order = keys.map((_, i) => i).filter((i) => remainders[i] > 0n);
  order.sort((a, b) => {
    if (remainders[a] !== remainders[b]) return remainders[a] > remainders[b] ? -1 : 1;
    if (weights[a] !== weights[b]) return weights[a] > weights[b] ? -1 : 1;
    return keys[a] < keys[b] ? -1 : keys[a] > keys[b] ? 1 : 0;
  });
  // The remainders sum to exactly `left` whole units, so more than `left` entries have one.
  for (const i of order) {
    if (left === 0) break;
    amounts[i] += 1;
    left -= 1;
  }
  return amounts;
}

/**
 * Shares a whole number of units (`total`, e.g. millilitres or cents) among keys in
 * proportion to their weights, by largest remainder (Hamilton's method): each key gets
 * the whole part of its quota total·weight/Σweight, and the units left go one each to
 * the largest fractional parts. Remainders are compared exactly; ties go to the larger
 * weight, then to the key that sorts first (plain code-unit order), so the result does
 * not depend on the order of `weights`.
 *
 * Returns one row per input, in input order; the amounts always sum to `total`. A
 * weight of 0 gets 0. With no positive weight, a total of 0 gives every key 0 and any
 * other total throws a RangeError. Keys must be unique.
 */
export function allocate(weights: readonly Weight[], total: number): Allotment[] {
  if (!Array.isArray(weights)) throw new RangeError('weights must be an array of { key, weight }');
  nonNegativeInteger('total', total);
  const keys: string[] = [];
  const seen = new Set<string>();
  const values: number[] = [];
  weights.forEach((entry, i) => {
    if (entry === null || typeof entry !== 'object' || typeof entry.key !== 'string') {
      throw new RangeError(`weights[${i}].key must be a string (got ${entry === null || typeof entry !== 'object' ? String(entry) : String(entry.key)})`);
    }
    if (seen.has(entry.key)) {
      throw new RangeError(`weights must have unique keys (got ${JSON.stringify(entry.key)} twice)`);
    }
    seen.add(entry.key);
    keys.push(entry.key);
    values.push(nonNegative(`weights[${i}].weight`, entry.weight));
  });
  const amounts = apportion(keys, toExactIntegers(values), total, { weights: 'weights', total: 'total' });
  return keys.map((key, i) => ({ key, amount: amounts[i] }));
}

export interface RunInputSugar {
  household: string;
  sugarKg: number;
}

export interface RunTotals {
  /** Syrup drawn off in the run, whole millilitres. */
  syrupMl: number;
  /** Fuel cost of the run, whole cents (minor units). */
  fuelCents: number;
}

export interface RunShare {
  household: string;
  /** Sugar the household put into the run (kg). */
  sugarKg: number;
  /** Fraction of the run's sugar, 0–1 (0 for everyone when the run had no sugar). */
  share: number;
  syrupMl: number;
  fuelCents: number;
}

function sumAscending(values: number[]): number {
  // A fixed summation order makes the float total independent of input order.
  return [...values].sort((a, b) => a - b).reduce((s, v) => s + v, 0);
}

/**
 * Splits a boil run's syrup (whole mL) and fuel cost (whole cents) among the households
 * whose sap went in, by sugar mass, with {@link allocate}'s exact largest-remainder
 * rule: each total is conserved exactly. Several inputs from one household are merged
 * (exactly, before apportioning). Rows come in order of each household's first input.
 */
export function allocateRun(inputs: readonly RunInputSugar[], totals: RunTotals): RunShare[] {
  if (!Array.isArray(inputs)) throw new RangeError('inputs must be an array of { household, sugarKg }');
  if (totals === null || typeof totals !== 'object') {
    throw new RangeError('totals must be an object with syrupMl and fuelCents');
  }
  const syrupMl = nonNegativeInteger('syrupMl', totals.syrupMl);
  const fuelCents = nonNegativeInteger('fuelCents', totals.fuelCents);

  const sugar: number[] = [];
  inputs.forEach((input, i) => {
    if (input === null || typeof input !== 'object' || typeof input.household !== 'string' || input.household === '') {
      throw new RangeError(`inputs[${i}].household must be a non-empty string`);
    }
    sugar.push(nonNegative(`inputs[${i}].sugarKg`, input.sugarKg));
  });
  const exact = toExactIntegers(sugar);

  const index = new Map<string, number>();
  const households: string[] = [];
  const weights: bigint[] = [];
  const parts: number[][] = [];
  inputs.forEach((input, i) => {
    let h = index.get(input.household);
    if (h === undefined) {
      h = households.length;
      index.set(input.household, h);
      households.push(input.household);
      weights.push(0n);
      parts.push([]);
    }
    weights[h] += exact[i];
    parts[h].push(sugar[i]);
  });

  const syrup = apportion(households, weights, syrupMl, { weights: 'inputs', total: 'syrupMl' });
  const fuel = apportion(households, weights, fuelCents, { weights: 'inputs', total: 'fuelCents' });
  const totalSugar = sumAscending(sugar);
  return households.map((household, h) => {
    const kg = sumAscending(parts[h]);
    return {
      household,
      sugarKg: kg,
      share: totalSugar > 0 ? kg / totalSugar : 0,
      syrupMl: syrup[h],
      fuelCents: fuel[h],
    };
  });
}
