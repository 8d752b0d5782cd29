import type { ComponentProps } from 'react';
import { cn } from '@/lib/utils';

export interface TableProps extends ComponentProps<'table'> {
  /**
   * Names the scrolling region; when given, the wrapper becomes focusable so a
   * keyboard user can scroll a wide table on a phone.
   */
  label?: string;
  containerClassName?: string;
  /**
   * Below tablet width, show each row as a card of "label … value" lines (give each TD a
   * `label`) instead of a table to scroll sideways.
   */
  stack?: boolean;
}

export function Table({ label, containerClassName, className, stack = false, ...props }: TableProps) {
  return (
    <div
      // `relative` keeps absolutely placed content (screen-reader-only headings) inside the
      // scrolling box, where it cannot widen the page.
      className={cn('relative w-full overflow-x-auto rounded-lg border border-birch-line bg-birch-raised', containerClassName)}
      {...(label ? { role: 'region', 'aria-label': label, tabIndex: 0 } : {})}
    >
      <table className={cn('w-full border-collapse text-left text-base', stack && 'table-stack', className)} {...props} />
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
  /** The column's heading, shown beside the value when a stacked table is a list on a phone. */
  label?: string;
}

export function TD({ numeric = false, label, className, ...props }: TDProps) {
  return (
    <td
      data-label={label}
      className={cn('px-3 py-2.5 text-slate', numeric ? 'num text-right whitespace-nowrap' : 'text-left', className)}
      {...props}
    />
  );
}
