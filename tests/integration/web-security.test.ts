import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io as connect } from 'socket.io-client';
import { BASE_URL } from '../test-env';
import { Client, signedIn } from './http';
import { closeTestDb, rows } from './db';

let coordinator: Client;
const householdCount = async () => Number((await rows<{ n: string }>('SELECT count(*) AS n FROM households'))[0].n);

beforeAll(async () => {
  coordinator = await signedIn('coordinator@larkspur.example');
});
afterAll(closeTestDb);

/** A POST to a write route with the coordinator's cookie and whatever headers the case needs. */
function post(path: string, body: BodyInit, headers: Record<string, string>, init: RequestInit = {}) {
  return fetch(`${BASE_URL}${path}`, { method: 'POST', redirect: 'manual', headers: { cookie: coordinator.cookieHeader, ...headers }, body, ...init });
}

describe('cross-site writes', () => {
  it('a text/plain body (what a plain HTML form on another site can send) changes nothing: 415', async () => {
    const before = await householdCount();
    const res = await post('/api/households', JSON.stringify({ name: 'Plain Text Hollow' }), { 'content-type': 'text/plain' });
    expect(res.status).toBe(415);
    expect((await res.json()).error.code).toBe('unsupported_media_type');
    expect(await householdCount()).toBe(before);
  });

  it('a form-encoded body changes nothing either', async () => {
    const before = await householdCount();
    const res = await post('/api/households', 'name=Form+Hollow', { 'content-type': 'application/x-www-form-urlencoded' });
    expect(res.status).toBe(415);
    expect(await householdCount()).toBe(before);
  });

  it('a JSON write from another origin changes nothing: 403 with a code', async () => {
    const before = await householdCount();
    const res = await post('/api/households', JSON.stringify({ name: 'Elsewhere Hollow' }), {
      'content-type': 'application/json',
      origin: 'http://evil.example',
    });
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe('cross_origin');
    const fetchSite = await post('/api/households', JSON.stringify({ name: 'Elsewhere Hollow' }), {
      'content-type': 'application/json',
      'sec-fetch-site': 'cross-site',
    });
    expect(fetchSite.status).toBe(403);
    const nullOrigin = await post('/api/households', JSON.stringify({ name: 'Elsewhere Hollow' }), {
      'content-type': 'application/json',
      origin: 'null',
    });
    expect(nullOrigin.status).toBe(403);
    expect(await householdCount()).toBe(before);
  });

  it('the same write from the app’s own origin goes through', async () => {
    const res = await post('/api/households', JSON.stringify({ name: 'Own Origin Hollow' }), {
      'content-type': 'application/json',
      origin: BASE_URL,
      'sec-fetch-site': 'same-origin',
    });
    expect(res.status).toBe(201);
  });

  it('a sign-in posted from another origin is refused', async () => {
    const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'http://evil.example' },
      body: new URLSearchParams({ email: 'okafor@larkspur.example', password: 'syrup-season' }),
    });
    expect(res.status).toBe(403);
  });
});

describe('body size', () => {
  const big = JSON.stringify({ name: 'x'.repeat(2 * 1024 * 1024) });

  it('a 2 MB JSON body is refused with 413 and changes nothing', async () => {
    const before = await householdCount();
    const res = await post('/api/households', big, { 'content-type': 'application/json' });
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe('body_too_large');
    expect(await householdCount()).toBe(before);
  });

  it('the same body sent in chunks, with no Content-Length, is refused while it is read', async () => {
    const before = await householdCount();
    const bytes = new TextEncoder().encode(big);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < bytes.length; i += 64 * 1024) controller.enqueue(bytes.slice(i, i + 64 * 1024));
        controller.close();
      },
    });
    const res = await post('/api/households', stream, { 'content-type': 'application/json' }, { duplex: 'half' } as RequestInit);
    expect(res.status).toBe(413);
    expect(await householdCount()).toBe(before);
  });
});

describe('the sign-in form', () => {
  it('sent in chunks with no Content-Length is refused (411) before next-auth reads it', async () => {
    const body = new TextEncoder().encode(new URLSearchParams({ email: 'okafor@larkspur.example', password: 'x'.repeat(200_000) }).toString());
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < body.length; i += 16 * 1024) controller.enqueue(body.slice(i, i + 16 * 1024));
        controller.close();
      },
    });
    const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: BASE_URL },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(411);
    expect((await res.json()).error.code).toBe('length_required');
  });
});

describe('security headers', () => {
  const anonymousPages = ['/', '/sign-in', '/forgot-password', '/reset-password/not-a-real-token-0000000000', '/welcome/not-a-real-token-000000000', '/no-such-page'];
  const signedInPages = ['/home', '/calendar', '/households', '/settings', '/sugarhouse', '/account'];

  async function checkPage(path: string, cookie?: string) {
    const res = await fetch(`${BASE_URL}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
    const csp = res.headers.get('content-security-policy') ?? '';
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce, `${path} has a CSP nonce`).toBeTruthy();
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe('same-origin');
    const html = await res.text();
    // Every script the framework wrote into the page carries this request's nonce.
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length, `${path} has scripts`).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag, `${path}: ${tag}`).toContain(`nonce="${nonce}"`);
    return nonce!;
  }

  it.each(anonymousPages)('%s (signed out) answers with a nonce-based CSP, frame-ancestors none, nosniff and a referrer policy', async (path) => {
    await checkPage(path);
  }, 60_000);

  it.each(signedInPages)('%s (signed in) answers with the same headers', async (path) => {
    await checkPage(path, coordinator.cookieHeader);
  }, 60_000);

  it('the nonce is new on every request', async () => {
    const a = await checkPage('/sign-in');
    const b = await checkPage('/sign-in');
    expect(a).not.toBe(b);
  });

  it('API answers with personal data are never cached', async () => {
    for (const path of ['/api/households', '/api/slots?from=2020-01-01T00:00:00Z&to=2020-01-02T00:00:00Z', '/api/settings']) {
      const res = await fetch(`${BASE_URL}${path}`, { headers: { cookie: coordinator.cookieHeader } });
      expect(res.status, path).toBeLessThan(500);
      expect(res.headers.get('cache-control'), path).toContain('no-store');
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    }
  }, 120_000);

  it('every kind of API answer carries the same headers: refusals, errors, sign-in and health', async () => {
    const answers: [string, Response][] = [
      ['signed out (401)', await fetch(`${BASE_URL}/api/households`)],
      ['no such record (404)', await fetch(`${BASE_URL}/api/deliveries/00000000-0000-4000-8000-000000000000`, { headers: { cookie: coordinator.cookieHeader } })],
      ['no such API address (404)', await fetch(`${BASE_URL}/api/no-such-thing/here`, { headers: { cookie: coordinator.cookieHeader } })],
      ['cross-site write (403)', await post('/api/households', '{}', { 'content-type': 'application/json', origin: 'http://evil.example' })],
      ['wrong body type (415)', await post('/api/households', 'x', { 'content-type': 'text/plain' })],
      ['invalid body (422)', await post('/api/households', '{}', { 'content-type': 'application/json' })],
      ['next-auth (200)', await fetch(`${BASE_URL}/api/auth/csrf`)],
      ['health', await fetch(`${BASE_URL}/api/health`)],
    ];
    for (const [what, res] of answers) {
      expect(res.status, what).toBeLessThan(600);
      expect(res.headers.get('cache-control'), what).toContain('no-store');
      expect(res.headers.get('x-content-type-options'), what).toBe('nosniff');
      expect(res.headers.get('x-frame-options'), what).toBe('DENY');
      expect(res.headers.get('cross-origin-opener-policy'), what).toBe('same-origin');
      expect(res.headers.get('permissions-policy'), what).toContain('geolocation=()');
    }
    expect(answers.map(([, r]) => r.status)).toEqual([401, 404, 404, 403, 415, 422, 200, expect.any(Number)]);
    expect((await answers[2][1].json()).error.code).toBe('no_such_route');
  }, 60_000);
});

describe('the realtime endpoint', () => {
  it('refuses a socket opened from another origin, even with a valid session', async () => {
    const socket = connect(BASE_URL, {
      path: '/realtime',
      transports: ['polling'],
      extraHeaders: { cookie: coordinator.cookieHeader, origin: 'http://evil.example' },
      reconnection: false,
    });
    const outcome = await new Promise<string>((resolve) => {
      socket.once('connect', () => resolve('connected'));
      socket.once('connect_error', () => resolve('refused'));
    });
    socket.close();
    expect(outcome).toBe('refused');
  });

  it('accepts the same socket from the app’s own origin', async () => {
    const socket = connect(BASE_URL, {
      path: '/realtime',
      transports: ['polling'],
      extraHeaders: { cookie: coordinator.cookieHeader, origin: BASE_URL },
      reconnection: false,
    });
    const outcome = await new Promise<string>((resolve) => {
      socket.once('connect', () => resolve('connected'));
      socket.once('connect_error', (e) => resolve(`refused: ${e.message}`));
    });
    socket.close();
    expect(outcome).toBe('connected');
  });
});

describe('the sign-in redirect', () => {
  async function signInWith(callbackUrl: string) {
    const csrf = await fetch(`${BASE_URL}/api/auth/csrf`);
    const cookie = csrf.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie },
      body: new URLSearchParams({ csrfToken, email: 'nakamura@larkspur.example', password: 'syrup-season', callbackUrl, json: 'true' }),
    });
    return ((await res.json()) as { url: string }).url;
  }

  it.each(['/\\evil.example', '/\t/evil.example', '//evil.example', 'https://evil.example/home', '/%5Cevil.example'])(
    'keeps %j on this site',
    async (callbackUrl) => {
      const url = new URL(await signInWith(callbackUrl));
      expect(url.origin).toBe(BASE_URL);
      expect(url.pathname.startsWith('//')).toBe(false);
      expect(url.pathname).not.toContain('\\');
    },
  );

  it('follows a same-site path', async () => {
    expect(await signInWith('/calendar?view=week')).toBe(`${BASE_URL}/calendar?view=week`);
  });
});
