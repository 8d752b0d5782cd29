'use client';

import { useEffect, useRef, useState } from 'react';
import dynamic from 'next/dynamic';
import type { SugarChartProps } from './sugar-chart';

// The chart library (the largest script of the ledger page) loads only when the chart's box comes
// near the screen; the box keeps its size, so nothing moves when it draws.
const Chart = dynamic(() => import('./sugar-chart'), {
  ssr: false,
  loading: () => <p className="p-4 text-slate-muted">Loading the chart…</p>,
});

export function SugarChartLazy(props: SugarChartProps) {
  const box = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const el = box.current;
    if (!el || near) return;
    const seen = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) setNear(true);
    }, { rootMargin: '300px 0px' });
    seen.observe(el);
    return () => seen.disconnect();
  }, [near]);
  return (
    <div ref={box} className="h-72 w-full" role="img" aria-label={`Sugar delivered per week by household, in ${props.unit}`}>
      {near ? <Chart {...props} /> : <p className="p-4 text-slate-muted">The chart draws when you scroll to it.</p>}
    </div>
  );
}
