import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { Client, signedIn } from './http';
import { closeTestDb, rows, testDb } from './db';
import { clearMail, waitForMail } from '../mailbox';

let coordinator: Client;
let member: Client;
let other: Client;
let otherCoopId: string;

const count = async (table: string) => Number((await rows<{ n: string }>(`SELECT count(*) AS n FROM ${table}`))[0].n);

beforeAll(async () => {
  coordinator = await signedIn('coordinator@larkspur.example');
  member = await signedIn('okafor@larkspur.example');
  // A second, invented cooperative on the same deployment, with its own coordinator.
  const hash = await bcrypt.hash('another-co-op', 4);
  const [[coop]] = (await testDb().query(
    `INSERT INTO cooperatives (name, time_zone, elevation_m, unit_system, currency)
     VALUES ('Birchwater Ridge Cooperative', 'America/Toronto', 250, 'metric', 'CAD') RETURNING id`,
  )) as [{ id: string }[], unknown];
  otherCoopId = coop.id;
  await testDb().query(
    `INSERT INTO households (cooperative_id, name) VALUES (:c, 'Aalto');
     INSERT INTO users (cooperative_id, name, email, password_hash, role)
     VALUES (:c, 'Pim Verhoeven', 'coordinator@birchwater.example', :h, 'coordinator')`,
    { replacements: { c: otherCoopId, h: hash } },
  );
  other = new Client();
  expect(await other.signIn('coordinator@birchwater.example', 'another-co-op')).toBe(true);
});

afterAll(closeTestDb);

describe('sign-in', () => {
  it('a wrong password gives no session', async () => {
    const c = new Client();
    expect(await c.signIn('coordinator@larkspur.example', 'maple-taffy')).toBe(false);
    expect((await c.get('/api/households')).status).toBe(401);
  });
});

describe('GET /api/households', () => {
  it('answers 401 signed out, with a message', async () => {
    const r = await new Client().get('/api/households');
    expect(r.status).toBe(401);
    expect(r.body.error.message).toMatch(/sign in/i);
  });

  it('answers 403 for a member', async () => {
    const r = await member.get('/api/households');
    expect(r.status).toBe(403);
    expect(r.body.error.message).toMatch(/coordinator/);
  });

  it('lists the seven demo households with their people for a coordinator', async () => {
    const r = await coordinator.get('/api/households');
    expect(r.status).toBe(200);
    const names = r.body.map((h: { name: string }) => h.name);
    for (const n of ['Okafor', 'Lindqvist', 'Tremblay-Haddad', 'Nakamura', 'Brennan', 'Szabo', 'Ferreira']) expect(names).toContain(n);
    const okafor = r.body.find((h: { name: string }) => h.name === 'Okafor');
    expect(okafor.people).toEqual([expect.objectContaining({ email: 'okafor@larkspur.example', role: 'member' })]);
    expect(typeof okafor.id).toBe('string');
  });
});

describe('POST /api/households and /api/people', () => {
  it('adds a household (201) for a coordinator, 403 for a member, 401 signed out', async () => {
    expect((await new Client().post('/api/households', { name: 'Marchand' })).status).toBe(401);
    expect((await member.post('/api/households', { name: 'Marchand' })).status).toBe(403);
    const r = await coordinator.post('/api/households', { name: 'Marchand' });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ name: 'Marchand', people: [] });
    const again = await coordinator.post('/api/households', { name: 'marchand' });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.name).toBeTruthy();
  });

  it('rejects invalid input with a message for each field and writes no row', async () => {
    const before = await count('users');
    const r = await coordinator.post('/api/people', { name: '', email: 'not-an-address', role: 'boss' });
    expect(r.status).toBe(422);
    expect(Object.keys(r.body.error.fields).sort()).toEqual(['email', 'name', 'role']);
    for (const msg of Object.values(r.body.error.fields)) expect(String(msg).length).toBeGreaterThan(5);
    const noHousehold = await coordinator.post('/api/people', { name: 'Ida Moss', email: 'ida@larkspur.example', role: 'member' });
    expect(noHousehold.status).toBe(422);
    expect(noHousehold.body.error.fields.householdId).toMatch(/household/);
    const notJson = await coordinator.request('POST', '/api/people', undefined, '{name: oops');
    expect(notJson.status).toBe(400);
    expect(await count('users')).toBe(before);
  });

  it('adds a person and the welcome e-mail reaches the mail server', async () => {
    await clearMail();
    const hh = (await coordinator.get('/api/households')).body.find((h: { name: string }) => h.name === 'Szabo');
    const r = await coordinator.post('/api/people', { name: 'Bence Szabo', email: 'Bence@Larkspur.example', role: 'member', householdId: hh.id });
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ email: 'bence@larkspur.example', role: 'member', householdId: hh.id, invited: true });
    const mail = await waitForMail({ to: 'bence@larkspur.example', subject: 'Welcome to Larkspur Hollow' });
    const token = mail.text.match(/\/welcome\/([A-Za-z0-9_-]{20,})/)![1];

    // The one-time link sets a password once; the person can then sign in.
    const anon = new Client();
    const short = await anon.post('/api/invitations/accept', { token, password: 'short' });
    expect(short.status).toBe(422);
    expect(short.body.error.fields.password).toMatch(/10 characters/);
    expect((await anon.post('/api/invitations/accept', { token, password: 'boiling-since-dawn' })).status).toBe(200);
    const reused = await anon.post('/api/invitations/accept', { token, password: 'another-password' });
    expect(reused.status).toBe(404);
    expect(reused.body.error.message).toMatch(/expired or was already used/);
    expect(await new Client().signIn('bence@larkspur.example', 'boiling-since-dawn')).toBe(true);
  });

  it('answers 409 with a clear message for a duplicate e-mail', async () => {
    const before = await count('users');
    const r = await coordinator.post('/api/people', { name: 'Someone Else', email: 'okafor@larkspur.example', role: 'sugarmaker' });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/okafor@larkspur\.example already has an account/);
    expect(r.body.error.fields.email).toBeTruthy();
    expect(await count('users')).toBe(before);
  });

  it('changes a role, and keeps the last coordinator', async () => {
    const staff = (await coordinator.get('/api/people')).body as { id: string; email: string }[];
    const sm2 = staff.find((p) => p.email === 'sugarmaker2@larkspur.example')!;
    const r = await coordinator.patch(`/api/people/${sm2.id}`, { role: 'coordinator' });
    expect(r.status).toBe(200);
    expect(r.body.role).toBe('coordinator');
    expect((await coordinator.patch(`/api/people/${sm2.id}`, { role: 'sugarmaker' })).status).toBe(200);

    const me = staff.find((p) => p.email === 'coordinator@larkspur.example')!;
    const last = await coordinator.patch(`/api/people/${me.id}`, { role: 'member' });
    expect([409, 422]).toContain(last.status);
    const lastStaff = await coordinator.patch(`/api/people/${me.id}`, { role: 'sugarmaker' });
    expect(lastStaff.status).toBe(409);
    expect(lastStaff.body.error.message).toMatch(/at least one coordinator/);
    expect((await member.patch(`/api/people/${sm2.id}`, { role: 'member' })).status).toBe(403);
  });
});

describe('one cooperative never reaches another', () => {
  it('lists only its own households', async () => {
    const r = await other.get('/api/households');
    expect(r.status).toBe(200);
    expect(r.body.map((h: { name: string }) => h.name)).toEqual(['Aalto']);
  });

  it('cannot change or attach to the other co-op’s people and households', async () => {
    const larkspur = (await coordinator.get('/api/households')).body as { id: string; people: { id: string }[] }[];
    const person = larkspur.find((h) => h.people.length)!.people[0];
    const change = await other.patch(`/api/people/${person.id}`, { role: 'coordinator' });
    expect(change.status).toBe(404);
    const attach = await other.post('/api/people', { name: 'Sly Fox', email: 'sly@birchwater.example', role: 'member', householdId: larkspur[0].id });
    expect(attach.status).toBe(422);
    expect(attach.body.error.fields.householdId).toBeTruthy();
    const [{ role }] = await rows<{ role: string }>('SELECT role FROM users WHERE id = :id', { id: person.id });
    expect(role).not.toBe('coordinator');
    expect(await rows('SELECT 1 FROM users WHERE email = :e', { e: 'sly@birchwater.example' })).toEqual([]);
    const seasons = await other.get('/api/seasons');
    expect(seasons.body).toEqual([]);
    expect(otherCoopId).toBeTruthy();
  });
});
