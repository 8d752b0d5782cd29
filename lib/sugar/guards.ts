/**
 * Argument guards shared by the sugar computations. Each throws a RangeError whose
 * message names the argument, the allowed range and the value received, so a
 * caller (or an API error body) can show it as is.
 */

function show(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? 'Invalid Date' : value.toISOString();
  if (typeof value === 'string') return JSON.stringify(value);
  return String(value);
}

function fail(name: string, requirement: string, value: unknown): never {
  throw new RangeError(`${name} must be ${requirement} (got ${show(value)})`);
}

function isFiniteNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** Requires a finite number; returns it. */
export function finiteNumber(name: string, value: unknown): number {
  if (!isFiniteNumber(value)) fail(name, 'a finite number', value);
  return value;
}

/** Requires a finite number in the closed range [min, max]; returns it. */
export function numberInRange(name: string, value: unknown, min: number, max: number): number {
  if (!isFiniteNumber(value) || value < min || value > max) {
    fail(name, `a number from ${min} to ${max}`, value);
  }
  return value;
}

/** Requires a finite number in the open range (min, max); returns it. */
export function numberBetween(name: string, value: unknown, min: number, max: number): number {
  if (!isFiniteNumber(value) || value <= min || value >= max) {
    fail(name, `a number greater than ${min} and less than ${max}`, value);
  }
  return value;
}

/** Requires a finite number in the half-open range (min, max]; returns it. */
export function numberAboveUpTo(name: string, value: unknown, min: number, max: number): number {
  if (!isFiniteNumber(value) || value <= min || value > max) {
    fail(name, `a number greater than ${min} and at most ${max}`, value);
  }
  return value;
}

/** Requires a finite number ≥ 0; returns it. */
export function nonNegative(name: string, value: unknown): number {
  if (!isFiniteNumber(value) || value < 0) fail(name, 'a non-negative number', value);
  return value;
}

/** Requires a finite number > 0; returns it. */
export function positive(name: string, value: unknown): number {
  if (!isFiniteNumber(value) || value <= 0) fail(name, 'a positive number', value);
  return value;
}

/** Requires a whole number from 0 to Number.MAX_SAFE_INTEGER; returns it. */
export function nonNegativeInteger(name: string, value: unknown): number {
  if (!Number.isSafeInteger(value) || (value as number) < 0) {
    fail(name, `a whole number from 0 to ${Number.MAX_SAFE_INTEGER}`, value);
  }
  return value as number;
}

/** Requires a whole number in the closed range [min, max]; returns it. */
export function integerInRange(name: string, value: unknown, min: number, max: number): number {
  if (!Number.isInteger(value) || (value as number) < min || (value as number) > max) {
    fail(name, `a whole number from ${min} to ${max}`, value);
  }
  return value as number;
}

/** Requires a safe integer (negative allowed, e.g. a refund in cents); returns it. */
export function safeInteger(name: string, value: unknown): number {
  if (!Number.isSafeInteger(value)) fail(name, 'a whole number', value);
  return value as number;
}

/** Requires a Date holding a real instant; returns it. */
export function validDate(name: string, value: unknown): Date {
  if (!(value instanceof Date) || Number.isNaN(value.getTime())) fail(name, 'a valid Date', value);
  return value;
}

/** Requires one of the listed strings; returns it. */
export function oneOf<T extends string>(name: string, value: unknown, allowed: readonly T[]): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    fail(name, `one of ${allowed.map((a) => `'${a}'`).join(', ')}`, value);
  }
  return value as T;
}
