// The live queue under load: viewers in a separate process, a drop-off every 200 ms while the
// API benchmark's load runs, and the time from each write's HTTP answer to each viewer's
// receipt of the first snapshot holding the new lot.
import { fork } from 'node:child_process';
import path from 'node:path';
import { apiRoutes, type ApiContext } from './api';
import { load, median } from './load';
import type { Figure } from './report';
import { ROOT, sleep } from './servers';

function percentile(xs: number[], p: number) {
  if (!xs.length) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)];
}

interface LiveRound {
  delivered: number;
  p99: number;
  median: number;
  written: number;
  note: string;
}

/** One measurement: `count` viewers connected, a drop-off every 200 ms for `durationS` under the API load. */
async function liveRound(ctx: ApiContext, count: number, durationS: number, log: (s: string) => void, label: string, withLoad: boolean): Promise<LiveRound> {
  const specs = apiRoutes(ctx);
  const write = specs.find((s) => s.kind === 'write')!;
  const read = specs.find((s) => s.name.startsWith('GET /api/slots'))!;
  const viewers = fork(path.join(ROOT, 'bench', 'viewers.ts'), [ctx.appUrls.join(','), String(count), ctx.cookie], {
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const ready = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${count} viewers did not connect within 90 s`)), 90_000);
    viewers.on('message', (m: { type: string; message?: string }) => {
      if (m.type === 'ready') {
        clearTimeout(timer);
        resolve();
      }
    });
  });
  await ready;
  log(`  ${count} viewers connected${label}`);
  // The drop-offs come from a process of their own, one every 200 ms, each answer timed there.
  const writer = fork(path.join(ROOT, 'bench', 'writer.ts'), [ctx.appUrls[0], ctx.cookie], {
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  await new Promise<void>((resolve) => writer.once('message', () => resolve()));
  await sleep(1_000);

  // The API load of the benchmark runs meanwhile (50 connections on a read route).
  // (--live-load no: without it, to tell the load's share of the latency from the rest.)
  const loadDone = withLoad
    ? load({ name: read.name, url: ctx.appUrls.map((u) => `${u}${read.path}`), headers: { cookie: ctx.cookie, accept: 'application/json' } }, durationS)
    : Promise.resolve({ reqPerSec: 0, p99Ms: 0 });
  const bodies = Array.from({ length: Math.round((durationS * 1000) / 200) }, () => write.body!());
  const { written, failed } = await new Promise<{ written: { id: string; answeredAt: number }[]; failed: number }>((resolve) => {
    writer.on('message', (m: { type: string; written: { id: string; answeredAt: number }[]; failed: number }) => m.type === 'written' && resolve(m));
    writer.send({ type: 'write', path: write.path, bodies, everyMs: 200 });
  });
  const apiLoad = await loadDone;
  await sleep(2_000);
  type ViewerReport = { latencies: number[]; first: number[]; byAddress: { address: string; latencies: number[] }[]; missing: number; expected: number };
  const report = await new Promise<ViewerReport>((resolve) => {
    viewers.on('message', (m: ViewerReport & { type: string }) => m.type === 'report' && resolve(m));
    viewers.send({ type: 'report', lots: written });
  });
  await new Promise<void>((resolve) => (viewers.exitCode !== null ? resolve() : viewers.once('exit', () => resolve())));
  await ctx.removeBenchLots();
  const delivered = report.expected ? (100 * (report.expected - report.missing)) / report.expected : 0;
  const p99 = percentile(report.latencies, 99);
  const mid = median(report.latencies);
  const note = `${written.length} drop-offs written (${failed} failed), ${report.latencies.length} receipts, median ${mid.toFixed(0)} ms, p99 ${p99} ms (first viewer per lot: median ${median(report.first).toFixed(0)} ms, p99 ${percentile(report.first, 99)} ms${
    report.byAddress.length > 1
      ? report.byAddress.map((b, i) => `; viewers of process ${i === 0 ? 'A, where the lots are written' : 'B'}: median ${median(b.latencies).toFixed(0)} ms, p99 ${percentile(b.latencies, 99)} ms`).join('')
      : ''
  }); API load meanwhile ${apiLoad.reqPerSec.toFixed(0)} req/s (p99 ${apiLoad.p99Ms} ms)`;
  log(`  ${count} viewers${label}: delivered ${delivered.toFixed(2)} % — ${note}`);
  return { delivered, p99, median: mid, written: written.length, note };
}

/**
 * The live figures, `rounds` interleaved rounds per viewer count (100, 500, 100, 500, …): every
 * round must deliver every update; the p99 reported is the median of the rounds' p99s.
 */
export async function liveQueue(
  ctx: ApiContext,
  {
    counts,
    durationS,
    rounds = 3,
    log,
    label = '',
    withLoad = true,
  }: { counts: number[]; durationS: number; rounds?: number; log: (s: string) => void; label?: string; withLoad?: boolean },
): Promise<Figure[]> {
  const results = new Map<number, LiveRound[]>(counts.map((c) => [c, []]));
  for (let round = 1; round <= rounds; round++) {
    for (const count of counts) {
      log(`  round ${round}/${rounds}`);
      results.get(count)!.push(await liveRound(ctx, count, durationS, log, label, withLoad));
    }
  }
  const figures: Figure[] = [];
  for (const count of counts) {
    const rs = results.get(count)!;
    const limit = count >= 500 ? 250 : 50;
    const delivered = Math.min(...rs.map((r) => r.delivered));
    const p99s = rs.map((r) => r.p99);
    const p99 = median(p99s);
    const note = rs.map((r, i) => `round ${i + 1}: ${r.note}`).join('; ');
    figures.push(
      {
        section: 'live',
        name: `${count} viewers${label}: updates delivered`,
        value: delivered,
        unit: '%',
        baseline: null,
        ratio: null,
        target: '100 % in every round',
        met: delivered === 100 && rs.every((r) => r.written > 0),
        min: delivered,
        max: Math.max(...rs.map((r) => r.delivered)),
        runs: rs.map((r) => r.delivered),
        note,
      },
      {
        section: 'live',
        name: `${count} viewers${label}: p99 from write answer to receipt`,
        value: p99,
        unit: 'ms',
        baseline: null,
        ratio: null,
        target: `≤ ${limit} ms`,
        met: p99 <= limit,
        min: Math.min(...p99s),
        max: Math.max(...p99s),
        runs: p99s,
      },
      {
        section: 'live',
        name: `${count} viewers${label}: median from write answer to receipt`,
        value: median(rs.map((r) => r.median)),
        unit: 'ms',
        baseline: null,
        ratio: null,
        target: null,
        met: null,
        min: Math.min(...rs.map((r) => r.median)),
        max: Math.max(...rs.map((r) => r.median)),
        runs: rs.map((r) => r.median),
      },
    );
  }
  return figures;
}
