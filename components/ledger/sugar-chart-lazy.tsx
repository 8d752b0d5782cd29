'use client';

import dynamic from 'next/dynamic';
import type { SugarChartProps } from './sugar-chart';

// The chart library loads only on the ledger page, after the table; the box keeps its size.
const Chart = dynamic(() => import('./sugar-chart'), {
  ssr: false,
  loading: () => <p className="p-4 text-slate-muted">Loading the chart…</p>,
});

export function SugarChartLazy(props: SugarChartProps) {
  return (
    <div className="h-72 w-full" role="img" aria-label={`Sugar delivered per week by household, in ${props.unit}`}>
      <Chart {...props} />
    </div>
  );
}
