'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useState } from 'react';
import { signOut } from 'next-auth/react';
import * as RadixDialog from '@radix-ui/react-dialog';
import { cn } from '@/lib/utils';
import { isCurrent, type RoleNav } from './nav-items';

interface AppNavProps {
  nav: RoleNav;
}

const tabClass = (active: boolean) =>
  cn(
    'flex min-h-touch min-w-touch items-center justify-center rounded-lg px-2 text-center font-semibold leading-tight',
    'focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-spruce',
    active ? 'bg-spruce text-birch-raised' : 'text-slate hover:bg-spruce-soft',
  );

/**
 * The signed-in navigation. The four daily jobs are always one tap away (a tab bar at the
 * bottom of a phone, a bar under the header from tablet width up); everything else sits behind
 * one "More" button that opens a dialog (focus moves in, Escape closes, focus comes back).
 */
export function AppNav({ nav }: AppNavProps) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  const moreCurrent = nav.more.some((i) => isCurrent(pathname, i.href));

  const more = (
    <RadixDialog.Root open={open} onOpenChange={setOpen}>
      <RadixDialog.Trigger
        className={cn(tabClass(moreCurrent), 'w-full md:w-auto md:px-4')}
        aria-haspopup="dialog"
        data-testid="nav-more"
      >
        More
      </RadixDialog.Trigger>
      <RadixDialog.Portal>
        <RadixDialog.Overlay className="fixed inset-0 z-40 bg-slate/50" />
        <RadixDialog.Content
          className={cn(
            'fixed z-50 flex flex-col gap-3 bg-birch-raised text-slate shadow-xl',
            'inset-x-0 bottom-0 max-h-[85dvh] overflow-y-auto rounded-t-2xl border-t border-birch-line p-4 pb-[max(1rem,env(safe-area-inset-bottom))]',
            'md:inset-x-auto md:bottom-auto md:right-4 md:top-16 md:w-80 md:rounded-2xl md:border',
          )}
        >
          <div className="flex items-center justify-between gap-3">
            <RadixDialog.Title className="text-lg font-bold">More</RadixDialog.Title>
            <RadixDialog.Close className={cn(tabClass(false), 'px-3')}>Close</RadixDialog.Close>
          </div>
          <RadixDialog.Description className="sr-only">The rest of Brixhouse. Press Escape to close.</RadixDialog.Description>
          <nav aria-label="More">
            <ul className="flex flex-col gap-1">
              {nav.more.map((item) => {
                const active = isCurrent(pathname, item.href);
                return (
                  <li key={item.href}>
                    <Link
                      href={item.href}
                      aria-current={active ? 'page' : undefined}
                      onClick={() => setOpen(false)}
                      className={cn(tabClass(active), 'w-full justify-start px-3')}
                    >
                      {item.label}
                    </Link>
                  </li>
                );
              })}
              <li className="mt-2 border-t border-birch-line pt-2">
                <button type="button" className={cn(tabClass(false), 'w-full justify-start px-3')} onClick={() => void signOut({ callbackUrl: '/sign-in' })}>
                  Sign out
                </button>
              </li>
            </ul>
          </nav>
        </RadixDialog.Content>
      </RadixDialog.Portal>
    </RadixDialog.Root>
  );

  return (
    <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-30 border-t border-birch-line bg-birch-raised pb-[env(safe-area-inset-bottom)] md:static md:border-0 md:bg-transparent md:pb-0">
      <ul className="mx-auto grid max-w-6xl grid-cols-5 gap-1 p-1 text-sm md:flex md:flex-wrap md:items-center md:gap-1 md:p-0 md:text-base">
        {nav.daily.map((item) => {
          const active = isCurrent(pathname, item.href);
          return (
            <li key={item.href} className="min-w-0">
              <Link href={item.href} aria-current={active ? 'page' : undefined} className={cn(tabClass(active), 'h-full w-full md:px-3')}>
                <span className="md:hidden">{item.short ?? item.label}</span>
                <span className="hidden md:inline">{item.label}</span>
              </Link>
            </li>
          );
        })}
        <li className="min-w-0 md:ml-auto">{more}</li>
      </ul>
    </nav>
  );
}
