'use client';

import Link from 'next/link';
import type { RefObject } from 'react';
import { signOut } from 'next-auth/react';
import * as RadixDialog from '@radix-ui/react-dialog';
import { cn } from '@/lib/utils';
import { isCurrent, type NavItem } from './nav-items';
import { tabClass } from './tab-class';

export interface MoreSheetProps {
  open: boolean;
  onOpenChange: (open: boolean) => void;
  items: NavItem[];
  pathname: string;
  /** The "More" button: focus goes back to it when the dialog closes. */
  returnFocusTo: RefObject<HTMLButtonElement | null>;
}

/** The "More" dialog: a sheet from the bottom of a phone, a panel under the header from tablet width up. */
export default function MoreSheet({ open, onOpenChange, items, pathname, returnFocusTo }: MoreSheetProps) {
  const setOpen = onOpenChange;
  return (
    <RadixDialog.Root open={open} onOpenChange={onOpenChange}>
      <RadixDialog.Portal>
        <RadixDialog.Overlay className="fixed inset-0 z-40 bg-slate/50" />
        <RadixDialog.Content
          onCloseAutoFocus={(e) => {
            e.preventDefault();
            returnFocusTo.current?.focus();
          }}
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
              {items.map((item) => {
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
}
