import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { HouseholdsManager } from '@/components/households/households-manager';

export const metadata: Metadata = { title: 'Households' };

export default async function HouseholdsPage() {
  await requireContext({ roles: ['coordinator'], onFail: 'redirect' });
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-bold">Households</h1>
        <p className="text-slate-muted">The co-op’s households, their people and what each may do.</p>
      </div>
      <HouseholdsManager />
    </div>
  );
}
