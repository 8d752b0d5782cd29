import type { ComponentProps } from 'react';
import { cn } from '@/lib/utils';
import { controlVariants } from './input';

export interface SelectProps extends ComponentProps<'select'> {
  /** Classes for the wrapper that positions the arrow; `className` goes to the select. */
  wrapperClassName?: string;
}

/** A native select, so phones show their own picker, styled like Input. */
export function Select({ className, wrapperClassName, children, ...props }: SelectProps) {
  return (
    <div className={cn('relative', wrapperClassName)}>
      <select className={cn(controlVariants(), 'cursor-pointer appearance-none pr-10', className)} {...props}>
        {children}
      </select>
      <svg
        aria-hidden="true"
        viewBox="0 0 20 20"
        fill="none"
        className="pointer-events-none absolute right-3 top-1/2 size-5 -translate-y-1/2 text-slate-muted"
      >
        <path d="M5 7.5l5 5 5-5" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
    </div>
  );
}
