import type { Clarity, Contamination, Decision, DeliveryStatus, SugarbushMix } from './schema';

/** A lot as the API answers it (SI units; times ISO 8601 with the co-op's offset). */
export interface DeliveryDto {
  id: string;
  seasonId: string;
  householdId: string;
  householdName: string;
  receivedAt: string;
  collectedOn: string;
  volumeL: number;
  brix: number;
  /** Sugar in the lot, lib/sugar `sugarKg(volumeL, brix)`. */
  sugarKg: number;
  sapTempC: number;
  clarity: Clarity;
  contamination: Contamination;
  mix: SugarbushMix | null;
  recommendation: Decision;
  status: DeliveryStatus;
  /** Why it was rejected, or why it was accepted against the recommendation. */
  reason: string | null;
  photoKey: string | null;
  note: string | null;
  loggedBy: string | null;
  loggedByName: string | null;
  /** Litres already taken into boil runs. */
  litresBoiled: number;
  /** Number of corrections. */
  revisions: number;
}

export interface DeliveryRevisionDto {
  id: string;
  changedAt: string;
  changedBy: string | null;
  changedByName: string | null;
  reason: string;
  before: Record<string, unknown>;
  after: Record<string, unknown>;
}

export interface DeliveryDetailDto extends Omit<DeliveryDto, 'revisions'> {
  revisions: DeliveryRevisionDto[];
  /** When the lot must be boiled by (lib/sugar `spoilageDeadline`). */
  deadline: string;
}
