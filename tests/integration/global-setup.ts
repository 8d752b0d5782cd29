import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { BASE_URL, TEST_DATABASE_URL } from '../test-env';

/** The test server answers its health check with `test: true`; any other server is not reused. */
async function health(): Promise<{ ok: boolean; test?: boolean } | null> {
  try {
    const res = await fetch(`${BASE_URL}/api/health`);
    return res.ok ? ((await res.json()) as { ok: boolean; test?: boolean }) : null;
  } catch {
    return null;
  }
}

let server: ChildProcess | undefined;

/**
 * Integration tests talk HTTP to the real server on the tests' port, over the tests' database.
 * `npm test` starts it; when it is not there (vitest run alone), start it here and stop it after.
 */
export async function setup() {
  const env = { ...process.env, DATABASE_URL: TEST_DATABASE_URL };
  execFileSync('bash', ['-c', 'bash scripts/db.sh start >/dev/null && node --import tsx db/cli.ts migrate --quiet >/dev/null'], { stdio: 'inherit', env });
  execFileSync('node', ['--import', 'tsx', 'db/cli.ts', 'seed', '--reset'], { stdio: 'inherit', env });
  const running = await health();
  if (running) {
    if (!running.test) throw new Error(`The server at ${BASE_URL} is not a test server (started without scripts/test-env.sh); stop it or set E2E_PORT.`);
    return;
  }
  server = spawn('bash', ['scripts/test-server.sh'], { stdio: 'inherit', detached: true, env });
  for (let i = 0; i < 600; i++) {
    if ((await health())?.ok) return;
    if (server.exitCode !== null) throw new Error('The test server stopped while starting (see above).');
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`The test server did not answer at ${BASE_URL}`);
}

export async function teardown() {
  if (server?.pid) process.kill(-server.pid, 'SIGTERM');
}
