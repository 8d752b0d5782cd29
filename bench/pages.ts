// Pages: Lighthouse (mobile preset, Debian's chromium), median of interleaved runs per page.
import { execFile } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { median } from './load';
import type { Figure } from './report';
import { ROOT } from './servers';

const run = promisify(execFile);
const CHROME_FLAGS = '--headless=new --no-sandbox --disable-gpu --disable-background-networking --disable-component-update --disable-sync --no-first-run --disable-quic';

/** The framework's floor: a page with no content or client code of its own (BENCH_ROUTES=1 only). */
export const BASELINE_PAGE = { path: '/bench/blank', name: 'Framework page (no content of its own)', signedIn: false };

export const PAGES = [
  BASELINE_PAGE,
  { path: '/', name: 'Landing page', signedIn: false },
  { path: '/home', name: 'Today', signedIn: true },
  { path: '/calendar', name: 'Boil calendar', signedIn: true },
  { path: '/deliveries', name: 'Drop-off desk', signedIn: true },
  { path: '/queue', name: 'Boil queue', signedIn: true },
  { path: '/runs', name: 'Runs', signedIn: true },
  { path: '/ledger', name: 'Season ledger', signedIn: true },
];

interface Scores {
  performance: number;
  accessibility: number;
  cls: number;
  tbt: number;
  lcp: number;
}

async function lighthouse(url: string, cookie: string | null): Promise<Scores> {
  const out = path.join(ROOT, '.tmp', `lighthouse-${process.pid}.json`);
  rmSync(out, { force: true });
  const args = [
    path.join(ROOT, 'node_modules', 'lighthouse', 'cli', 'index.js'),
    url,
    '--output=json',
    `--output-path=${out}`,
    '--only-categories=performance,accessibility',
    `--chrome-flags=${CHROME_FLAGS}`,
    '--quiet',
    ...(cookie ? [`--extra-headers=${JSON.stringify({ Cookie: cookie })}`] : []),
  ];
  await run(process.execPath, args, { env: { ...process.env, CHROME_PATH: process.env.CHROME_PATH ?? '/usr/bin/chromium' }, timeout: 180_000, maxBuffer: 64 * 2 ** 20 });
  const lhr = JSON.parse(readFileSync(out, 'utf8'));
  if (lhr.runtimeError) throw new Error(lhr.runtimeError.message);
  return {
    performance: lhr.categories.performance.score,
    accessibility: lhr.categories.accessibility.score,
    cls: lhr.audits['cumulative-layout-shift'].numericValue,
    tbt: lhr.audits['total-blocking-time'].numericValue,
    lcp: lhr.audits['largest-contentful-paint'].numericValue,
  };
}

export async function pages(appUrl: string, cookie: string, { runs, log }: { runs: number; log: (s: string) => void }): Promise<Figure[]> {
  const figures: Figure[] = [];
  if (!existsSync(path.join(ROOT, 'node_modules', 'lighthouse', 'cli', 'index.js'))) {
    return [{ section: 'pages', name: 'Lighthouse', value: null, unit: '', baseline: null, ratio: null, target: null, met: false, note: 'lighthouse is not installed' }];
  }
  // A page that is not on this build yet answers 404: reported, not measured.
  const present = [];
  for (const p of PAGES) {
    const res = await fetch(`${appUrl}${p.path}`, { headers: p.signedIn ? { cookie } : {}, redirect: 'manual' });
    await res.arrayBuffer();
    if (res.status === 200) present.push(p);
    else {
      log(`  ${p.name} (${p.path}): not available (answer ${res.status})`);
      figures.push({ section: 'pages', name: `${p.name} (${p.path}): performance`, value: null, unit: '', baseline: null, ratio: null, target: '≥ 0.9', met: false, note: `answers ${res.status}` });
    }
  }
  const results = new Map<string, Scores[]>(present.map((p) => [p.path, []]));
  for (let round = 1; round <= runs; round++) {
    for (const p of present) {
      try {
        const s = await lighthouse(`${appUrl}${p.path}`, p.signedIn ? cookie : null);
        results.get(p.path)!.push(s);
        log(`  round ${round}/${runs} ${p.path}: performance ${s.performance}, accessibility ${s.accessibility}, CLS ${s.cls.toFixed(3)}, TBT ${s.tbt.toFixed(0)} ms`);
      } catch (err) {
        log(`  round ${round}/${runs} ${p.path}: lighthouse failed: ${(err as Error).message.slice(0, 200)}`);
      }
    }
  }
  let floor: { label: string; perf: number; tbt: number } | null = null;
  for (const p of present) {
    const rs = results.get(p.path)!;
    if (!rs.length) continue;
    const pick = (k: keyof Scores) => ({ value: median(rs.map((r) => r[k])), min: Math.min(...rs.map((r) => r[k])), max: Math.max(...rs.map((r) => r[k])), runs: rs.map((r) => r[k]) });
    const perf = pick('performance');
    const a11y = pick('accessibility');
    const cls = pick('cls');
    const tbt = pick('tbt');
    const lcp = pick('lcp');
    const label = `${p.name} (${p.path})`;
    if (p === BASELINE_PAGE) {
      floor = { label, perf: perf.value, tbt: tbt.value };
      figures.push(
        { section: 'pages', name: `${label}: performance`, unit: '', baseline: null, ratio: null, target: null, met: null, ...perf },
        { section: 'pages', name: `${label}: total blocking time`, unit: 'ms', baseline: null, ratio: null, target: null, met: null, ...tbt },
        { section: 'pages', name: `${label}: largest contentful paint`, unit: 'ms', baseline: null, ratio: null, target: null, met: null, ...lcp },
      );
      continue;
    }
    const against = (floorValue: number | undefined, value: number) =>
      floor ? { baseline: floor.label, ratio: floorValue ? value / floorValue : null } : { baseline: null, ratio: null };
    figures.push(
      { section: 'pages', name: `${label}: performance`, unit: '', target: '≥ 0.9', met: perf.value >= 0.9, ...against(floor?.perf, perf.value), ...perf },
      { section: 'pages', name: `${label}: accessibility`, unit: '', baseline: null, ratio: null, target: '≥ 0.95', met: a11y.value >= 0.95, ...a11y },
      { section: 'pages', name: `${label}: CLS`, unit: '', baseline: null, ratio: null, target: '≤ 0.1', met: cls.value <= 0.1, ...cls },
      { section: 'pages', name: `${label}: total blocking time`, unit: 'ms', target: null, met: null, ...against(floor?.tbt, tbt.value), ...tbt },
      { section: 'pages', name: `${label}: largest contentful paint`, unit: 'ms', baseline: null, ratio: null, target: null, met: null, ...lcp },
    );
  }
  return figures;
}
