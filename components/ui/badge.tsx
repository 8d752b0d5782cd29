import type { ComponentProps } from 'react';
import { cva, type VariantProps } from 'class-variance-authority';
import { cn } from '@/lib/utils';

export const badgeVariants = cva(
  'inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-sm font-semibold leading-5',
  {
    variants: {
      variant: {
        neutral: 'border-birch-line bg-birch-line text-slate',
        spruce: 'border-spruce-soft bg-spruce-soft text-spruce-strong',
        ember: 'border-ember-soft bg-ember-soft text-ember-strong',
        // The syrup grades; the caller's text names the grade, so colour is never the only cue.
        golden: 'border-syrup-golden bg-syrup-golden text-slate',
        amber: 'border-syrup-amber bg-syrup-amber text-slate',
        dark: 'border-syrup-dark bg-syrup-dark text-birch-raised',
        'very-dark': 'border-syrup-very-dark bg-syrup-very-dark text-birch-raised',
      },
    },
    defaultVariants: { variant: 'neutral' },
  },
);

export interface BadgeProps extends ComponentProps<'span'>, VariantProps<typeof badgeVariants> {}

export function Badge({ className, variant, ...props }: BadgeProps) {
  return <span className={cn(badgeVariants({ variant }), className)} {...props} />;
}
