import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { getCooperative, listEvaporators, listHouseholdNames, listSeasons } from '@/lib/coop/service';
import { listDeliveries } from '@/lib/deliveries/service';
import { localDay } from '@/lib/time';
import { DeliveryForm } from '@/components/deliveries/delivery-form';
import { DeliveriesTable } from '@/components/deliveries/deliveries-table';

export const metadata: Metadata = { title: 'Drop-offs' };

export default async function DeliveriesPage() {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  const staff = user.role === 'coordinator' || user.role === 'sugarmaker';
  const [coop, seasons, evaporators, households] = await Promise.all([getCooperative(ctx), listSeasons(ctx), listEvaporators(ctx), listHouseholdNames(ctx)]);
  const open = seasons.find((s) => s.status === 'open') ?? null;
  const season = open ?? seasons[0] ?? null;
  const initial = await listDeliveries(ctx, season ? { seasonId: season.id } : {});
  const own = households.find((h) => h.id === user.householdId);
  const units = coop.unitSystem;

  return (
    <div className="flex flex-col gap-8">
      {staff ? (
        <section aria-labelledby="desk-title" className="flex flex-col gap-4">
          <div>
            <h1 id="desk-title" className="text-3xl font-bold">
              Drop-off desk
            </h1>
            <p className="text-slate-muted">
              Meter the sap, read the refractometer, check it is clear, cold and clean, then log the lot
              {open ? ` into ${open.label}` : ''}. Figures in {units === 'us' ? 'gallons and °F' : 'litres and °C'}.
            </p>
          </div>
          <DeliveryForm
            units={units}
            timeZone={coop.timeZone}
            today={localDay(new Date(), coop.timeZone)}
            households={households}
            shelf={{ shelfDays: coop.shelfDays, warmAboveC: coop.warmAboveC, warmShelfDays: coop.warmShelfDays }}
            syrupBrix={coop.syrupBrix}
            evaporator={evaporators[0] ? { name: evaporators[0].name, evaporationLph: evaporators[0].evaporationLph } : null}
            seasonLabel={open?.label ?? null}
          />
        </section>
      ) : null}
      <section aria-labelledby="lots-title" className="flex flex-col gap-4">
        <div>
          {staff ? (
            <h2 id="lots-title" className="text-2xl font-bold">
              Drop-offs
            </h2>
          ) : (
            <h1 id="lots-title" className="text-3xl font-bold">
              Our drop-offs
            </h1>
          )}
          <p className="text-slate-muted">
            {season ? `${season.label}: ` : ''}
            {staff ? 'every lot logged, newest first.' : `the sap the ${own?.name ?? 'your'} household brought, newest first.`} Rejected lots stay on
            record with their reason and never count toward sugar.
          </p>
        </div>
        <DeliveriesTable
          units={units}
          timeZone={coop.timeZone}
          seasonId={season?.id ?? null}
          households={staff ? households : null}
          canCorrect={staff}
          initial={initial}
          exportName={`drop-offs-${(season?.label ?? 'all').toLowerCase().replace(/[^a-z0-9]+/g, '-')}`}
        />
      </section>
    </div>
  );
}
