import type { Metadata } from 'next';
import type { ReactNode } from 'react';

export const metadata: Metadata = { robots: { index: false, follow: false }, referrer: 'no-referrer' };

/** The sugarhouse screen's shell: full screen, dark, no navigation and no sign-in. */
export default function DisplayLayout({ children }: { children: ReactNode }) {
  return <div className="min-h-dvh bg-night text-birch-raised">{children}</div>;
}
