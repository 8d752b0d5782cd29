import type { ComponentProps } from 'react';
import { cn } from '@/lib/utils';

export type CardProps = ComponentProps<'div'>;

export function Card({ className, ...props }: CardProps) {
  return (
    <div
      className={cn('flex flex-col rounded-xl border border-birch-line bg-birch-raised text-slate shadow-sm', className)}
      {...props}
    />
  );
}

export type CardHeaderProps = ComponentProps<'div'>;

export function CardHeader({ className, ...props }: CardHeaderProps) {
  return <div className={cn('flex flex-col gap-1 px-5 pt-5', className)} {...props} />;
}

export interface CardTitleProps extends ComponentProps<'h2'> {
  /** Heading level; pick the one that fits the page outline. */
  as?: 'h1' | 'h2' | 'h3' | 'h4';
}

export function CardTitle({ as: Heading = 'h2', className, ...props }: CardTitleProps) {
  return <Heading className={cn('text-lg font-bold leading-snug text-slate', className)} {...props} />;
}

export type CardBodyProps = ComponentProps<'div'>;

export function CardBody({ className, ...props }: CardBodyProps) {
  return <div className={cn('flex flex-col gap-3 px-5 pt-3 pb-5 text-base text-slate', className)} {...props} />;
}
