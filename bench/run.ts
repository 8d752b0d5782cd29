// npm run bench: the benchmarks against the production build, into bench/RESULTS.md and results.json.
// scripts/bench.sh prepares the database, the mail server and the build, then runs this file.
import { parseArgs } from 'node:util';
import { DateTime } from 'luxon';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import { seedScale, SCALE_TIME_ZONE, type GeneratedCoop } from '@/db/seeds/scale';
import { apiFigures, apiRoutes, BENCH_NOTE, probe, runApi, type ApiContext, type RouteSpec } from './api';
import { summarise } from './load';
import { liveQueue } from './live';
import { pages } from './pages';
import { writeReport, type Report } from './report';
import { settlementAtScale } from './settlement';
import { signIn, startApp, startBaseline, stopAll, stopProcess } from './servers';

const ALL_SECTIONS = ['api', 'scaleout', 'live', 'settlement', 'pages', 'micro'] as const;

const { values: args } = parseArgs({
  options: {
    only: { type: 'string' },
    rounds: { type: 'string', default: '3' },
    duration: { type: 'string', default: '10' },
    scale: { type: 'string', default: '1' },
    'settlement-scales': { type: 'string', default: '10,100' },
    'lighthouse-runs': { type: 'string', default: '3' },
    // Diagnosis only: the live queue without the API load meanwhile (the figures then miss their premise).
    'live-load': { type: 'string', default: 'yes' },
  },
});
const sections = new Set(args.only ? args.only.split(',') : ALL_SECTIONS);
const rounds = Number(args.rounds);
const durationS = Number(args.duration);
const apiScale = Number(args.scale);
const port = Number(process.env.BENCH_PORT ?? 3400);
const log = (s: string) => console.log(s);

const sql = getSequelize();
async function rows<T extends object>(query: string, replacements: Record<string, unknown> = {}): Promise<T[]> {
  return sql.query<T>(query, { replacements, type: QueryTypes.SELECT });
}
async function hasTable(name: string) {
  const [r] = await rows<{ t: string | null }>('SELECT to_regclass(:name)::text AS t', { name });
  return r.t != null;
}

async function apiContext(seed: GeneratedCoop, appUrls: string[], baselineUrl: string, cookie: string): Promise<ApiContext> {
  const today = DateTime.now().setZone(SCALE_TIME_ZONE).startOf('day');
  const households = await rows<{ id: string }>('SELECT id FROM households WHERE cooperative_id = :id ORDER BY name', { id: seed.cooperativeId });
  const lots = await hasTable('sap_deliveries');
  return {
    appUrls,
    baselineUrl,
    cookie,
    seasonId: seed.openSeasonId,
    householdIds: households.map((h) => h.id),
    today: today.toISODate()!,
    weekEnd: today.plus({ days: 7 }).toISODate()!,
    pastDay: today.minus({ days: 2 }).toISODate()!,
    countLots: async () =>
      lots ? Number((await rows<{ n: string }>('SELECT count(*) AS n FROM sap_deliveries WHERE cooperative_id = :id', { id: seed.cooperativeId }))[0].n) : null,
    countLotsById: async (ids) =>
      ids.length
        ? Number((await rows<{ n: string }>('SELECT count(*) AS n FROM sap_deliveries WHERE cooperative_id = :c AND id IN (:ids)', { c: seed.cooperativeId, ids }))[0].n)
        : 0,
    removeBenchLots: async () => {
      if (!lots) return;
      // Straight to the database, so the co-op's change version is bumped here as the app's
      // writes bump it (answers kept per version must not outlive these rows).
      await sql.transaction(async (transaction) => {
        await sql.query('DELETE FROM sap_deliveries WHERE cooperative_id = :id AND note = :note', { replacements: { id: seed.cooperativeId, note: BENCH_NOTE }, transaction });
        await sql.query('UPDATE cooperatives SET change_version = change_version + 1 WHERE id = :id', { replacements: { id: seed.cooperativeId }, transaction });
      });
    },
  };
}

async function available(specs: RouteSpec[], c: ApiContext) {
  const ok: RouteSpec[] = [];
  const missing: { spec: RouteSpec; note?: string }[] = [];
  for (const spec of specs) {
    const p = await probe(spec, c);
    if (p.available) ok.push(spec);
    else {
      missing.push({ spec, note: p.note });
      log(`  ${spec.name}: not available (${p.note})`);
    }
  }
  return { ok, missing };
}

async function main() {
  const report: Report = {
    startedAt: new Date(),
    commands: [`npm run bench${process.argv.length > 2 ? ` -- ${process.argv.slice(2).join(' ')}` : ''}`],
    settings: {
      'API data': `generated co-op ×${apiScale} (db:seed -- --scale ${apiScale})`,
      'rounds per figure': rounds,
      'seconds per run': durationS,
      'load generator': 'autocannon 9.0.0 (in the bench process)',
      server: `node ${process.env.SERVER_NODE_ARGS ? process.env.SERVER_NODE_ARGS + ' ' : ''}--import tsx server.ts, NODE_ENV=production (next build)`,
    },
    figures: [],
    details: [],
  };
  try {
    log(`Generating the ×${apiScale} co-op`);
    const seed = await seedScale(sql, apiScale);
    report.settings['API data rows'] = Object.entries(seed.counts).map(([t, n]) => `${n} ${t}`).join(', ');

    const a = await startApp('bench-server-a', port);
    const baseline = await startBaseline(port + 2);
    const cookie = await signIn(a.url, seed.coordinatorEmail, seed.password);
    const ctx = await apiContext(seed, [a.url], baseline.url, cookie);
    const specs = apiRoutes(ctx);

    if (sections.has('api')) {
      log('API benchmark');
      const { ok, missing } = await available(specs, ctx);
      const results = await runApi(ok, ctx, { rounds, durationS, log });
      report.figures.push(...apiFigures('api', results, missing));
      report.commands.push(`autocannon -c 50 -d ${durationS} (-c 20 for the POST) against each route, ${rounds} interleaved rounds, signed in as ${seed.coordinatorEmail}`);
    }

    // A second process for the scale-out figures and the live queue across processes.
    const b = sections.has('scaleout') || sections.has('live') ? await startApp('bench-server-b', port + 1) : null;
    const both = b ? { ...ctx, appUrls: [a.url, b.url] } : ctx;
    if (b && sections.has('scaleout')) {
      log('Scale-out: one process against two');
      const reads = specs.filter((s) => s.kind === 'read' || s.kind === 'ceiling');
      const { ok, missing } = await available(reads, ctx);
      const single: Awaited<ReturnType<typeof runApi>> = ok.map((spec) => ({ spec, runs: [], written: [] }));
      const dual: typeof single = ok.map((spec) => ({ spec, runs: [], written: [] }));
      for (let round = 1; round <= rounds; round++) {
        for (let i = 0; i < ok.length; i++) {
          const warmup = round === 1;
          single[i].runs.push(...(await runApi([ok[i]], ctx, { rounds: 1, durationS, log, warmup }))[0].runs);
          dual[i].runs.push(...(await runApi([ok[i]], both, { rounds: 1, durationS, log, warmup }))[0].runs);
        }
      }
      for (let i = 0; i < ok.length; i++) {
        const ratios = summarise(dual[i].runs.map((d, j) => d.reqPerSec / single[i].runs[j].reqPerSec));
        const rps = summarise(dual[i].runs.map((d) => d.reqPerSec));
        const isRead = ok[i].kind === 'read';
        report.figures.push({
          section: 'scaleout',
          name: `${ok[i].name}: two processes`,
          value: rps.median,
          unit: 'req/s',
          baseline: `one process, ${summarise(single[i].runs.map((s) => s.reqPerSec)).median.toFixed(0)} req/s`,
          ratio: ratios.median,
          target: isRead ? '≥ 1.3× one process' : null,
          met: isRead ? ratios.median >= 1.3 : null,
          min: rps.min,
          max: rps.max,
          runs: rps.values,
        });
      }
      for (const m of missing) {
        report.figures.push({ section: 'scaleout', name: `${m.spec.name}: two processes`, value: null, unit: 'req/s', baseline: null, ratio: null, target: '≥ 1.3× one process', met: false, note: m.note });
      }
      report.commands.push('scale-out: autocannon with both server addresses (its connections spread evenly over the two processes), interleaved with the one-process run');
    }
    if (b && sections.has('live')) {
      log('Live queue across two processes');
      report.figures.push(...(await liveQueue(both, { counts: [500], durationS, rounds, log, withLoad: args['live-load'] !== 'no', label: ' on two processes' })));
    }
    if (b) await stopProcess(b.child);

    if (sections.has('live')) {
      log('Live queue');
      if ((await probe(specs.find((x) => x.name === 'GET /api/queue')!, ctx)).available) {
        try {
          report.figures.push(...(await liveQueue(ctx, { counts: [100, 500], durationS, rounds, log, withLoad: args['live-load'] !== 'no' })));
        } catch (err) {
          log(`  live queue: ${(err as Error).message}`);
          report.figures.push({ section: 'live', name: 'live queue', value: null, unit: 'ms', baseline: null, ratio: null, target: '100 % delivered', met: false, note: (err as Error).message });
        }
        report.commands.push(`live queue: viewers in a separate process (bench/viewers.ts), a drop-off posted every 200 ms for ${durationS} s while autocannon loads GET /api/slots`);
      } else {
        report.figures.push({ section: 'live', name: 'live queue', value: null, unit: 'ms', baseline: null, ratio: null, target: null, met: false, note: 'GET /api/queue not on this build yet' });
      }
    }

    if (sections.has('pages')) {
      log('Pages (Lighthouse, mobile)');
      const demoCookie = await signIn(a.url, 'coordinator@larkspur.example', seed.password);
      report.figures.push(...(await pages(a.url, demoCookie, { runs: Number(args['lighthouse-runs']), log })));
      report.commands.push(
        `CHROME_PATH=/usr/bin/chromium lighthouse URL --only-categories=performance,accessibility (mobile preset) --extra-headers '{"Cookie": …}', signed in as coordinator@larkspur.example, ${args['lighthouse-runs']} interleaved rounds`,
      );
    }

    if (sections.has('settlement')) {
      log('Settlement at scale');
      const scales = args['settlement-scales'].split(',').map(Number);
      report.figures.push(...(await settlementAtScale(sql, a.url, { scales, repeats: 3, log, report })));
      report.commands.push(
        `settlement: db:seed -- --scale ${scales.join(' and ')}, then 3 times each: PUT a season fee (a change) and GET the settlement and the ledger (the first answer after the change, then again), and 3 runs finished; medians`,
      );
    }
    await stopProcess(baseline.child);
    await stopProcess(a.child);
  } finally {
    writeReport(report);
    await stopAll();
    await sql.close();
  }
  const missed = report.figures.filter((f) => f.met === false);
  log(`\nWrote bench/RESULTS.md and bench/results.json: ${report.figures.length} figures, ${missed.length} below target.`);
}

// The servers run in process groups of their own: stop them when the bench is interrupted.
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => void stopAll().finally(() => process.exit(130)));
}

main().catch(async (err) => {
  console.error(err);
  await stopAll();
  process.exit(1);
});
