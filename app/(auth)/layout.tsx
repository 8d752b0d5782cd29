import Link from 'next/link';
import type { ReactNode } from 'react';
import { Logo } from '@/components/brand/logo';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center px-4 py-10">
      <Link href="/" className="mb-8 inline-flex min-h-touch items-center rounded-lg">
        <Logo withWord />
      </Link>
      <main className="w-full max-w-md">{children}</main>
    </div>
  );
}
