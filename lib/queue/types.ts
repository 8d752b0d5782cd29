import type { GradeClass, SpoilageState } from '@/lib/sugar';

/** One waiting lot as the queue shows it (SI units; times ISO 8601). */
export interface QueueLot {
  deliveryId: string;
  householdId: string;
  householdName: string;
  receivedAt: string;
  collectedOn: string;
  /** Accepted litres not yet drawn into a run. */
  litresLeft: number;
  brix: number;
  sugarKg: number;
  /** Hours since the oldest sap in the lot was collected. */
  ageHours: number;
  deadline: string;
  state: SpoilageState;
  /** Evaporator hours this lot needs at the queue's evaporator rate. */
  boilHours: number;
  etaStart: string;
  etaEnd: string;
  /** Its boil would not finish before its deadline. */
  spoilsBeforeTurn: boolean;
}

export interface QueueDraw {
  id: string;
  drawnAt: string;
  litres: number;
  brix: number;
  transmittancePct: number | null;
  gradeClass: GradeClass | null;
}

/** The run now on an evaporator. */
export interface QueueRun {
  id: string;
  lotCode: string;
  evaporatorId: string;
  evaporatorName: string;
  startedAt: string;
  inputL: number;
  sugarKg: number;
  syrupExpectedL: number;
  syrupDrawnL: number;
  /** Evaporator hours of the sap taken in that are still to boil, counted from now. */
  hoursLeft: number;
  draws: QueueDraw[];
}

export interface QueueTotals {
  lots: number;
  litresWaiting: number;
  sugarKg: number;
  syrupExpectedL: number;
  /** Evaporator hours the waiting sap needs. */
  hoursNeeded: number;
  /** Booked boil-slot hours from now on. */
  hoursBookedAhead: number;
  /** Lots whose boil would not finish before their deadline. */
  atRisk: number;
  /** Syrup drawn since midnight in the co-op's time zone. */
  syrupDrawnTodayL: number;
}

/** The Boil queue: what GET /api/queue answers and the `queue` socket event carries. */
export interface QueueSnapshot {
  version: number;
  computedAt: string;
  evaporator: { id: string; name: string; evaporationLph: number } | null;
  syrupBrix: number;
  lots: QueueLot[];
  run: QueueRun | null;
  totals: QueueTotals;
}
