import type { Metadata } from 'next';
import { requireContext } from '@/lib/server/context';
import { AccountForms } from '@/components/account/account-forms';

export const metadata: Metadata = { title: 'Your account' };

export default async function AccountPage() {
  const ctx = await requireContext({ onFail: 'redirect' });
  return (
    <div className="flex max-w-xl flex-col gap-6">
      <div className="flex flex-col gap-1">
        <h1 className="text-2xl font-bold">Your account</h1>
        <p className="text-slate-muted">Signed in as {ctx.actor.email}.</p>
      </div>
      <AccountForms name={ctx.actor.name} />
    </div>
  );
}
