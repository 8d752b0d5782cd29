import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { BASE_URL } from '../test-env';

async function healthy() {
  try {
    return (await fetch(`${BASE_URL}/api/health`)).ok;
  } catch {
    return false;
  }
}

let server: ChildProcess | undefined;

/**
 * Integration tests talk HTTP to the real server on the tests' port. `npm test` starts it;
 * when it is not there (vitest run alone), start it here and stop it afterwards.
 */
export async function setup() {
  execFileSync('node', ['--import', 'tsx', 'db/cli.ts', 'seed', '--reset'], { stdio: 'inherit', env: process.env });
  if (await healthy()) return;
  server = spawn('bash', ['scripts/test-server.sh'], { stdio: 'inherit', detached: true });
  for (let i = 0; i < 600; i++) {
    if (await healthy()) return;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`The test server did not answer at ${BASE_URL}`);
}

export async function teardown() {
  if (server?.pid) process.kill(-server.pid, 'SIGTERM');
}
