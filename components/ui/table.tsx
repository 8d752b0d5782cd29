import type { ComponentProps } from 'react';
import { cn } from '@/lib/utils';

export interface TableProps extends ComponentProps<'table'> {
  /**
   * Names the scrolling region; when given, the wrapper becomes focusable so a
   * keyboard user can scroll a wide table on a phone.
   */
  label?: string;
  containerClassName?: string;
}

export function Table({ label, containerClassName, className, ...props }: TableProps) {
  return (
    <div
      className={cn('w-full overflow-x-auto rounded-lg border border-birch-line bg-birch-raised', containerClassName)}
      {...(label ? { role: 'region', 'aria-label': label, tabIndex: 0 } : {})}
    >
      <table className={cn('w-full border-collapse text-left text-base', className)} {...props} />
    </div>
  );
}

export type THeadProps = ComponentProps<'thead'>;

export function THead({ className, ...props }: THeadProps) {
  return <thead className={cn('border-b border-birch-line bg-birch', className)} {...props} />;
}

export type TBodyProps = ComponentProps<'tbody'>;

export function TBody({ className, ...props }: TBodyProps) {
  return <tbody className={cn('divide-y divide-birch-line', className)} {...props} />;
}

export type TRProps = ComponentProps<'tr'>;

export function TR({ className, ...props }: TRProps) {
  return <tr className={cn('align-top', className)} {...props} />;
}

export interface THProps extends ComponentProps<'th'> {
  /** Right-aligns the heading over a column of figures. */
  numeric?: boolean;
}

export function TH({ numeric = false, scope = 'col', className, ...props }: THProps) {
  return (
    <th
      scope={scope}
      className={cn(
        'px-3 py-2.5 font-semibold text-slate',
        // Column headings are set smaller than the row headings that start each row.
        scope === 'row' ? 'text-base whitespace-nowrap' : 'text-sm',
        numeric ? 'text-right whitespace-nowrap' : 'text-left',
        className,
      )}
      {...props}
    />
  );
}

export interface TDProps extends ComponentProps<'td'> {
  /** Right-aligns a figure with tabular digits so the column lines up. */
  numeric?: boolean;
}

export function TD({ numeric = false, className, ...props }: TDProps) {
  return (
    <td
      className={cn('px-3 py-2.5 text-slate', numeric ? 'num text-right whitespace-nowrap' : 'text-left', className)}
      {...props}
    />
  );
}
