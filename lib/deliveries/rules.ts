import { DateTime } from 'luxon';
import { spoilageDeadline } from '@/lib/sugar';
import type { Clarity, Contamination, Decision } from './schema';

/** The co-op's shelf-life settings (cooperatives.shelf_days, warm_above_c, warm_shelf_days). */
export interface ShelfSettings {
  shelfDays: number;
  warmAboveC: number;
  warmShelfDays: number;
}

export interface LotCheck {
  clarity: Clarity;
  contamination: Contamination;
  sapTempC: number;
  /** Start of the collection day in the co-op's zone: the oldest sap is counted from then. */
  collectedAt: Date;
  receivedAt: Date;
}

export type RejectCause = 'cloudy' | 'contaminated' | 'off-odour' | 'past-shelf-life';

export interface Recommendation {
  decision: Decision;
  causes: RejectCause[];
  /** One sentence a sugarmaker can keep as the reason, or '' when the lot looks good. */
  text: string;
  /** When the lot must be boiled by. */
  deadline: Date;
}

const CONTAMINANT_WORDS: Record<Exclude<Contamination, 'none' | 'off-odour'>, string> = {
  insects: 'insects in the sap',
  debris: 'debris in the sap',
  other: 'something in the sap',
};

/**
 * What the acceptance rules recommend for a lot: reject sap that is cloudy, contaminated,
 * off-odour, or past the co-op's shelf life when it arrives (cloudy or sour sap has spoiled;
 * common practice). The sugarmaker decides; going against this needs a reason.
 */
export function recommend(lot: LotCheck, shelf: ShelfSettings): Recommendation {
  const deadline = spoilageDeadline(lot.collectedAt, {
    sapTempC: lot.sapTempC,
    shelfDays: shelf.shelfDays,
    warmAboveC: shelf.warmAboveC,
    warmShelfDays: Math.min(shelf.warmShelfDays, shelf.shelfDays),
  });
  const causes: RejectCause[] = [];
  const words: string[] = [];
  if (lot.clarity === 'cloudy') {
    causes.push('cloudy');
    words.push('cloudy sap');
  }
  if (lot.contamination === 'off-odour') {
    causes.push('off-odour');
    words.push('an off odour');
  } else if (lot.contamination !== 'none') {
    causes.push('contaminated');
    words.push(CONTAMINANT_WORDS[lot.contamination]);
  }
  if (lot.receivedAt.getTime() >= deadline.getTime()) {
    causes.push('past-shelf-life');
    words.push(lot.sapTempC > shelf.warmAboveC ? `warm sap older than ${shelf.warmShelfDays} days` : `sap older than ${shelf.shelfDays} days`);
  }
  const text = words.length ? `Rejected: ${joinWords(words)}.` : '';
  return { decision: causes.length ? 'reject' : 'accept', causes, text, deadline };
}

function joinWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/**
 * The lot's status and kept reason from the sugarmaker's decision: a reject, or a decision
 * against the recommendation, needs a reason; a reject that follows the rules keeps the rules'
 * own sentence when none is typed. Returns `needsReason` when one is missing.
 */
export function decide(
  rec: Pick<Recommendation, 'decision' | 'text'>,
  decision: Decision | undefined,
  reason: string | null | undefined,
): { status: 'accepted' | 'rejected'; reason: string | null } | { needsReason: true } {
  const chosen = decision ?? rec.decision;
  const typed = reason?.trim() ? reason.trim() : null;
  const against = chosen !== rec.decision;
  if (chosen === 'reject') {
    const kept = typed ?? (against ? null : rec.text || null);
    return kept ? { status: 'rejected', reason: kept } : { needsReason: true };
  }
  if (against && !typed) return { needsReason: true };
  return { status: 'accepted', reason: typed };
}

/** The instant the oldest sap of a lot is counted from: the start of its collection day in the co-op's zone. */
export function collectionStart(collectedOn: string, zone: string): Date {
  return DateTime.fromISO(collectedOn, { zone }).startOf('day').toJSDate();
}
