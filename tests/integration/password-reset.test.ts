import { afterAll, describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { DEMO_PASSWORD } from '../test-env';
import { Client, signedIn } from './http';
import { closeTestDb, rows, testDb } from './db';
import { clearMail, listMail, waitForMail } from '../mailbox';

// Other suites sign in as these demo people: give them back their demo password and name.
afterAll(async () => {
  await testDb().query(
    `UPDATE users SET password_hash = :h WHERE email IN ('lindqvist@larkspur.example', 'ferreira@larkspur.example');
     UPDATE users SET name = 'Adaeze Okafor' WHERE email = 'okafor@larkspur.example'`,
    { replacements: { h: await bcrypt.hash(DEMO_PASSWORD, 4) } },
  );
  await closeTestDb();
});

const linkIn = (text: string) => /\/reset-password\/([A-Za-z0-9_-]+)/.exec(text)?.[1];

describe('password reset', () => {
  it('answers the same for a known and an unknown address, and mails only the known one', async () => {
    await clearMail();
    const anon = new Client();
    const known = await anon.post('/api/password-resets', { email: 'Szabo@Larkspur.example' });
    const unknown = await anon.post('/api/password-resets', { email: 'nobody-here@larkspur.example' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    const mail = await waitForMail({ to: 'szabo@larkspur.example', subject: 'new Brixhouse password' });
    expect(linkIn(mail.text)).toBeTruthy();
    await new Promise((r) => setTimeout(r, 1_000));
    expect((await listMail()).some((m) => m.to.some((t) => t.address === 'nobody-here@larkspur.example'))).toBe(false);
  }, 90_000);

  it('refuses a malformed address with a field error', async () => {
    const res = await new Client().post('/api/password-resets', { email: 'not an address' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.email).toBeTruthy();
  }, 90_000);

  it('sets a new password once; the link is refused the second time; old password stops working', async () => {
    await clearMail();
    await new Client().post('/api/password-resets', { email: 'lindqvist@larkspur.example' });
    const token = linkIn((await waitForMail({ to: 'lindqvist@larkspur.example', subject: 'new Brixhouse password' })).text)!;
    const anon = new Client();

    const tooLong = await anon.post('/api/password-resets/accept', { token, password: '🍁'.repeat(19) });
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.error.fields.password).toMatch(/72 bytes/);

    const first = await anon.post('/api/password-resets/accept', { token, password: 'sweet-sap-rising' });
    expect(first.status).toBe(200);
    const second = await anon.post('/api/password-resets/accept', { token, password: 'another-new-one' });
    expect(second.status).toBe(404);
    expect(second.body.error.code).toBe('link_expired');

    expect(await new Client().signIn('lindqvist@larkspur.example')).toBe(false);
    expect(await new Client().signIn('lindqvist@larkspur.example', 'sweet-sap-rising')).toBe(true);
  }, 90_000);

  it('refuses an expired link', async () => {
    await clearMail();
    await new Client().post('/api/password-resets', { email: 'nakamura@larkspur.example' });
    const token = linkIn((await waitForMail({ to: 'nakamura@larkspur.example', subject: 'new Brixhouse password' })).text)!;
    await testDb().query(
      `UPDATE password_resets SET created_at = now() - interval '3 hours', expires_at = now() - interval '2 hours'
       WHERE user_id = (SELECT id FROM users WHERE email = 'nakamura@larkspur.example')`,
    );
    const res = await new Client().post('/api/password-resets/accept', { token, password: 'sweet-sap-rising' });
    expect(res.status).toBe(404);
    const [u] = await rows<{ ok: boolean }>(`SELECT password_hash IS NOT NULL AS ok FROM users WHERE email = 'nakamura@larkspur.example'`);
    expect(u.ok).toBe(true);
    expect(await new Client().signIn('nakamura@larkspur.example')).toBe(true);
  }, 90_000);
});

describe('the account', () => {
  it('changes the name', async () => {
    const c = await signedIn('okafor@larkspur.example');
    expect((await c.patch('/api/account', { name: '  ' })).status).toBe(422);
    const res = await c.patch('/api/account', { name: 'Adaeze N. Okafor' });
    expect(res.status).toBe(200);
    const [u] = await rows<{ name: string }>(`SELECT name FROM users WHERE email = 'okafor@larkspur.example'`);
    expect(u.name).toBe('Adaeze N. Okafor');
  }, 90_000);

  it('changes the password only with the current one', async () => {
    const c = await signedIn('ferreira@larkspur.example');
    const wrong = await c.post('/api/account/password', { currentPassword: 'maple-taffy', newPassword: 'boiling-over-now' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    const long = await c.post('/api/account/password', { currentPassword: 'syrup-season', newPassword: 'a'.repeat(73) });
    expect(long.status).toBe(422);
    expect(long.body.error.fields.newPassword).toMatch(/72 bytes/);
    const ok = await c.post('/api/account/password', { currentPassword: 'syrup-season', newPassword: 'boiling-over-now' });
    expect(ok.status).toBe(200);
    expect(await new Client().signIn('ferreira@larkspur.example')).toBe(false);
    expect(await new Client().signIn('ferreira@larkspur.example', 'boiling-over-now')).toBe(true);
  }, 90_000);
});
