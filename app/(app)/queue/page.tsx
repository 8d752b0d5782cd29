import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { getCooperative } from '@/lib/coop/service';
import { currentSnapshot } from '@/lib/queue/service';
import { QueueBoard } from '@/components/queue/queue-board';

export const metadata: Metadata = { title: 'Boil queue' };

export default async function QueuePage() {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  const [coop, cached] = await Promise.all([getCooperative(ctx), currentSnapshot(ctx.cooperativeId)]);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-3xl font-bold">Boil queue</h1>
        <p className="text-slate-muted">Every accepted lot still to boil, the one that spoils first at the top. It updates by itself.</p>
      </div>
      <QueueBoard
        initial={cached!.snapshot}
        unitSystem={coop.unitSystem}
        timeZone={coop.timeZone}
        ownHouseholdId={user.role === 'member' ? user.householdId : null}
      />
    </div>
  );
}
