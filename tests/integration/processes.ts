import { spawn, type ChildProcess } from 'node:child_process';
import { openSync } from 'node:fs';
import { createServer } from 'node:net';

/** A port nobody listens on now, from the system. */
export const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const s = createServer().once('error', reject).listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls `check` until it is true, at most `timeoutMs`; throws `what` on time-out. */
export async function until(what: string, check: () => Promise<boolean>, timeoutMs = 30_000, everyMs = 250) {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if (await check().catch(() => false)) return;
    await sleep(everyMs);
  }
  throw new Error(`${what}: not within ${timeoutMs} ms`);
}

export interface ServerProcess {
  url: string;
  process: ChildProcess;
  stop(): void;
}

/**
 * Another real server.ts (the production build the tests use) on a free port, with `env` over
 * the tests' environment; its output goes to `.data/<name>.log`. Resolves once /api/health answers.
 */
export async function startServer(
  name: string,
  env: NodeJS.ProcessEnv,
  startTimeoutMs = 90_000,
  /** Whether the health answer means "up"; a test that stops the mail server accepts `database: 'up'` alone. */
  isUp: (health: { ok?: boolean; database?: string }) => boolean = (h) => h.ok === true,
): Promise<ServerProcess> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const log = openSync(`.data/${name}.log`, 'w');
  const child = spawn('node', ['--import', 'tsx', 'server.ts'], {
    env: { ...env, NODE_ENV: 'production', NEXT_DIST_DIR: env.NEXT_DIST_DIR ?? '.next-test', PORT: String(port), APP_URL: url, NEXTAUTH_URL: url },
    stdio: ['ignore', log, log],
  });
  try {
    await until(`${name} answering at ${url} (see .data/${name}.log)`, async () => child.exitCode === null && isUp(await (await fetch(`${url}/api/health`)).json()), startTimeoutMs);
  } catch (err) {
    // A server that did not come up in time is not left running after the test.
    child.kill('SIGKILL');
    throw err;
  }
  return { url, process: child, stop: () => void child.kill('SIGTERM') };
}
