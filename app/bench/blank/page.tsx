import type { Metadata } from 'next';
import { notFound } from 'next/navigation';

export const metadata: Metadata = { title: 'Framework baseline' };

/**
 * The framework's own floor for the page benchmarks: a page of this app (its root layout, the
 * framework's runtime) with one line of text and no client code of its own. It exists only while
 * BENCH_ROUTES=1 (npm run bench sets it); otherwise it is "page not found" like any unknown path.
 */
export default function BenchBlankPage() {
  if (process.env.BENCH_ROUTES !== '1') notFound();
  return (
    <main className="mx-auto max-w-xl px-4 py-12">
      <h1 className="text-3xl font-bold">Brixhouse</h1>
      <p>A page with no content of its own: what every page costs before its own work.</p>
    </main>
  );
}
