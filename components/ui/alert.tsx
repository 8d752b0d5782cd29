import type { ReactNode } from 'react';
import { cva } from 'class-variance-authority';
import { cn } from '@/lib/utils';

const alertVariants = cva('flex flex-col gap-1 rounded-lg border border-l-4 px-4 py-3 text-base text-slate', {
  variants: {
    tone: {
      info: 'border-spruce-soft border-l-spruce bg-spruce-soft',
      warning: 'border-ember-soft border-l-ember bg-ember-soft',
      danger: 'border-ember border-l-ember-strong bg-ember-soft',
    },
  },
});

// The tone is always spelled out, so the message never depends on colour alone.
const toneWord = { info: 'Note', warning: 'Caution', danger: 'Danger' } as const;
const toneWordClass = { info: 'text-spruce-strong', warning: 'text-ember-strong', danger: 'text-ember-strong' } as const;

export interface AlertProps {
  tone: 'info' | 'warning' | 'danger';
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
}

export function Alert({ tone, title, children, className }: AlertProps) {
  return (
    <div role={tone === 'info' ? 'status' : 'alert'} className={cn(alertVariants({ tone }), className)}>
      <p className="font-bold leading-snug">
        <span className={cn('uppercase tracking-wide', toneWordClass[tone])}>{toneWord[tone]}</span>
        {title ? <span className="text-slate">: {title}</span> : null}
      </p>
      {children ? <div className="flex flex-col gap-2 leading-relaxed">{children}</div> : null}
    </div>
  );
}
