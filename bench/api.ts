// The API benchmark: baselines, read routes and the drop-off write, in interleaved rounds.
import { randomUUID } from 'node:crypto';
import { load, summarise, type LoadRun, type LoadTarget } from './load';
import type { Figure } from './report';

export interface ApiContext {
  /** One or more app addresses (several: the connections are spread over them). */
  appUrls: string[];
  baselineUrl: string;
  cookie: string;
  seasonId: string;
  householdIds: string[];
  /** The co-op's today and a full past day, YYYY-MM-DD in its zone. */
  today: string;
  weekEnd: string;
  pastDay: string;
  /** Counts the co-op's lots (rows written by the POST benchmark), or null without the table. */
  countLots: () => Promise<number | null>;
  /** How many of these lot ids are in the database (each acknowledged write, once). */
  countLotsById: (ids: string[]) => Promise<number>;
  /** Removes the lots the POST benchmark wrote, so later rounds read the same data. */
  removeBenchLots: () => Promise<void>;
}

export interface RouteSpec {
  name: string;
  path: string;
  kind: 'baseline' | 'ceiling' | 'read' | 'write';
  connections: number;
  body?: () => string;
}

export const BENCH_NOTE = 'bench load';

export function apiRoutes(c: ApiContext): RouteSpec[] {
  let n = 0;
  return [
    { name: 'bare node:http JSON server', path: '', kind: 'baseline', connections: 50 },
    { name: 'constant-JSON route handler', path: '/api/bench/constant', kind: 'ceiling', connections: 50 },
    { name: 'GET /api/seasons', path: '/api/seasons', kind: 'read', connections: 50 },
    { name: 'GET /api/planning', path: '/api/planning', kind: 'read', connections: 50 },
    { name: 'GET /api/slots (one week)', path: `/api/slots?from=${c.today}&to=${c.weekEnd}`, kind: 'read', connections: 50 },
    { name: 'GET /api/queue', path: '/api/queue', kind: 'read', connections: 50 },
    { name: 'GET /api/deliveries (one day)', path: `/api/deliveries?from=${c.pastDay}&to=${c.pastDay}`, kind: 'read', connections: 50 },
    { name: 'GET /api/seasons/:id/ledger', path: `/api/seasons/${c.seasonId}/ledger`, kind: 'read', connections: 50 },
    { name: 'GET /api/seasons/:id/settlement', path: `/api/seasons/${c.seasonId}/settlement`, kind: 'read', connections: 50 },
    {
      name: 'POST /api/deliveries',
      path: '/api/deliveries',
      kind: 'write',
      connections: 20,
      body: () =>
        JSON.stringify({
          householdId: c.householdIds[n++ % c.householdIds.length],
          volumeL: 180 + (n % 7) * 20,
          brix: 2.2,
          sapTempC: 4,
          collectedOn: c.today,
          clarity: 'clear',
          contamination: 'none',
          decision: 'accept',
          note: BENCH_NOTE,
          idempotencyKey: randomUUID(),
        }),
    },
  ];
}

function target(spec: RouteSpec, c: ApiContext): LoadTarget {
  if (spec.kind === 'baseline') return { name: spec.name, url: c.baselineUrl };
  const urls = c.appUrls.map((u) => `${u}${spec.path}`);
  const origin = c.appUrls[0];
  return {
    name: spec.name,
    url: urls.length === 1 ? urls[0] : urls,
    method: spec.kind === 'write' ? 'POST' : 'GET',
    connections: spec.connections,
    headers: {
      accept: 'application/json',
      ...(spec.kind === 'ceiling' ? {} : { cookie: c.cookie }),
      ...(spec.kind === 'write' ? { 'content-type': 'application/json', origin } : {}),
    },
    body: spec.body,
  };
}

/** Whether a route is on this build: a missing route answers 404 (JSON from app/api/[...path], or HTML on an older build). */
export async function probe(spec: RouteSpec, c: ApiContext): Promise<{ available: boolean; status: number; note?: string }> {
  if (spec.kind === 'baseline') return { available: true, status: 200 };
  if (spec.kind === 'write') {
    // A write is probed with an empty body: a missing route answers 404 (or 405), a present one 4xx.
    const res = await fetch(`${c.appUrls[0]}${spec.path}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie: c.cookie, origin: c.appUrls[0] },
      body: '{}',
    });
    await res.arrayBuffer();
    const missing = res.status === 404 || res.status === 405;
    return { available: !missing, status: res.status, note: missing ? 'route not on this build yet' : undefined };
  }
  const res = await fetch(`${c.appUrls[0]}${spec.path}`, { headers: { cookie: c.cookie, accept: 'application/json' } });
  const type = res.headers.get('content-type') ?? '';
  await res.arrayBuffer();
  if (res.status === 404 && !type.includes('json')) return { available: false, status: 404, note: 'route not on this build yet' };
  if (res.status === 404 || res.status === 405) return { available: false, status: res.status, note: `answers ${res.status}` };
  return { available: true, status: res.status };
}

export interface ApiRun {
  spec: RouteSpec;
  runs: LoadRun[];
  /** For the write: rows written per run, to compare with the 2xx answers. */
  written: number[];
  /** For the write, per run: distinct lot ids the 2xx answers named, and how many of them are stored. */
  acknowledged?: { ids: number; stored: number }[];
}

/**
 * Measures every available route `rounds` times, interleaved: round 1 runs each once in order,
 * then round 2, and so on. A short warm-up first lets the JIT and Next's route loading settle.
 */
export async function runApi(
  specs: RouteSpec[],
  c: ApiContext,
  { rounds, durationS, log, warmup = true }: { rounds: number; durationS: number; log: (s: string) => void; warmup?: boolean },
): Promise<ApiRun[]> {
  const results: ApiRun[] = specs.map((spec) => ({ spec, runs: [], written: [] }));
  for (const r of warmup ? results : []) {
    await load({ ...target(r.spec, c), connections: Math.min(10, r.spec.connections) }, 2);
    if (r.spec.kind === 'write') await c.removeBenchLots();
  }
  for (let round = 1; round <= rounds; round++) {
    for (const r of results) {
      const before = r.spec.kind === 'write' ? await c.countLots() : null;
      const ids = new Set<string>();
      const run = await load({ ...target(r.spec, c), onAcknowledged: (id) => ids.add(id) }, durationS);
      r.runs.push(run);
      if (r.spec.kind === 'write') {
        // autocannon stops at the end of the run without waiting for the requests in flight;
        // the server still finishes those. Let them land before counting.
        await new Promise((resolve) => setTimeout(resolve, 2000));
        const after = await c.countLots();
        r.written.push(before === null || after === null ? NaN : after - before);
        (r.acknowledged ??= []).push({ ids: ids.size, stored: await c.countLotsById([...ids]) });
        await c.removeBenchLots();
      }
      log(`  round ${round}/${rounds} ${r.spec.name}: ${run.reqPerSec.toFixed(0)} req/s, p99 ${run.p99Ms} ms, ${run.non2xx} non-2xx, ${run.errors} errors`);
    }
  }
  return results;
}

/** Per-round ratios against the ceiling of the same round, then their median. */
function ratioSummary(runs: LoadRun[], ceiling: LoadRun[]) {
  return summarise(runs.map((run, i) => run.reqPerSec / ceiling[i].reqPerSec));
}

export function apiFigures(section: string, results: ApiRun[], unavailable: { spec: RouteSpec; note?: string }[]): Figure[] {
  const figures: Figure[] = [];
  const ceiling = results.find((r) => r.spec.kind === 'ceiling');
  const baseline = results.find((r) => r.spec.kind === 'baseline');
  for (const r of results) {
    const rps = summarise(r.runs.map((x) => x.reqPerSec));
    const p99 = summarise(r.runs.map((x) => x.p99Ms));
    const bad = r.runs.reduce((s, x) => s + x.non2xx + x.errors, 0);
    // A run in which no request completed has no latency to speak of: it fails every target.
    const stalled = r.runs.filter((x) => x.ok === 0).length;
    const codes = [...new Set(r.runs.flatMap((x) => Object.keys(x.statusCodes)))].join(', ');
    let ratio: number | null = null;
    let baselineName: string | null = null;
    let rateTarget: string | null = null;
    let rateMet: boolean | null = null;
    if (r.spec.kind === 'ceiling' && baseline) {
      ratio = ratioSummary(r.runs, baseline.runs).median;
      baselineName = baseline.spec.name;
    }
    if ((r.spec.kind === 'read' || r.spec.kind === 'write') && ceiling) {
      ratio = ratioSummary(r.runs, ceiling.runs).median;
      baselineName = ceiling.spec.name;
      if (r.spec.kind === 'read') {
        rateTarget = '≥ 0.5× ceiling';
        rateMet = Number.isFinite(ratio) && ratio >= 0.5 && bad === 0 && stalled === 0;
      }
    }
    figures.push({
      section,
      name: `${r.spec.name}: throughput (${r.spec.connections} connections)`,
      value: rps.median,
      unit: 'req/s',
      baseline: baselineName,
      ratio,
      target: rateTarget,
      met: rateMet,
      min: rps.min,
      max: rps.max,
      runs: rps.values,
      note:
        [bad ? `${bad} non-2xx answers or errors over the runs (status codes: ${codes})` : '', stalled ? `no request completed in ${stalled} of ${r.runs.length} runs` : '']
          .filter(Boolean)
          .join('; ') || undefined,
    });
    if (r.spec.kind === 'read' || r.spec.kind === 'write') {
      const limit = r.spec.kind === 'write' ? 250 : 200;
      figures.push({
        section,
        name: `${r.spec.name}: p99 latency`,
        value: p99.median,
        unit: 'ms',
        baseline: null,
        ratio: null,
        target: `≤ ${limit} ms`,
        met: stalled === 0 && p99.median <= limit,
        min: p99.min,
        max: p99.max,
        runs: p99.values,
      });
    }
    if (r.spec.kind === 'write') {
      const ok = r.runs.map((x) => x.ok);
      const ack = r.acknowledged ?? [];
      // Every 2xx answer names its own lot and that lot is stored; the only rows beyond them are
      // from requests still in flight when autocannon stopped (at most one per connection).
      const cutOff = r.written.map((w, i) => w - ok[i]);
      const match =
        ack.length === r.runs.length &&
        ack.every((a, i) => a.ids === ok[i] && a.stored === ok[i]) &&
        cutOff.every((n) => n >= 0 && n <= r.spec.connections);
      figures.push({
        section,
        name: `${r.spec.name}: rows written = 2xx answers`,
        value: r.written.reduce((s, w) => s + w, 0),
        unit: 'rows',
        baseline: `${ok.reduce((s, x) => s + x, 0)} 2xx answers`,
        ratio: null,
        target: 'every 2xx answer’s lot stored once; other rows only from requests cut off in flight',
        met: match && ok.every((x) => x > 0),
        note:
          `per run: rows ${r.written.join(' / ')}; 2xx ${ok.join(' / ')}; distinct lots named by the 2xx answers ${ack.map((a) => a.ids).join(' / ')}, ` +
          `of them stored ${ack.map((a) => a.stored).join(' / ')}; rows from requests cut off in flight when the run stopped ${cutOff.join(' / ')}`,
      });
    }
  }
  for (const u of unavailable) {
    figures.push({
      section,
      name: `${u.spec.name}: throughput (${u.spec.connections} connections)`,
      value: null,
      unit: 'req/s',
      baseline: null,
      ratio: null,
      target: u.spec.kind === 'read' ? '≥ 0.5× ceiling' : null,
      met: u.spec.kind === 'read' ? false : null,
      note: u.note,
    });
  }
  return figures;
}
