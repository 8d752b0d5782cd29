import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { getCooperative, listEvaporators, listHouseholdNames, listSeasons } from '@/lib/coop/service';
import { getPlanning } from '@/lib/planning/service';
import { DateTime } from 'luxon';
import { clockLabel } from '@/lib/time';
import { BoilCalendar } from '@/components/calendar/boil-calendar';
import type { CalendarSetup } from '@/components/calendar/calendar-types';

export const metadata: Metadata = { title: 'Boil calendar' };

export default async function CalendarPage() {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  // The planning strip's first figures come with the page, so no placeholder moves it.
  const [coop, evaporators, seasons, households, planning] = await Promise.all([
    getCooperative(ctx),
    listEvaporators(ctx),
    listSeasons(ctx),
    listHouseholdNames(ctx),
    getPlanning(ctx),
  ]);
  const staff = user.role === 'coordinator' || user.role === 'sugarmaker';
  const season = seasons.find((s) => s.status === 'open') ?? seasons.find((s) => s.status === 'planned') ?? null;
  const own = households.find((h) => h.id === user.householdId) ?? null;

  const setup: CalendarSetup = {
    coopName: coop.name,
    timeZone: coop.timeZone,
    opensAt: clockLabel(coop.opensAt),
    closesAt: clockLabel(coop.closesAt),
    slotMinMinutes: coop.slotMinMinutes,
    slotMaxMinutes: coop.slotMaxMinutes,
    cancelNoticeHours: coop.cancelNoticeHours,
    unitSystem: coop.unitSystem,
    evaporators: evaporators.map((e) => ({ id: e.id, name: e.name })),
    season: season ? { label: season.label, startsOn: season.startsOn, endsOn: season.endsOn } : null,
    user: { name: user.name, role: user.role, staff, householdId: user.householdId, householdName: own?.name ?? null },
    households: staff ? households : [],
  };

  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Boil calendar</h1>
        <p className="text-slate-muted">
          {season
            ? `${season.label} runs ${day(season.startsOn)} to ${day(season.endsOn)}. Times are shown in ${coop.timeZone.replace(/_/g, ' ')} time; the sugarhouse is open ${setup.opensAt}–${setup.closesAt}.`
            : 'No season is open, so no slots can be booked yet.'}
        </p>
      </div>
      <BoilCalendar setup={setup} initialPlanning={planning} />
    </div>
  );
}

const day = (iso: string) => DateTime.fromISO(iso).toFormat('d LLL yyyy');
