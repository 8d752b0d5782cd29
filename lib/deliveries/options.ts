/**
 * Client-safe, and free of zod: the choices and bounds of a drop-off, for screens that need them
 * before the validation schema (lib/deliveries/schema.ts) is loaded.
 */

export const CLARITIES = ['clear', 'cloudy'] as const;
export const CONTAMINATIONS = ['none', 'insects', 'debris', 'off-odour', 'other'] as const;
export const DECISIONS = ['accept', 'reject'] as const;
export const STATUSES = ['accepted', 'rejected'] as const;

export type Clarity = (typeof CLARITIES)[number];
export type Contamination = (typeof CONTAMINATIONS)[number];
export type Decision = (typeof DECISIONS)[number];
export type DeliveryStatus = (typeof STATUSES)[number];

/** Bounds shared by the form, the handler and the database's check constraints. */
export const LIMITS = Object.freeze({
  maxVolumeL: 100_000,
  maxBrix: 85,
  minSapTempC: -10,
  maxSapTempC: 40,
  /** A lot collected longer ago than this is a typing mistake, not old sap. */
  maxCollectedDaysAgo: 60,
  reason: 500,
  note: 1000,
});
