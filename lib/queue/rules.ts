import { boilHours, spoilageDeadline, spoilageState, sugarKg, syrupLitres, type GradeClass } from '@/lib/sugar';
import type { QueueLot, QueueRun, QueueSnapshot } from './types';

const HOUR_MS = 3_600_000;

/** A lot with litres still to boil, as the database holds it. */
export interface WaitingLotInput {
  deliveryId: string;
  householdId: string;
  householdName: string;
  receivedAt: Date;
  /** The day the oldest sap was collected, and that day's start in the co-op's zone. */
  collectedOn: string;
  collectedAt: Date;
  litresLeft: number;
  brix: number;
  sapTempC: number;
}

export interface RunningRunInput {
  id: string;
  lotCode: string;
  evaporatorId: string;
  evaporatorName: string;
  evaporationLph: number;
  startedAt: Date;
  inputs: { litres: number; brix: number }[];
  draws: { id: string; drawnAt: Date; litres: number; brix: number; transmittancePct: number | null; gradeClass: GradeClass | null }[];
}

export interface QueueInput {
  version: number;
  now: Date;
  /** The evaporator the queue is boiled on (the running run's, else the co-op's first). */
  evaporator: { id: string; name: string; evaporationLph: number } | null;
  syrupBrix: number;
  spoilage: { shelfDays: number; warmAboveC: number; warmShelfDays: number };
  lots: WaitingLotInput[];
  run: RunningRunInput | null;
  /** Booked boil slots that end after now. */
  bookedSlots: { startsAt: Date; endsAt: Date }[];
  syrupDrawnTodayL: number;
}

/** Earliest spoilage deadline first, then earliest arrival, then id (so the order is total). */
export function compareLots(
  a: { deadline: Date; receivedAt: Date; deliveryId: string },
  b: { deadline: Date; receivedAt: Date; deliveryId: string },
): number {
  return (
    a.deadline.getTime() - b.deadline.getTime() ||
    a.receivedAt.getTime() - b.receivedAt.getTime() ||
    (a.deliveryId < b.deliveryId ? -1 : a.deliveryId > b.deliveryId ? 1 : 0)
  );
}

/** Evaporator hours of the running run's sap still to boil: what it needs less the time it has boiled. */
export function runHoursLeft(run: RunningRunInput, syrupBrix: number, now: Date): number {
  const need = run.inputs.reduce((sum, i) => sum + boilHours(i.litres, i.brix, run.evaporationLph, syrupBrix), 0);
  const boiled = Math.max(0, (now.getTime() - run.startedAt.getTime()) / HOUR_MS);
  return Math.max(0, need - boiled);
}

function runView(run: RunningRunInput, syrupBrix: number, now: Date): QueueRun {
  const inputL = run.inputs.reduce((s, i) => s + i.litres, 0);
  return {
    id: run.id,
    lotCode: run.lotCode,
    evaporatorId: run.evaporatorId,
    evaporatorName: run.evaporatorName,
    startedAt: run.startedAt.toISOString(),
    inputL,
    sugarKg: run.inputs.reduce((s, i) => s + sugarKg(i.litres, i.brix), 0),
    syrupExpectedL: run.inputs.reduce((s, i) => s + syrupLitres(i.litres, i.brix, syrupBrix), 0),
    syrupDrawnL: run.draws.reduce((s, d) => s + d.litres, 0),
    hoursLeft: runHoursLeft(run, syrupBrix, now),
    draws: run.draws.map((d) => ({ ...d, drawnAt: d.drawnAt.toISOString() })),
  };
}

/**
 * The Boil queue: every lot with litres left, in the order it should be boiled (earliest
 * deadline first, then arrival), each with its deadline state and the estimated start and end
 * of its boil. The estimates add up lib/sugar `boilHours` at the evaporator's rated evaporation,
 * one lot after another, from now or from the end of the sap the running run still has to boil.
 */
export function computeQueue(input: QueueInput): QueueSnapshot {
  const { now, syrupBrix, evaporator } = input;
  const lph = input.run?.evaporationLph ?? evaporator?.evaporationLph ?? null;
  const run = input.run ? runView(input.run, syrupBrix, now) : null;

  const ordered = input.lots
    .filter((l) => l.litresLeft > 1e-9)
    .map((l) => ({ ...l, deadline: spoilageDeadline(l.collectedAt, { sapTempC: l.sapTempC, ...input.spoilage }) }))
    .sort(compareLots);

  let clock = now.getTime() + (run ? run.hoursLeft * HOUR_MS : 0);
  let hoursNeeded = 0;
  let atRisk = 0;
  let litresWaiting = 0;
  let sugarWaiting = 0;
  let syrupExpected = 0;
  const lots: QueueLot[] = ordered.map((l) => {
    const hours = lph ? boilHours(l.litresLeft, l.brix, lph, syrupBrix) : 0;
    const start = clock;
    clock += hours * HOUR_MS;
    hoursNeeded += hours;
    litresWaiting += l.litresLeft;
    const sugar = sugarKg(l.litresLeft, l.brix);
    sugarWaiting += sugar;
    syrupExpected += syrupLitres(l.litresLeft, l.brix, syrupBrix);
    const spoilsBeforeTurn = clock > l.deadline.getTime();
    if (spoilsBeforeTurn) atRisk++;
    return {
      deliveryId: l.deliveryId,
      householdId: l.householdId,
      householdName: l.householdName,
      receivedAt: l.receivedAt.toISOString(),
      collectedOn: l.collectedOn,
      litresLeft: l.litresLeft,
      brix: l.brix,
      sugarKg: sugar,
      ageHours: Math.max(0, (now.getTime() - l.collectedAt.getTime()) / HOUR_MS),
      deadline: l.deadline.toISOString(),
      state: spoilageState(l.deadline, now),
      boilHours: hours,
      etaStart: new Date(start).toISOString(),
      etaEnd: new Date(clock).toISOString(),
      spoilsBeforeTurn,
    };
  });

  let hoursBookedAhead = 0;
  for (const s of input.bookedSlots) {
    const from = Math.max(s.startsAt.getTime(), now.getTime());
    if (s.endsAt.getTime() > from) hoursBookedAhead += (s.endsAt.getTime() - from) / HOUR_MS;
  }

  return {
    version: input.version,
    computedAt: now.toISOString(),
    evaporator: input.run
      ? { id: input.run.evaporatorId, name: input.run.evaporatorName, evaporationLph: input.run.evaporationLph }
      : evaporator,
    syrupBrix,
    lots,
    run,
    totals: {
      lots: lots.length,
      litresWaiting,
      sugarKg: sugarWaiting,
      syrupExpectedL: syrupExpected,
      hoursNeeded,
      hoursBookedAhead,
      atRisk,
      syrupDrawnTodayL: input.syrupDrawnTodayL,
    },
  };
}
