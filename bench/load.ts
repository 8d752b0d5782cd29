// autocannon runs and their statistics: every figure is the median of interleaved runs.
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
// autocannon ships no types; only the fields read here are declared.
const autocannon = require('autocannon') as (opts: Record<string, unknown>) => Promise<AutocannonResult>;

interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number; average: number; max: number };
  errors: number;
  timeouts: number;
  non2xx: number;
  '2xx': number;
  statusCodeStats?: Record<string, { count: number }>;
}

export interface LoadTarget {
  name: string;
  /** One address, or several to spread the connections over (several server processes). */
  url: string | string[];
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  /** A fresh body for every request (fresh idempotency keys). */
  body?: () => string;
  /** Called with the `id` of every 2xx answer's JSON body (the rows a write acknowledged). */
  onAcknowledged?: (id: string) => void;
  connections?: number;
}

export interface LoadRun {
  reqPerSec: number;
  p50Ms: number;
  p99Ms: number;
  ok: number;
  non2xx: number;
  errors: number;
  statusCodes: Record<string, number>;
}

/** One autocannon run of `durationS` seconds against a target. */
export async function load(target: LoadTarget, durationS: number): Promise<LoadRun> {
  const bodyFn = target.body;
  const r = await autocannon({
    url: target.url,
    connections: target.connections ?? 50,
    duration: durationS,
    method: target.method ?? 'GET',
    headers: target.headers ?? {},
    timeout: 10,
    ...(bodyFn
      ? {
          requests: [
            {
              method: target.method ?? 'POST',
              setupRequest: (req: Record<string, unknown>) => ({ ...req, body: bodyFn() }),
              onResponse: (status: number, body: string) => {
                if (status < 200 || status >= 300 || !target.onAcknowledged) return;
                const id = (JSON.parse(body) as { id?: unknown }).id;
                if (typeof id === 'string') target.onAcknowledged(id);
              },
            },
          ],
        }
      : {}),
  });
  const statusCodes: Record<string, number> = {};
  for (const [code, s] of Object.entries(r.statusCodeStats ?? {})) statusCodes[code] = s.count;
  return {
    reqPerSec: r.requests.average,
    p50Ms: r.latency.p50,
    p99Ms: r.latency.p99,
    ok: r['2xx'],
    non2xx: r.non2xx,
    errors: r.errors + r.timeouts,
    statusCodes,
  };
}

export const median = (xs: number[]) => {
  if (!xs.length) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

export interface Summary {
  median: number;
  min: number;
  max: number;
  values: number[];
}

export const summarise = (values: number[]): Summary => ({
  median: median(values),
  min: Math.min(...values),
  max: Math.max(...values),
  values,
});
