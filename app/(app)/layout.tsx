import Link from 'next/link';
import type { ReactNode } from 'react';
import { requireContext } from '@/lib/server/context';
import { getCooperative } from '@/lib/coop/service';
import { AppNav } from '@/components/shell/app-nav';
import { NAV, ROLE_LABEL } from '@/components/shell/nav-items';
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
            <div className="flex min-w-0 items-center gap-2 text-sm">
              <span className="hidden text-slate-muted sm:inline">{coop.name}</span>
              <span data-testid="signed-in-as" className="truncate font-semibold">{user.name}</span>
              <Badge variant="spruce">{ROLE_LABEL[user.role]}</Badge>
            </div>
          </div>
          <AppNav nav={NAV[user.role]} />
        </div>
      </header>
      {/* Room at the bottom of a phone for the tab bar. */}
      <main className="mx-auto max-w-6xl px-4 py-6 pb-28 md:pb-6">{children}</main>
    </div>
  );
}
