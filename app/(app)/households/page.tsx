import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { listHouseholds, listStaff } from '@/lib/households/service';
import { HouseholdsManager } from '@/components/households/households-manager';

export const metadata: Metadata = { title: 'Households' };

export default async function HouseholdsPage() {
  const ctx = await requireContext({ roles: ['coordinator'], onFail: 'redirect' });
  // The lists come with the page: nothing arrives after load to move it.
  const [households, staff] = await Promise.all([listHouseholds(ctx), listStaff(ctx)]);
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Households</h1>
        <p className="text-slate-muted">The co-op’s households, their people and what each may do.</p>
      </div>
      <HouseholdsManager initialHouseholds={households} initialStaff={staff} />
    </div>
  );
}
