import { BASE_URL, DEMO_PASSWORD } from '../test-env';

/** A signed-in (or anonymous) HTTP client with its own cookie jar. */
export class Client {
  private readonly cookies = new Map<string, string>();

  /** `base`: another server than the test server (a second process in a test of its own). */
  constructor(private readonly base: string = BASE_URL) {}

  private store(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  }

  get cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read the JSON answers freely
  async request(method: string, path: string, body?: unknown, raw?: string): Promise<{ status: number; body: any }> {
    const res = await fetch(`${this.base}${path}`, {
      method,
      redirect: 'manual',
      headers: {
        accept: 'application/json',
        ...(body !== undefined || raw !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookies.size ? { cookie: this.cookieHeader } : {}),
      },
      body: raw ?? (body === undefined ? undefined : JSON.stringify(body)),
    });
    this.store(res);
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: parsed };
  }

  get = (path: string) => this.request('GET', path);
  post = (path: string, body?: unknown) => this.request('POST', path, body);
  patch = (path: string, body?: unknown) => this.request('PATCH', path, body);
  delete = (path: string) => this.request('DELETE', path);

  /** Signs in through next-auth's credentials callback, as the sign-in form does. */
  async signIn(email: string, password = DEMO_PASSWORD): Promise<boolean> {
    const csrf = await fetch(`${this.base}/api/auth/csrf`);
    this.store(csrf);
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const res = await fetch(`${this.base}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: this.cookieHeader },
      body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
    });
    this.store(res);
    return [...this.cookies.keys()].some((k) => k.endsWith('next-auth.session-token'));
  }
}

export async function signedIn(email: string, base: string = BASE_URL): Promise<Client> {
  const c = new Client(base);
  if (!(await c.signIn(email))) throw new Error(`Could not sign in as ${email}`);
  return c;
}
