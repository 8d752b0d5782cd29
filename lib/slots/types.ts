/** The boil calendar's response types (client-safe). */

export interface SlotDto {
  id: string;
  evaporatorId: string;
  householdId: string;
  householdName: string;
  startsAt: string;
  endsAt: string;
  status: 'booked' | 'cancelled' | 'done';
  crew: string[];
  expectedSapL: number | null;
  note: string | null;
  /** True when the signed-in person's household crews it (or they are staff): they may change it. */
  editable: boolean;
}
