import { boilHours } from '@/lib/sugar';

export interface WaitingLot {
  litres: number;
  brix: number;
  /** When the lot must be boiled by (its spoilage deadline). */
  deadline: Date;
}

export interface BookedWindow {
  startsAt: Date;
  endsAt: Date;
}

export interface BoilPlan {
  waitingL: number;
  /** Evaporator hours the waiting sap needs at the evaporator's rated evaporation. */
  hoursNeeded: number;
  /** Deadline of the oldest waiting lot, or null when no sap waits. */
  oldestDeadline: string | null;
  /** Booked hours from now until that deadline (all booked hours ahead when no sap waits). */
  hoursBookedBeforeDeadline: number;
  /** Hours still to book before the deadline; 0 when the booking covers the need. */
  shortfallHours: number;
  short: boolean;
}

const hours = (ms: number) => ms / 3_600_000;

/**
 * Compares the boiling the waiting sap needs with the evaporator time booked before the oldest
 * lot spoils. Booked time counts only from `now` on.
 */
export function planBoiling({
  lots,
  slots,
  evaporationLph,
  syrupBrix,
  now,
}: {
  lots: WaitingLot[];
  slots: BookedWindow[];
  evaporationLph: number;
  syrupBrix: number;
  now: Date;
}): BoilPlan {
  const waitingL = lots.reduce((sum, l) => sum + l.litres, 0);
  const hoursNeeded = lots.reduce((sum, l) => sum + boilHours(l.litres, l.brix, evaporationLph, syrupBrix), 0);
  const oldest = lots.length ? new Date(Math.min(...lots.map((l) => l.deadline.getTime()))) : null;
  const horizon = oldest ?? new Date(Math.max(now.getTime(), ...slots.map((s) => s.endsAt.getTime())));
  let booked = 0;
  for (const s of slots) {
    const from = Math.max(s.startsAt.getTime(), now.getTime());
    const to = Math.min(s.endsAt.getTime(), horizon.getTime());
    if (to > from) booked += hours(to - from);
  }
  const shortfall = Math.max(0, hoursNeeded - booked);
  return {
    waitingL,
    hoursNeeded,
    oldestDeadline: oldest ? oldest.toISOString() : null,
    hoursBookedBeforeDeadline: booked,
    shortfallHours: shortfall,
    short: shortfall > 1e-9,
  };
}
