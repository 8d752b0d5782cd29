'use client';

import type { CSSProperties } from 'react';
import { Toaster as Sonner, toast } from 'sonner';

export { toast };

// Sonner injects its own unlayered CSS, so the tokens go in through its variables
// and the few overrides are marked important to beat it from Tailwind's layers.
const toasterStyle = {
  '--normal-bg': 'var(--birch-raised)',
  '--normal-text': 'var(--slate)',
  '--normal-border': 'var(--birch-line)',
  '--border-radius': '0.75rem',
  fontFamily: 'var(--font-sans)',
} as CSSProperties;

export function Toaster() {
  return (
    <Sonner
      position="top-center"
      richColors={false}
      style={toasterStyle}
      toastOptions={{
        classNames: {
          toast: 'text-base! shadow-lg!',
          description: 'text-slate-muted! text-sm!',
          success: 'border-l-4! border-l-spruce!',
          info: 'border-l-4! border-l-spruce!',
          warning: 'border-l-4! border-l-ember!',
          error: 'border-l-4! border-l-ember!',
          actionButton: 'bg-spruce! text-birch-raised! font-semibold!',
          cancelButton: 'bg-birch-line! text-slate!',
        },
      }}
    />
  );
}
