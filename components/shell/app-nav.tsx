'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useRef, useState } from 'react';
import dynamic from 'next/dynamic';
import { cn } from '@/lib/utils';
import { isCurrent, type RoleNav } from './nav-items';
import { tabClass } from './tab-class';

const MoreSheet = dynamic(() => import('./more-sheet'), { ssr: false });

interface AppNavProps {
  nav: RoleNav;
}

/**
 * The signed-in navigation. The four daily jobs are always one tap away (a tab bar at the
 * bottom of a phone, a bar under the header from tablet width up); everything else sits behind
 * one "More" button that opens a dialog (focus moves in, Escape closes, focus comes back;
 * components/shell/more-sheet.tsx).
 */
export function AppNav({ nav }: AppNavProps) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  const moreCurrent = nav.more.some((i) => isCurrent(pathname, i.href));

  const trigger = useRef<HTMLButtonElement>(null);
  // The dialog's code (its focus handling and sign-out) loads when it is first wanted: on a
  // pointer over the button or focus on it, so it is there by the tap.
  const [wanted, setWanted] = useState(false);
  const more = (
    <>
      <button
        ref={trigger}
        type="button"
        className={cn(tabClass(moreCurrent), 'w-full md:w-auto md:px-4')}
        aria-haspopup="dialog"
        aria-expanded={open}
        data-testid="nav-more"
        onPointerEnter={() => setWanted(true)}
        onFocus={() => setWanted(true)}
        onClick={() => {
          setWanted(true);
          setOpen(true);
        }}
      >
        More
      </button>
      {wanted && <MoreSheet open={open} onOpenChange={setOpen} items={nav.more} pathname={pathname} returnFocusTo={trigger} />}
    </>
  );

  return (
    <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-30 border-t border-birch-line bg-birch-raised pb-[env(safe-area-inset-bottom)] md:static md:border-0 md:bg-transparent md:pb-0">
      <ul className="mx-auto grid max-w-6xl grid-cols-5 gap-1 p-1 text-sm md:flex md:flex-wrap md:items-center md:gap-1 md:p-0 md:text-base">
        {nav.daily.map((item) => {
          const active = isCurrent(pathname, item.href);
          return (
            <li key={item.href} className="min-w-0">
              <Link href={item.href} aria-current={active ? 'page' : undefined} className={cn(tabClass(active), 'h-full w-full px-1 md:px-3')}>
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
