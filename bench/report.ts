// bench/results.json (one entry per figure) and bench/RESULTS.md (the same, for people).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ROOT } from './servers';

export interface Figure {
  section: string;
  name: string;
  /** The median over the runs; null when the thing measured is not available yet. */
  value: number | null;
  unit: string;
  /** What the value is compared with (a figure of the same run), if anything. */
  baseline: string | null;
  ratio: number | null;
  target: string | null;
  /** Whether the target is met; null when there is no target. */
  met: boolean | null;
  min?: number;
  max?: number;
  runs?: number[];
  note?: string;
}

export interface Report {
  startedAt: Date;
  finishedAt?: Date;
  commands: string[];
  settings: Record<string, string | number>;
  figures: Figure[];
  /** Free text per section: query plans, profiles, why a target is missed. */
  details: { section: string; title: string; body: string }[];
}

const SECTIONS: Record<string, string> = {
  api: 'API under load (one server process)',
  scaleout: 'Scale-out: two server processes',
  live: 'Live queue',
  settlement: 'Settlement at scale',
  pages: 'Pages (Lighthouse, mobile)',
  micro: 'lib/sugar micro-benchmarks',
};

const fmt = (v: number | null | undefined, unit = '') => {
  if (v === null || v === undefined || Number.isNaN(v)) return '—';
  const digits = Math.abs(v) >= 100 ? 0 : Math.abs(v) >= 10 ? 1 : 2;
  return `${v.toFixed(digits)}${unit ? ` ${unit}` : ''}`;
};

function markdown(report: Report): string {
  const lines: string[] = [];
  lines.push('# Benchmark results', '');
  lines.push(
    `Written by \`npm run bench\` on ${report.startedAt.toISOString()} (took ${
      report.finishedAt ? Math.round((report.finishedAt.getTime() - report.startedAt.getTime()) / 1000) : '?'
    } s). Machine: ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}, ${Math.round(os.totalmem() / 2 ** 30)} GiB, Node ${process.version}, load average at start ${os
      .loadavg()
      .map((l) => l.toFixed(2))
      .join(' / ')}.`,
    '',
    'Every speed figure is the median of interleaved runs (each round measures every target once, in the same order); the ratio compares it with a baseline measured in the same rounds. min–max show the spread over the runs. The load generator runs on the same machine as the servers and shares its cores.',
    '',
  );
  lines.push('## Commands', '', '```', ...report.commands, '```', '');
  lines.push('## Settings', '', '| setting | value |', '|---|---|');
  for (const [k, v] of Object.entries(report.settings)) lines.push(`| ${k} | ${v} |`);
  lines.push('');
  for (const [key, title] of Object.entries(SECTIONS)) {
    const figures = report.figures.filter((f) => f.section === key);
    const details = report.details.filter((d) => d.section === key);
    if (!figures.length && !details.length) continue;
    lines.push(`## ${title}`, '');
    if (figures.length) {
      lines.push('| figure | median | min–max | baseline | ratio | target | met |', '|---|---|---|---|---|---|---|');
      for (const f of figures) {
        const spread = f.min !== undefined && f.max !== undefined ? `${fmt(f.min)}–${fmt(f.max)}` : '—';
        const value = f.value === null ? `not available${f.note ? ` (${f.note})` : ''}` : fmt(f.value, f.unit);
        const met = f.met === null ? '—' : f.met ? 'yes' : '**no**';
        lines.push(`| ${f.name} | ${value} | ${spread} | ${f.baseline ?? '—'} | ${f.ratio === null ? '—' : `${f.ratio.toFixed(2)}×`} | ${f.target ?? '—'} | ${met} |`);
      }
      const notes = figures.filter((f) => f.note && f.value !== null);
      if (notes.length) {
        lines.push('');
        for (const f of notes) lines.push(`- ${f.name}: ${f.note}`);
      }
      lines.push('');
    }
    for (const d of details) lines.push(`### ${d.title}`, '', d.body.trim(), '');
  }
  const analysis = path.join(ROOT, 'bench', 'ANALYSIS.md');
  if (existsSync(analysis)) lines.push(readFileSync(analysis, 'utf8').trim(), '');
  return lines.join('\n');
}

export function writeReport(report: Report) {
  report.finishedAt = new Date();
  writeFileSync(path.join(ROOT, 'bench', 'results.json'), `${JSON.stringify(report.figures, null, 2)}\n`);
  writeFileSync(path.join(ROOT, 'bench', 'RESULTS.md'), markdown(report));
}

export { fmt };
