import Link from 'next/link';
import type { ReactNode } from 'react';
import { requireContext } from '@/lib/server/context';
import { getCooperative } from '@/lib/coop/service';
import { AppNav } from '@/components/shell/app-nav';
import { NAV, ROLE_LABEL } from '@/components/shell/nav-items';
import { SignOutButton } from '@/components/shell/sign-out-button';
import { Logo } from '@/components/brand/logo';
import { Badge } from '@/components/ui/badge';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const ctx = await requireContext({ onFail: 'redirect' });
  const user = ctx.actor;
  const coop = await getCooperative(ctx);
  return (
    <div className="min-h-dvh">
      <header className="border-b border-birch-line bg-birch-raised">
        <div className="mx-auto flex max-w-6xl flex-col gap-2 px-4 py-3">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <Link href="/home" className="inline-flex min-h-touch items-center gap-2 rounded-lg">
              <Logo withWord />
              <span className="sr-only">Today</span>
            </Link>
            <div className="flex items-center gap-2 text-sm">
              <span className="hidden text-slate-muted sm:inline">{coop.name}</span>
              <span data-testid="signed-in-as" className="font-semibold">{user.name}</span>
              <Badge variant="spruce">{ROLE_LABEL[user.role]}</Badge>
              <SignOutButton />
            </div>
          </div>
          <AppNav items={NAV[user.role]} />
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
    </div>
  );
}
