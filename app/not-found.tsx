import type { Metadata } from 'next';
import Link from 'next/link';
import { Logo } from '@/components/brand/logo';
import { buttonVariants } from '@/components/ui/button';

export const metadata: Metadata = {
  title: 'Page not found',
};

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-xl flex-col items-start justify-center gap-6 px-4 py-12 sm:px-6">
      <Link href="/" className="inline-flex min-h-touch items-center rounded-lg no-underline">
        <Logo />
      </Link>
      <p className="text-sm font-semibold uppercase tracking-wider text-spruce">Error 404</p>
      <h1 className="text-3xl font-bold leading-tight text-balance sm:text-4xl">This page boiled away</h1>
      <p className="text-lg leading-relaxed text-slate-muted">
        We couldn&rsquo;t find the page you asked for. It may have moved, or the link may have a typo in it.
      </p>
      <Link href="/" className={buttonVariants({ variant: 'primary', size: 'md' })}>
        Back to the home page
      </Link>
    </main>
  );
}
