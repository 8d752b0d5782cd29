import { afterAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD } from '../test-env';
import { closeTestDb, rows } from './db';
import { Client } from './http';

afterAll(closeTestDb);

/** One sign-in through next-auth's credentials callback, as the sign-in form sends it. */
async function attempt(email: string, password: string) {
  const csrf = await fetch(`${BASE_URL}/api/auth/csrf`);
  const cookie = csrf.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
  });
  const body = (await res.json()) as { url?: string; error?: { code: string; message: string } };
  return {
    status: res.status,
    retryAfter: res.headers.get('retry-after'),
    body,
    signedIn: res.headers.getSetCookie().some((c) => /next-auth\.session-token=[^;]+/.test(c)),
  };
}

describe('sign-in limits', () => {
  it('the 11th wrong password in the window answers 429 with Retry-After; other accounts still sign in; the right password works after the window', async () => {
    const victim = 'brennan@larkspur.example';
    // Ten wrong passwords, sent together so that they all fall inside the (short, in tests) window.
    const wrong = await Promise.all(Array.from({ length: 10 }, (_, i) => attempt(victim, `not-the-password-${i}`)));
    expect(wrong.map((r) => r.signedIn)).toEqual(Array(10).fill(false));
    expect(wrong.every((r) => r.status !== 429)).toBe(true);

    const eleventh = await attempt(victim, 'not-the-password-10');
    expect(eleventh.status).toBe(429);
    expect(eleventh.body.error?.code).toBe('too_many_attempts');
    const retryAfter = Number(eleventh.retryAfter);
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(Number(process.env.SIGN_IN_WINDOW_SECONDS ?? 60));

    // The right password is refused too while the account is locked: nothing is compared.
    const locked = await attempt(victim, DEMO_PASSWORD);
    expect(locked.status).toBe(429);
    expect(locked.signedIn).toBe(false);

    // Someone else at the same address signs in as usual.
    const neighbour = await attempt('sugarmaker2@larkspur.example', DEMO_PASSWORD);
    expect(neighbour.signedIn).toBe(true);

    await new Promise((r) => setTimeout(r, (Number(locked.retryAfter) + 0.5) * 1000));
    const after = await attempt(victim, DEMO_PASSWORD);
    expect(after.status).toBe(200);
    expect(after.signedIn).toBe(true);
  }, 120_000);

  it('a password longer than bcrypt reads (72 bytes) never signs in, even when its first 72 bytes match', async () => {
    const r = await attempt('tremblay-haddad@larkspur.example', DEMO_PASSWORD + 'x'.repeat(72));
    expect(r.signedIn).toBe(false);
  });

  it('the limits live in PostgreSQL', async () => {
    const keys = await rows<{ key: string }>(`SELECT key FROM rate_limits WHERE key LIKE 'signin-account:%'`);
    expect(keys.map((k) => k.key)).toContain('signin-account:brennan@larkspur.example');
  });
});

describe('invitation links', () => {
  it('a wrong link is refused with 404 before any password is hashed, and repeated wrong links are limited', async () => {
    const c = new Client();
    const statuses: number[] = [];
    const token = 'x'.repeat(43);
    for (let i = 0; i < 11; i++) statuses.push((await c.post('/api/invitations/accept', { token, password: 'a-good-long-password' })).status);
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(404));
    expect(statuses[10]).toBe(429);
  }, 60_000);

  it('refuses a new password over 72 bytes with a field error', async () => {
    const c = new Client();
    const res = await c.post('/api/invitations/accept', { token: 'y'.repeat(43), password: 'é'.repeat(37) });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.password).toMatch(/72 bytes/);
  });
});
