// The processes a benchmark talks to: server.ts in production mode, the bare baseline, sign-in.
import { spawn, type ChildProcess } from 'node:child_process';
import { openSync } from 'node:fs';
import path from 'node:path';

export const ROOT = path.resolve(import.meta.dirname, '..');
const children = new Set<ChildProcess>();

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Starts a process in its own group, its output in .data/<name>.log; stopped by stopAll(). */
export function startProcess(name: string, command: string, args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  const log = openSync(path.join(ROOT, '.data', `${name}.log`), 'w');
  const child = spawn(command, args, { cwd: ROOT, env, stdio: ['ignore', log, log], detached: true });
  children.add(child);
  child.on('exit', () => children.delete(child));
  return child;
}

export async function stopProcess(child: ChildProcess | undefined) {
  if (!child?.pid || child.exitCode !== null) return;
  const gone = new Promise((r) => child.once('exit', r));
  try {
    process.kill(-child.pid, 'SIGTERM');
  } catch {
    /* already gone */
  }
  await Promise.race([gone, sleep(5_000)]);
  if (child.exitCode === null) {
    try {
      process.kill(-child.pid, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }
}

export async function stopAll() {
  await Promise.all([...children].map((c) => stopProcess(c)));
}

export async function waitFor(url: string, timeoutMs = 90_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not up yet */
    }
    await sleep(250);
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}

/** server.ts in production mode on `port`, with the bench-only routes switched on. */
export async function startApp(name: string, port: number): Promise<{ child: ChildProcess; url: string }> {
  const url = `http://127.0.0.1:${port}`;
  // The same Node flags as npm start (scripts/lib.sh, which bench.sh sources).
  const nodeArgs = (process.env.SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const child = startProcess(name, process.execPath, [...nodeArgs, '--import', 'tsx', 'server.ts'], {
    ...process.env,
    NODE_ENV: 'production',
    PORT: String(port),
    BENCH_ROUTES: '1',
  });
  await waitFor(`${url}/api/health`);
  return { child, url };
}

export async function startBaseline(port: number) {
  const url = `http://127.0.0.1:${port}`;
  const child = startProcess('bench-baseline', process.execPath, ['bench/baseline-server.mjs', String(port)], process.env);
  await waitFor(url);
  return { child, url };
}

function cookiesOf(res: Response, jar: Map<string, string>) {
  for (const c of res.headers.getSetCookie()) {
    const [pair] = c.split(';');
    const i = pair.indexOf('=');
    jar.set(pair.slice(0, i), pair.slice(i + 1));
  }
}

/** Signs in through next-auth's credentials flow (csrf token, then the callback); the cookie header. */
export async function signIn(baseUrl: string, email: string, password: string): Promise<string> {
  const jar = new Map<string, string>();
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`);
  cookiesOf(csrf, jar);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: header(), origin: baseUrl },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
  });
  cookiesOf(res, jar);
  const session = [...jar.keys()].find((k) => k.endsWith('next-auth.session-token'));
  if (!session) throw new Error(`Could not sign in as ${email} (answer ${res.status})`);
  return `${session}=${jar.get(session)}`;
}

/** A signed-in caller of the app that times each request (the answer read whole, as a screen would). */
export function timedCaller(appUrl: string, cookie: string) {
  return async <T = unknown>(method: string, p: string, body?: unknown): Promise<{ ms: number; body: T }> => {
    const t = performance.now();
    const res = await fetch(`${appUrl}${p}`, {
      method,
      headers: { cookie, accept: 'application/json', ...(body ? { 'content-type': 'application/json', origin: appUrl } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    const text = await res.text();
    if (!res.ok) throw new Error(`${method} ${p}: ${res.status} ${text.slice(0, 200)}`);
    return { ms: performance.now() - t, body: JSON.parse(text) as T };
  };
}
