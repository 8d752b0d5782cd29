'use client';

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

export interface SugarChartProps {
  weeks: { week: string; sugarKg: Record<string, number> }[];
  households: { householdId: string; name: string }[];
  /** Multiplier from kg to the co-op's mass unit, and its label. */
  factor: number;
  unit: string;
}

// Series colours from the palette's CSS variables (no raw colours in components).
const SERIES = ['var(--spruce)', 'var(--syrup-amber)', 'var(--ember)', 'var(--slate-muted)', 'var(--syrup-dark)', 'var(--spruce-strong)', 'var(--syrup-golden)', 'var(--ember-strong)'];

/** Each household's sugar delivered per week, stacked (recharts; loaded only when shown). */
export default function SugarChart({ weeks, households, factor, unit }: SugarChartProps) {
  const data = weeks.map((w) => ({
    week: w.week.slice(5),
    ...Object.fromEntries(households.map((h) => [h.name, Math.round((w.sugarKg[h.householdId] ?? 0) * factor * 10) / 10])),
  }));
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart data={data} margin={{ top: 8, right: 8, bottom: 8, left: 0 }}>
        <CartesianGrid strokeDasharray="3 3" vertical={false} />
        <XAxis dataKey="week" tickLine={false} />
        <YAxis unit={` ${unit}`} width={64} tickLine={false} />
        <Tooltip formatter={(v) => `${v} ${unit}`} labelFormatter={(l) => `Week of ${l}`} />
        <Legend />
        {households.map((h, i) => (
          <Bar key={h.householdId} dataKey={h.name} stackId="sugar" fill={SERIES[i % SERIES.length]} />
        ))}
      </BarChart>
    </ResponsiveContainer>
  );
}
