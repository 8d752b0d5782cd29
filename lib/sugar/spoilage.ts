import { numberInRange, positive, validDate } from './guards';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/**
 * Default shelf life of raw sap. These are common trade practice and meant to be
 * cooperative settings: unfrozen sap keeps about a week at most when held cold (about
 * 3–4 °C), and much less when it arrives warm (Cornell, "Reducing Maple Sap Spoilage",
 * 2025, on how perishable sap is).
 */
export const SPOILAGE_DEFAULTS = Object.freeze({
  shelfDays: 7,
  warmAboveC: 7,
  warmShelfDays: 3,
});

/** Default warning thresholds for {@link spoilageState} (trade practice; cooperative settings). */
export const SPOILAGE_STATE_DEFAULTS = Object.freeze({
  urgentHours: 24,
  watchHours: 72,
});

export type SpoilageState = 'fresh' | 'watch' | 'urgent' | 'expired';

export interface SpoilageOptions {
  /** Sap temperature at drop-off (°C). */
  sapTempC: number;
  /** Days cold sap keeps (default 7). */
  shelfDays?: number;
  /** Sap warmer than this (°C) counts as warm (default 7). */
  warmAboveC?: number;
  /** Days warm sap keeps (default 3); not more than `shelfDays`. */
  warmShelfDays?: number;
}

/**
 * The instant by which a lot should be boiled: `collectedAt` plus `shelfDays`, or plus
 * `warmShelfDays` when `sapTempC` > `warmAboveC`. Days are elapsed 24-hour periods, not
 * calendar days, so a daylight-saving change neither shortens nor lengthens the life.
 */
export function spoilageDeadline(collectedAt: Date, options: SpoilageOptions): Date {
  validDate('collectedAt', collectedAt);
  if (options === null || typeof options !== 'object') {
    throw new RangeError('options must be an object with sapTempC');
  }
  const sapTempC = numberInRange('sapTempC', options.sapTempC, -10, 40);
  const shelfDays = numberInRange('shelfDays', options.shelfDays ?? SPOILAGE_DEFAULTS.shelfDays, 0, 60);
  const warmAboveC = numberInRange('warmAboveC', options.warmAboveC ?? SPOILAGE_DEFAULTS.warmAboveC, -10, 40);
  const warmShelfDays = numberInRange(
    'warmShelfDays',
    options.warmShelfDays ?? SPOILAGE_DEFAULTS.warmShelfDays,
    0,
    shelfDays,
  );
  const days = sapTempC > warmAboveC ? warmShelfDays : shelfDays;
  return new Date(collectedAt.getTime() + days * DAY_MS);
}

export interface SpoilageStateOptions {
  /** Less than this many hours left is 'urgent' (default 24). */
  urgentHours?: number;
  /** Less than this many hours left is 'watch' (default 72). */
  watchHours?: number;
}

/**
 * How close a lot is to its deadline at `now`: 'expired' once now ≥ deadline,
 * 'urgent' with less than `urgentHours` left, 'watch' with less than `watchHours`
 * left, otherwise 'fresh'.
 */
export function spoilageState(deadline: Date, now: Date, options: SpoilageStateOptions = {}): SpoilageState {
  validDate('deadline', deadline);
  validDate('now', now);
  const urgentHours = positive('urgentHours', options.urgentHours ?? SPOILAGE_STATE_DEFAULTS.urgentHours);
  const watchHours = positive('watchHours', options.watchHours ?? SPOILAGE_STATE_DEFAULTS.watchHours);
  if (watchHours < urgentHours) {
    throw new RangeError(`watchHours must be a number not less than urgentHours, ${urgentHours} (got ${watchHours})`);
  }
  const leftMs = deadline.getTime() - now.getTime();
  if (leftMs <= 0) return 'expired';
  if (leftMs < urgentHours * HOUR_MS) return 'urgent';
  if (leftMs < watchHours * HOUR_MS) return 'watch';
  return 'fresh';
}
