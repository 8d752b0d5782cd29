import { execFile, execFileSync } from 'node:child_process';
import { mkdtempSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, Sequelize } from 'sequelize';
import pg from 'pg';
import { DEV_DATABASE_URL } from '../test-env';
import { closeTestDb, rows, testDb } from './db';
import { startServer, type ServerProcess } from './processes';

/**
 * `npm run test:integration` run on its own, from a developer's shell that even exports the
 * development database's address, while a server is serving that database: the run empties and
 * reloads the tests' database only, and the development rows are exactly as they were.
 */
const dev = new Sequelize(DEV_DATABASE_URL, { dialect: 'postgres', dialectModule: pg, logging: false });
type Env = NodeJS.ProcessEnv;
let devServer: ServerProcess;
let devUrl = '';

/** Every table of the development database: its row count and a digest of all its rows. */
async function snapshot() {
  const tables = await dev.query<{ name: string }>(
    // The adapter's attachment table is emptied by any running server on a timer; it holds no data.
    "SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'socket_io_attachments' ORDER BY 1",
    { type: QueryTypes.SELECT },
  );
  const out: Record<string, { n: number; digest: string }> = {};
  for (const { name } of tables) {
    const [r] = await dev.query<{ n: number; digest: string }>(
      `SELECT count(*)::int AS n, md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS digest FROM "${name}" t`,
      { type: QueryTypes.SELECT },
    );
    out[name] = r;
  }
  return out;
}

beforeAll(async () => {
  // The development database as `npm start` leaves it: migrated, with the demo co-op loaded.
  const devEnv: Env = { ...process.env, DATABASE_URL: DEV_DATABASE_URL };
  execFileSync('node', ['--import', 'tsx', 'db/cli.ts', 'migrate', '--quiet'], { env: devEnv, stdio: 'ignore' });
  execFileSync('node', ['--import', 'tsx', 'db/cli.ts', 'seed'], { env: devEnv, stdio: 'ignore' });
  // A server serving the development database, as `npm start` leaves one.
  const { BRIXHOUSE_TEST_SERVER: _, PORT: __, ...serverEnv } = devEnv;
  devServer = await startServer('dev-beside-tests', serverEnv);
  devUrl = devServer.url;
}, 90_000);

afterAll(async () => {
  devServer?.stop();
  await dev.close();
  await closeTestDb();
});

describe('a test run beside a development server', () => {
  it('empties and reloads the tests’ database and leaves every development row untouched', async () => {
    const before = await snapshot();
    expect(before.users.n).toBeGreaterThan(0);
    expect(before.households.n).toBeGreaterThan(0);
    const health = await (await fetch(`${devUrl}/api/health`)).json();
    expect(health.test).toBeUndefined();

    // A mark in the tests' database, which the run's set-up must empty.
    await testDb().query("INSERT INTO households (cooperative_id, name) SELECT id, 'Marked before the run' FROM cooperatives LIMIT 1");

    // A developer's shell: the development database's address exported, no test variables.
    const shell: Env = { ...process.env, DATABASE_URL: DEV_DATABASE_URL, PORT: new URL(devUrl).port };
    for (const k of ['BRIXHOUSE_TEST_SERVER', 'NODE_ENV', 'NEXT_DIST_DIR', 'NEXTAUTH_SECRET', 'APP_URL', 'NEXTAUTH_URL', 'VITEST', 'VITEST_POOL_ID', 'VITEST_WORKER_ID', 'VITEST_MODE', 'TEST']) delete shell[k];
    const run = await new Promise<{ code: number; output: string }>((resolve) => {
      execFile('npx', ['vitest', 'run', '--project', 'integration', 'tests/integration/settings.test.ts'], { env: shell, maxBuffer: 8 << 20 }, (err, stdout, stderr) =>
        resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, output: `${stdout}\n${stderr}` }),
      );
    });
    expect(run.code, run.output).toBe(0);

    expect(await rows("SELECT id FROM households WHERE name = 'Marked before the run'")).toEqual([]);
    expect(await snapshot()).toEqual(before);
    expect((await fetch(`${devUrl}/api/health`)).ok).toBe(true);
  }, 180_000);
});

describe('a production server', () => {
  /** Starts server.ts in production with `env` over a clean environment; resolves when it exits. */
  const start = (env: Record<string, string>) =>
    new Promise<{ code: number | null; out: string }>((resolve) => {
      const clean: Env = { ...process.env, NODE_ENV: 'production', PORT: '1' };
      for (const k of ['DATABASE_URL', 'NEXTAUTH_SECRET']) delete clean[k];
      execFile('node', ['--import', 'tsx', 'server.ts'], { env: { ...clean, ...env }, timeout: 90_000 }, (err, stdout, stderr) =>
        resolve({ code: err ? ((err as { code?: number }).code ?? null) : 0, out: `${stdout}${stderr}` }),
      );
    });
  const secret = 'x'.repeat(40);

  it('refuses to start without a session secret, with the development default, or without a database address', async () => {
    const [noSecret, devDefault, noDatabase] = await Promise.all([
      start({ DATABASE_URL: DEV_DATABASE_URL }),
      start({ DATABASE_URL: DEV_DATABASE_URL, NEXTAUTH_SECRET: 'brixhouse-local-development-secret' }),
      start({ NEXTAUTH_SECRET: secret }),
    ]);
    expect(noSecret.code).toBe(1);
    expect(noSecret.out).toMatch(/NEXTAUTH_SECRET: required in production/);
    expect(devDefault.code).toBe(1);
    expect(devDefault.out).toMatch(/development default cannot be used/);
    expect(noDatabase.code).toBe(1);
    expect(noDatabase.out).toMatch(/DATABASE_URL: required in production/);
  }, 120_000);

  it('gets a generated secret file that only its owner can read', () => {
    const file = join(mkdtempSync(join(process.env.TMPDIR ?? '/tmp', 'secret-')), 'nextauth-secret');
    const made = execFileSync('bash', ['-c', 'source scripts/lib.sh && secret_file "$1"', '_', file], { encoding: 'utf8' }).trim();
    expect(made).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    // A file left readable by an earlier version is tightened, and keeps its secret.
    writeFileSync(file, `${made}\n`, { mode: 0o644 });
    expect(execFileSync('bash', ['-c', 'source scripts/lib.sh && secret_file "$1"', '_', file], { encoding: 'utf8' }).trim()).toBe(made);
    expect(statSync(file).mode & 0o777).toBe(0o600);
  });
});
