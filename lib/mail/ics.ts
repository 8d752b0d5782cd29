import { createEvent } from 'ics';

export interface SlotEvent {
  id: string;
  startsAt: Date;
  endsAt: Date;
  title: string;
  description: string;
  location: string;
  /** Grows with every change, so calendar programs replace the earlier copy. */
  sequence: number;
  cancelled?: boolean;
}

/** A boil slot as an iCalendar file (RFC 5545), times in UTC. */
export function slotIcs(e: SlotEvent): string {
  const { error, value } = createEvent({
    uid: `${e.id}@brixhouse`,
    productId: 'brixhouse/boil-calendar',
    method: e.cancelled ? 'CANCEL' : 'PUBLISH',
    sequence: e.sequence,
    start: e.startsAt.getTime(),
    startInputType: 'utc',
    startOutputType: 'utc',
    end: e.endsAt.getTime(),
    endInputType: 'utc',
    endOutputType: 'utc',
    title: e.title,
    description: e.description,
    location: e.location,
    status: e.cancelled ? 'CANCELLED' : 'CONFIRMED',
    busyStatus: 'BUSY',
  });
  if (error || !value) throw error ?? new Error('Could not build the calendar file.');
  return value;
}
