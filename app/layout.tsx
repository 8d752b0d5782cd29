import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { connection } from 'next/server';
import { Toaster } from '@/components/ui/toaster';
import { CspNonce } from '@/components/shell/csp-nonce';
import { brandFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: {
    template: '%s · Brixhouse',
    default: 'Brixhouse — the shared book of a cooperative sugarhouse',
  },
  description:
    'Brixhouse keeps the shared book of a cooperative maple sugarhouse: boil slots on the shared evaporator, sap drop-offs with their °Brix, the live boil queue, and a season split by the sugar each household delivered.',
  applicationName: 'Brixhouse',
};

export const viewport: Viewport = {
  // Browser chrome takes the page ground colour; keep in step with --birch in globals.css.
  themeColor: '#f6f1e7',
  colorScheme: 'light',
};

export default async function RootLayout({ children }: Readonly<{ children: ReactNode }>) {
  // Every page renders per request, so that Next.js can put this request's CSP nonce
  // (set by proxy.ts) on its scripts.
  await connection();
  return (
    <html lang="en" className={brandFont.variable}>
      <body className="min-h-dvh bg-birch font-sans text-slate antialiased">
        <CspNonce />
        {children}
        <Toaster />
      </body>
    </html>
  );
}
