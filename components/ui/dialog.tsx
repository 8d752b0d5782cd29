'use client';

import type { ComponentProps, ReactNode } from 'react';
import * as RadixDialog from '@radix-ui/react-dialog';
import { cn } from '@/lib/utils';
import { buttonVariants } from './button';

export const Dialog = RadixDialog.Root;
export const DialogTrigger = RadixDialog.Trigger;
export const DialogClose = RadixDialog.Close;

export interface DialogContentProps extends Omit<ComponentProps<typeof RadixDialog.Content>, 'title' | 'children'> {
  title: ReactNode;
  description?: ReactNode;
  children?: ReactNode;
  className?: string;
}

/** A bottom sheet on phones and a centred panel from the `sm` breakpoint up. */
export function DialogContent({ title, description, children, className, ...props }: DialogContentProps) {
  return (
    <RadixDialog.Portal>
      <RadixDialog.Overlay className="fixed inset-0 z-40 bg-slate/50" />
      <RadixDialog.Content
        className={cn(
          'fixed z-50 flex flex-col gap-4 bg-birch-raised text-slate shadow-xl',
          'inset-x-0 bottom-0 max-h-[92dvh] overflow-y-auto rounded-t-2xl border-t border-birch-line p-5 pb-[max(1.25rem,env(safe-area-inset-bottom))]',
          'sm:inset-x-auto sm:bottom-auto sm:left-1/2 sm:top-1/2 sm:w-[calc(100%-2rem)] sm:max-w-lg sm:-translate-x-1/2 sm:-translate-y-1/2',
          'sm:max-h-[85dvh] sm:rounded-2xl sm:border sm:p-6',
          className,
        )}
        {...props}
      >
        <div className="flex items-start justify-between gap-3">
          <div className="flex min-w-0 flex-col gap-1 pt-2">
            <RadixDialog.Title className="text-xl font-bold leading-tight text-slate">{title}</RadixDialog.Title>
            {description ? (
              <RadixDialog.Description className="text-base text-slate-muted">{description}</RadixDialog.Description>
            ) : (
              // Radix expects a description; this one is for screen readers only.
              <RadixDialog.Description className="sr-only">Press Escape to close.</RadixDialog.Description>
            )}
          </div>
          <RadixDialog.Close className={cn(buttonVariants({ variant: 'ghost', size: 'sm' }), '-mr-2 shrink-0')}>
            Close
          </RadixDialog.Close>
        </div>
        {children}
      </RadixDialog.Content>
    </RadixDialog.Portal>
  );
}
