// Times the settlement again on the generated co-ops a full `npm run bench` left in its database
// (×10 and ×100, twice each, five changes each): the first answer after a change, without
// generating the co-ops again (×100 takes about 16 minutes). Run after `npm run bench`, with the
// environment scripts/bench.sh sets (DATABASE_URL of brixhouse_bench, NEXT_DIST_DIR=.next-bench,
// NODE_ENV=production, BENCH_ROUTES=1, its NEXTAUTH_SECRET and a mail server on SMTP_PORT):
//   node --import tsx bench/settlement-again.ts
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import { median } from './load';
import { signIn, startApp, stopAll, timedCaller } from './servers';

async function main() {
  const sql = getSequelize();
  const a = await startApp('bench-settlement-again', Number(process.env.BENCH_PORT ?? 3400));
  for (const scale of [10, 100, 10, 100]) {
    const [c] = await sql.query<{ id: string; season: string; h: string }>(
      `SELECT c.id, s.id AS season, (SELECT id FROM households WHERE cooperative_id = c.id ORDER BY name LIMIT 1) AS h
         FROM cooperatives c JOIN seasons s ON s.cooperative_id = c.id AND s.status = 'open' WHERE c.name = :n`,
      { replacements: { n: `Scale ×${scale} Cooperative` }, type: QueryTypes.SELECT },
    );
    const cookie = await signIn(a.url, `coordinator@scale-${scale}.example`, 'syrup-season');
    const call = async (method: string, p: string, body?: unknown) => (await timedCaller(a.url, cookie)(method, p, body)).ms;
    await call('GET', `/api/seasons/${c.season}/settlement`);
    const ms: number[] = [];
    for (let i = 0; i < 5; i++) {
      await call('PUT', `/api/seasons/${c.season}/fees`, { householdId: c.h, feeCents: 1000 + i });
      ms.push(await call('GET', `/api/seasons/${c.season}/settlement`));
    }
    console.log(`x${scale} settlement first after a change: ${ms.map((m) => m.toFixed(0)).join(' / ')} ms, median ${median(ms).toFixed(0)}`);
  }
  await stopAll();
  await sql.close();
}
main();
