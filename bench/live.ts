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

export async function liveQueue(
  ctx: ApiContext,
  { counts, durationS, log, label = '' }: { counts: number[]; durationS: number; log: (s: string) => void; label?: string },
): Promise<Figure[]> {
  const figures: Figure[] = [];
  const specs = apiRoutes(ctx);
  const write = specs.find((s) => s.kind === 'write')!;
  const read = specs.find((s) => s.name.startsWith('GET /api/slots'))!;
  for (const count of counts) {
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
    await sleep(1_000);

    // The API load of the benchmark runs meanwhile (50 connections on a read route).
    const loadDone = load(
      { name: read.name, url: ctx.appUrls.map((u) => `${u}${read.path}`), headers: { cookie: ctx.cookie, accept: 'application/json' } },
      durationS,
    );
    const written: { id: string; answeredAt: number }[] = [];
    let failed = 0;
    const writes: Promise<void>[] = [];
    const until = Date.now() + durationS * 1000;
    while (Date.now() < until) {
      writes.push(
        (async () => {
          const res = await fetch(`${ctx.appUrls[0]}${write.path}`, {
            method: 'POST',
            headers: { 'content-type': 'application/json', accept: 'application/json', cookie: ctx.cookie, origin: ctx.appUrls[0] },
            body: write.body!(),
          });
          const body = (await res.json()) as { id?: string };
          if (res.ok && body.id) written.push({ id: body.id, answeredAt: Date.now() });
          else failed++;
        })(),
      );
      await sleep(200);
    }
    await Promise.all(writes);
    const apiLoad = await loadDone;
    await sleep(2_000);
    const report = await new Promise<{ latencies: number[]; missing: number; expected: number }>((resolve) => {
      viewers.on('message', (m: { type: string; latencies: number[]; missing: number; expected: number }) => m.type === 'report' && resolve(m));
      viewers.send({ type: 'report', lots: written });
    });
    await ctx.removeBenchLots();
    const delivered = report.expected ? (100 * (report.expected - report.missing)) / report.expected : 0;
    const p99 = percentile(report.latencies, 99);
    const limit = count >= 500 ? 250 : 50;
    const note = `${written.length} drop-offs written (${failed} failed), ${report.latencies.length} receipts; median ${median(report.latencies).toFixed(0)} ms; API load meanwhile ${apiLoad.reqPerSec.toFixed(0)} req/s (p99 ${apiLoad.p99Ms} ms)`;
    log(`  ${count} viewers${label}: delivered ${delivered.toFixed(2)} %, p99 ${p99} ms — ${note}`);
    figures.push(
      { section: 'live', name: `${count} viewers${label}: updates delivered`, value: delivered, unit: '%', baseline: null, ratio: null, target: '100 %', met: delivered === 100 && written.length > 0, note },
      { section: 'live', name: `${count} viewers${label}: p99 from write answer to receipt`, value: p99, unit: 'ms', baseline: null, ratio: null, target: `≤ ${limit} ms`, met: p99 <= limit },
    );
  }
  return figures;
}
