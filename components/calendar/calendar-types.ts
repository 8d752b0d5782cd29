import type { Role } from '@/lib/roles';
import type { UnitSystem } from '@/lib/sugar/units';

/** What the server page hands the Boil calendar: plain values only. */
export interface CalendarSetup {
  coopName: string;
  /** IANA zone every wall-clock time on the page is read in. */
  timeZone: string;
  /** Sugarhouse hours, 'HH:MM'. */
  opensAt: string;
  closesAt: string;
  slotMinMinutes: number;
  slotMaxMinutes: number;
  cancelNoticeHours: number;
  unitSystem: UnitSystem;
  evaporators: { id: string; name: string }[];
  season: { label: string; startsOn: string; endsOn: string } | null;
  user: {
    name: string;
    role: Role;
    /** Coordinators and sugarmakers book and change any household's slots. */
    staff: boolean;
    householdId: string | null;
    householdName: string | null;
  };
  /** Every household, for staff to book on behalf of; empty for members. */
  households: { id: string; name: string }[];
}
