// Settlement at scale: seasons of 20 households / 2,000 lots / 200 runs, ×10 and ×100; time of
// the settlement, the ledger and finishing one run, with the query plans of the slowest
// statements (auto_explain in the benchmark database logs every statement over 200 ms).
import { closeSync, openSync, readSync, statSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { seedScale } from '@/db/seeds/scale';
import { median } from './load';
import type { Figure, Report } from './report';
import { ROOT, signIn, timedCaller } from './servers';

const PG_LOG = path.join(ROOT, '.data', 'pg', 'server.log');

function logSize() {
  try {
    return statSync(PG_LOG).size;
  } catch {
    return 0;
  }
}

function logSince(offset: number): string {
  try {
    const size = statSync(PG_LOG).size;
    const fd = openSync(PG_LOG, 'r');
    const buf = Buffer.alloc(Math.min(size - offset, 4 * 2 ** 20));
    readSync(fd, buf, 0, buf.length, offset);
    closeSync(fd);
    return buf.toString('utf8');
  } catch {
    return '';
  }
}

/** The slowest plans auto_explain logged: `duration: N ms  plan:` blocks. */
function slowestPlans(text: string, n: number): { ms: number; plan: string }[] {
  const blocks = text.split(/\n(?=\d{4}-\d{2}-\d{2} [\d:.]+ \w+ \[\d+\] LOG:)/);
  return blocks
    .map((b) => ({ m: /LOG:\s+duration: ([\d.]+) ms\s+plan:/.exec(b), b }))
    .filter((x) => x.m)
    .map((x) => ({ ms: Number(x.m![1]), plan: x.b.slice(x.b.indexOf('plan:') + 5).trim() }))
    .sort((a, b) => b.ms - a.ms)
    .slice(0, n);
}

export async function settlementAtScale(
  sql: Sequelize,
  appUrl: string,
  { scales, repeats, log, report }: { scales: number[]; repeats: number; log: (s: string) => void; report: Report },
) {
  const times: Record<string, Record<number, number>> = { settlement: {}, ledger: {}, 'run split': {}, finish: {} };
  for (const scale of scales) {
    log(`  generating the ×${scale} co-op`);
    const started = Date.now();
    const seed = await seedScale(sql, scale);
    log(`  ×${scale}: ${Object.entries(seed.counts).map(([t, n]) => `${n} ${t}`).join(', ')} in ${((Date.now() - started) / 1000).toFixed(0)} s`);
    await sql.query('ANALYZE');
    const cookie = await signIn(appUrl, seed.coordinatorEmail, seed.password);
    const call = timedCaller(appUrl, cookie);
    const logFrom = logSize();
    // Answers are kept per change of the co-op: each timed GET follows a change (a season fee
    // set, as a coordinator would), so it is the first answer after a change, built afresh.
    const [firstHousehold] = await sql.query<{ id: string }>('SELECT id FROM households WHERE cooperative_id = :c ORDER BY name LIMIT 1', {
      replacements: { c: seed.cooperativeId },
      type: QueryTypes.SELECT,
    });
    let fee = 0;
    const change = () => call('PUT', `/api/seasons/${seed.openSeasonId}/fees`, { householdId: firstHousehold.id, feeCents: (fee += 100) });
    for (const [name, p] of [
      ['settlement', `/api/seasons/${seed.openSeasonId}/settlement`],
      ['ledger', `/api/seasons/${seed.openSeasonId}/ledger`],
    ] as const) {
      await call('GET', p);
      const ms: number[] = [];
      const kept: number[] = [];
      for (let i = 0; i < repeats; i++) {
        await change();
        ms.push((await call('GET', p)).ms);
        kept.push((await call('GET', p)).ms);
      }
      times[name][scale] = median(ms);
      times[`${name} (kept)`] ??= {};
      times[`${name} (kept)`][scale] = median(kept);
      log(`  ×${scale} ${name}: first after a change ${ms.map((m) => m.toFixed(0)).join(' / ')} ms, again ${kept.map((m) => m.toFixed(0)).join(' / ')} ms`);
    }
    // One finished run's split (the ledger's drill-down), after a change.
    const [finished] = await sql.query<{ id: string }>(
      "SELECT id FROM boil_runs WHERE cooperative_id = :c AND season_id = :s AND status = 'finished' ORDER BY started_at LIMIT 1",
      { replacements: { c: seed.cooperativeId, s: seed.openSeasonId }, type: QueryTypes.SELECT },
    );
    const splitMs: number[] = [];
    for (let i = 0; i < repeats; i++) {
      await change();
      splitMs.push((await call('GET', `/api/seasons/${seed.openSeasonId}/ledger/runs/${finished.id}`)).ms);
    }
    times['run split'][scale] = median(splitMs);
    log(`  ×${scale} run split: ${splitMs.map((m) => m.toFixed(0)).join(' / ')} ms`);
    // Finishing a run: start one on an idle evaporator, take three waiting lots, draw, fuel, finish.
    const evaporators = await sql.query<{ id: string }>('SELECT id FROM evaporators WHERE cooperative_id = :c ORDER BY name LIMIT :n', {
      replacements: { c: seed.cooperativeId, n: repeats },
      type: QueryTypes.SELECT,
    });
    const finishMs: number[] = [];
    for (const e of evaporators) {
      const lots = await sql.query<{ id: string }>(
        "SELECT id FROM sap_deliveries WHERE cooperative_id = :c AND status = 'accepted' AND litres_boiled < volume_l ORDER BY received_at LIMIT 3",
        { replacements: { c: seed.cooperativeId }, type: QueryTypes.SELECT },
      );
      const run = (await call<{ id: string }>('POST', '/api/runs', { evaporatorId: e.id, slotId: null })).body;
      await call('POST', `/api/runs/${run.id}/inputs`, { inputs: lots.map((l) => ({ deliveryId: l.id })) });
      await call('POST', `/api/runs/${run.id}/draws`, { litres: 20, brix: 66.9, transmittancePct: 55 });
      await call('POST', `/api/runs/${run.id}/fuel`, { quantity: 12 });
      finishMs.push((await call('POST', `/api/runs/${run.id}/finish`, {})).ms);
    }
    times.finish[scale] = median(finishMs);
    log(`  ×${scale} finish: ${finishMs.map((m) => m.toFixed(0)).join(' / ')} ms`);
    const plans = slowestPlans(logSince(logFrom), 2);
    if (plans.length) {
      report.details.push({
        section: 'settlement',
        title: `Slowest statements at ×${scale} (auto_explain, over 200 ms)`,
        body: plans.map((p) => `${p.ms.toFixed(0)} ms:\n\n\`\`\`\n${p.plan.slice(0, 4000)}\n\`\`\``).join('\n\n'),
      });
    }
  }
  const figures: Figure[] = [];
  const [small, large] = scales;
  for (const name of ['settlement', 'ledger', 'run split', 'finish', 'settlement (kept)', 'ledger (kept)'] as const) {
    const what =
      name === 'finish'
        ? 'POST /api/runs/:id/finish'
        : name === 'run split'
          ? "GET /api/seasons/:id/ledger/runs/:runId (one run's split, after a change)"
          : name.endsWith('(kept)')
          ? `GET /api/seasons/:id/${name.split(' ')[0]} again, unchanged (the kept answer)`
          : `GET /api/seasons/:id/${name} (first answer after a change)`;
    const a = times[name][small];
    const b = times[name][large];
    figures.push({
      section: 'settlement',
      name: `${what} at ×${small}`,
      value: a,
      unit: 'ms',
      baseline: null,
      ratio: null,
      target: name === 'settlement' ? '≤ 1000 ms' : null,
      met: name === 'settlement' ? a <= 1000 : null,
    });
    if (b !== undefined) {
      figures.push({
        section: 'settlement',
        name: `${what} at ×${large}`,
        value: b,
        unit: 'ms',
        baseline: `×${small}`,
        ratio: b / a,
        target: name === 'settlement' ? `≤ 12× the ×${small} time` : null,
        met: name === 'settlement' ? b / a <= 12 : null,
      });
    }
  }
  return figures;
}
