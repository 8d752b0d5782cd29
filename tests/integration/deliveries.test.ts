import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { Client, signedIn } from './http';
import { closeTestDb, larkspurHouseholds, rows, testDb } from './db';
import { clearMail, listMail, waitForMail } from '../mailbox';
import { showBrix, showTemperature, showVolume } from '@/lib/figures';
import { BASE_URL } from '../test-env';
import { sugarKg } from '@/lib/sugar';
import { toDeliveryInput, type DeliveryFormValues } from '@/lib/deliveries/form';

const ZONE = 'America/New_York';
let sugarmaker: Client;
let coordinator: Client;
let okafor: Client;
let lindqvist: Client;
let households: Record<string, string>;
let otherCoop: { cooperativeId: string; householdId: string };

const today = () => DateTime.now().setZone(ZONE).toISODate()!;
const key = () => `test-${randomUUID()}`;
const lotCount = async () => Number((await rows<{ n: string }>('SELECT count(*) AS n FROM sap_deliveries'))[0].n);

function lot(overrides: Record<string, unknown> = {}) {
  return {
    householdId: households.Okafor,
    volumeL: 212.4,
    brix: 2.6,
    sapTempC: 3.1,
    collectedOn: today(),
    clarity: 'clear',
    contamination: 'none',
    idempotencyKey: key(),
    ...overrides,
  };
}

/** A tiny valid PNG (1×1 pixel). */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==',
  'base64',
);

async function upload(client: Client, bytes: Uint8Array, name: string, type: string) {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
  const res = await fetch(`${BASE_URL}/api/uploads`, { method: 'POST', headers: { cookie: client.cookieHeader }, body: form });
  return { status: res.status, body: await res.json().catch(() => null) };
}

beforeAll(async () => {
  sugarmaker = await signedIn('sugarmaker@larkspur.example');
  coordinator = await signedIn('coordinator@larkspur.example');
  okafor = await signedIn('okafor@larkspur.example');
  lindqvist = await signedIn('lindqvist@larkspur.example');
  households = await larkspurHouseholds();
  // A second cooperative, to check that nothing crosses between co-ops.
  const [coop] = await rows<{ id: string }>(
    "INSERT INTO cooperatives (name, time_zone, elevation_m, unit_system, currency) VALUES ('Brindle Creek Sap Co-op', 'America/Toronto', 200, 'metric', 'CAD') RETURNING id",
  );
  const [h] = await rows<{ id: string }>("INSERT INTO households (cooperative_id, name) VALUES (:c, 'Quenneville') RETURNING id", { c: coop.id });
  otherCoop = { cooperativeId: coop.id, householdId: h.id };
});

afterAll(async () => {
  await testDb().query('DELETE FROM households WHERE cooperative_id = :c', { replacements: { c: otherCoop.cooperativeId } });
  await testDb().query('DELETE FROM cooperatives WHERE id = :c', { replacements: { c: otherCoop.cooperativeId } });
  await closeTestDb();
});

describe('logging a drop-off', () => {
  it('answers 201 with sugarKg equal to lib/sugar’s figure for the stored volume and °Brix', async () => {
    const res = await sugarmaker.post('/api/deliveries', lot({ volumeL: 212.4, brix: 2.64 }));
    expect(res.status).toBe(201);
    expect(res.body.brix).toBe(2.6); // the refractometer's 0.1 °Bx
    expect(res.body.status).toBe('accepted');
    expect(res.body.recommendation).toBe('accept');
    // 212.4 L × ρ(2.6 °Bx) × 2.6 % — the density table's sugar, not a hard-coded figure.
    expect(res.body.sugarKg).toBeCloseTo(sugarKg(212.4, 2.6), 9);
    const [row] = await rows<{ volume_l: number; brix: string }>('SELECT volume_l, brix FROM sap_deliveries WHERE id = :id', { id: res.body.id });
    expect(row.volume_l).toBe(212.4);
    expect(Number(row.brix)).toBe(2.6);
    const read = await sugarmaker.get(`/api/deliveries/${res.body.id}`);
    expect(read.status).toBe(200);
    expect(read.body.sugarKg).toBeCloseTo(sugarKg(212.4, 2.6), 9);
    expect(read.body.receivedAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}[-+]\d{2}:\d{2}$/);
    expect(Math.abs(Date.parse(read.body.receivedAt) - Date.now())).toBeLessThan(60_000);
  });

  it('answers a new lot, accepted or rejected, exactly as reading it back does', async () => {
    // Accepted lots are written in one statement, rejected ones (with their e-mail) in a transaction.
    await clearMail();
    const accepted = await sugarmaker.post('/api/deliveries', lot({ volumeL: 180.25, brix: 2.3, note: '  east ridge  ', mix: { sugarMaple: 70, redMaple: 25, other: 5 } }));
    // The rejected lot carries a photo: looked up once, it is still on the lot written the long way.
    const photo = await upload(sugarmaker, PNG, 'sour.png', 'image/png');
    expect(photo.status).toBe(201);
    const rejected = await sugarmaker.post('/api/deliveries', lot({ clarity: 'cloudy', decision: 'reject', reason: 'Sour smell', photoKey: photo.body.photoKey }));
    expect([accepted.status, rejected.status]).toEqual([201, 201]);
    expect([accepted.body.status, rejected.body.status]).toEqual(['accepted', 'rejected']);
    for (const made of [accepted, rejected]) {
      const read = await sugarmaker.get(`/api/deliveries/${made.body.id}`);
      const { deadline: _deadline, revisions, ...lotRead } = read.body;
      expect(made.body).toEqual({ ...lotRead, revisions: revisions.length });
    }
    expect(accepted.body).toMatchObject({ note: 'east ridge', mix: { sugarMaple: 70, redMaple: 25, other: 5 }, litresBoiled: 0, revisions: 0 });
    expect(rejected.body.photoKey).toBe(photo.body.photoKey);
    // A photo key that names no stored photo is refused on a rejected lot too, and nothing is written.
    const missing = lot({ clarity: 'cloudy', decision: 'reject', reason: 'Sour smell', photoKey: photo.body.photoKey.replace(/[^/]+$/, 'zzzzzzzzzzzzzzzzzzzzzzzzzzzzzzzz.png') });
    const refused = await sugarmaker.post('/api/deliveries', missing);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatchObject({ code: 'photo_not_found', fields: { photoKey: expect.any(String) } });
    expect(await rows('SELECT id FROM sap_deliveries WHERE idempotency_key = :k', { k: missing.idempotencyKey })).toHaveLength(0);
    // The rejected lot's e-mail went out with it (and is in before a later test clears the mailbox).
    for (const p of await rows<{ email: string }>('SELECT email FROM users WHERE household_id = :h', { h: households.Okafor })) {
      expect((await waitForMail({ to: p.email, subject: 'Sap drop-off not accepted' })).text).toContain('Sour smell');
    }
  });

  it('stores a US co-op’s 10 gal, typed on the form, as 37.854 L', async () => {
    const form: DeliveryFormValues = {
      householdId: households.Brennan,
      volume: '10',
      brix: '2.1',
      sapTemp: '38',
      collectedOn: today(),
      clarity: 'clear',
      contamination: 'none',
      decision: '',
      reason: '',
      note: '',
      photoKey: '',
      mixOn: false,
      sugarMaple: '',
      redMaple: '',
      other: '',
    };
    const res = await sugarmaker.post('/api/deliveries', toDeliveryInput(form, 'us', key()));
    expect(res.status).toBe(201);
    const [row] = await rows<{ volume_l: number; sap_temp_c: number }>('SELECT volume_l, sap_temp_c FROM sap_deliveries WHERE id = :id', { id: res.body.id });
    // 1 US gallon = 3.785411784 L exactly (NIST Handbook 44); stored to the millilitre.
    expect(row.volume_l).toBe(37.854);
    // 38 °F = 3.33 °C (°C = (°F − 32) × 5/9).
    expect(row.sap_temp_c).toBeCloseTo(3.333, 3);
  });

  it('makes one lot for a key posted twice, and for the same key posted concurrently', async () => {
    const body = lot();
    const first = await sugarmaker.post('/api/deliveries', body);
    const again = await sugarmaker.post('/api/deliveries', body);
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    expect(await rows('SELECT id FROM sap_deliveries WHERE idempotency_key = :k', { k: body.idempotencyKey })).toHaveLength(1);

    const racing = lot();
    const answers = await Promise.all(Array.from({ length: 6 }, () => sugarmaker.post('/api/deliveries', racing)));
    expect(answers.map((a) => a.status).filter((s) => s === 201)).toHaveLength(1);
    expect(answers.every((a) => a.status === 200 || a.status === 201)).toBe(true);
    const ids = new Set(answers.map((a) => a.body.id));
    expect(ids.size).toBe(1);
    const stored = await rows<{ id: string }>('SELECT id FROM sap_deliveries WHERE idempotency_key = :k', { k: racing.idempotencyKey });
    expect(stored).toHaveLength(1);
    expect(ids.has(stored[0].id)).toBe(true);
  });

  const invalid: [string, Record<string, unknown>, string][] = [
    ['a negative volume', { volumeL: -5 }, 'volumeL'],
    ['°Brix 90', { brix: 90 }, 'brix'],
    ['a collection day in the future', { collectedOn: DateTime.now().setZone(ZONE).plus({ days: 2 }).toISODate() }, 'collectedOn'],
    ['an unknown household', { householdId: randomUUID() }, 'householdId'],
  ];
  for (const [what, change, field] of invalid) {
    it(`refuses ${what} with 400/422 naming ${field}, and writes no row`, async () => {
      const before = await lotCount();
      const res = await sugarmaker.post('/api/deliveries', lot(change));
      expect([400, 422]).toContain(res.status);
      expect(res.body.error.fields[field]).toBeTruthy();
      expect(res.body.error.code).toBeTruthy();
      expect(await lotCount()).toBe(before);
    });
  }

  it('refuses a household of another cooperative, naming householdId, and writes no row', async () => {
    const before = await lotCount();
    const res = await sugarmaker.post('/api/deliveries', lot({ householdId: otherCoop.householdId }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.householdId).toMatch(/household/);
    expect(await lotCount()).toBe(before);
  });

  it('refuses a member with 403 and writes no row', async () => {
    const before = await lotCount();
    const res = await okafor.post('/api/deliveries', lot());
    expect(res.status).toBe(403);
    expect(await lotCount()).toBe(before);
  });

  it('needs a reason to accept against the recommendation', async () => {
    const res = await sugarmaker.post('/api/deliveries', lot({ clarity: 'cloudy', decision: 'accept' }));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.reason).toBeTruthy();
    const ok = await sugarmaker.post('/api/deliveries', lot({ clarity: 'cloudy', decision: 'accept', reason: 'Only a haze from the cold; smells and tastes sweet.' }));
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ recommendation: 'reject', status: 'accepted', reason: 'Only a haze from the cold; smells and tastes sweet.' });
  });
});

describe('reading drop-offs', () => {
  it('shows a member its own household’s lots only, and 404 for another household’s lot', async () => {
    const mine = await okafor.get('/api/deliveries');
    expect(mine.status).toBe(200);
    expect(mine.body.length).toBeGreaterThan(0);
    expect(mine.body.every((l: { householdId: string }) => l.householdId === households.Okafor)).toBe(true);
    // Asking for another household still answers its own.
    const asked = await okafor.get(`/api/deliveries?householdId=${households.Lindqvist}`);
    expect(asked.body.every((l: { householdId: string }) => l.householdId === households.Okafor)).toBe(true);

    const [theirs] = await rows<{ id: string }>('SELECT id FROM sap_deliveries WHERE household_id = :h LIMIT 1', { h: households.Lindqvist });
    expect((await okafor.get(`/api/deliveries/${theirs.id}`)).status).toBe(404);
    expect((await lindqvist.get(`/api/deliveries/${theirs.id}`)).status).toBe(200);
  });

  it('filters by household, status and day in the co-op’s calendar', async () => {
    const day = today();
    const all = await coordinator.get(`/api/deliveries?from=${day}&to=${day}`);
    expect(all.status).toBe(200);
    for (const l of all.body) expect(DateTime.fromISO(l.receivedAt, { zone: ZONE }).toISODate()).toBe(day);
    const expected = await rows<{ n: string }>(
      // Only Larkspur's lots: other suites' test co-ops share the database.
      `SELECT count(*) AS n FROM sap_deliveries
        WHERE cooperative_id = (SELECT cooperative_id FROM households WHERE id = :h)
          AND (received_at AT TIME ZONE 'America/New_York')::date = :day`,
      { day, h: households['Tremblay-Haddad'] },
    );
    expect(all.body).toHaveLength(Number(expected[0].n));
    const rejected = await coordinator.get(`/api/deliveries?status=rejected&householdId=${households['Tremblay-Haddad']}`);
    expect(rejected.body.length).toBeGreaterThan(0);
    for (const l of rejected.body) expect(l).toMatchObject({ status: 'rejected', householdId: households['Tremblay-Haddad'] });
    expect((await coordinator.get('/api/deliveries?status=maybe')).status).toBe(422);
  });
});

describe('lists kept per change of the co-op', () => {
  it('show a new lot, a correction and a renamed sugarmaker at once, to staff and members alike', async () => {
    const day = today();
    const url = `/api/deliveries?from=${day}&to=${day}`;
    type Listed = { id: string; volumeL: number; loggedByName: string | null };
    const find = async (who: Client, id: string) => ((await who.get(url)).body as Listed[]).find((l) => l.id === id);
    const before = (await coordinator.get(url)).body as Listed[];
    await okafor.get(url);

    const created = await sugarmaker.post('/api/deliveries', lot({ volumeL: 120, brix: 2.2 }));
    expect(created.status).toBe(201);
    expect(((await coordinator.get(url)).body as Listed[]).length).toBe(before.length + 1);
    expect(await find(okafor, created.body.id)).toMatchObject({ volumeL: 120 });
    const name = (await find(coordinator, created.body.id))!.loggedByName!;

    expect((await coordinator.patch(`/api/deliveries/${created.body.id}`, { volumeL: 130, reason: 'Meter read again.' })).status).toBe(200);
    expect(await find(coordinator, created.body.id)).toMatchObject({ volumeL: 130 });
    expect(await find(okafor, created.body.id)).toMatchObject({ volumeL: 130 });

    try {
      expect((await sugarmaker.patch('/api/account', { name: 'Sugarmaker Renamed' })).status).toBe(200);
      expect(await find(coordinator, created.body.id)).toMatchObject({ loggedByName: 'Sugarmaker Renamed' });
    } finally {
      await sugarmaker.patch('/api/account', { name });
    }
    expect(await find(coordinator, created.body.id)).toMatchObject({ loggedByName: name });
  });
});

describe('correcting a drop-off', () => {
  it('writes exactly one revision with the fields before and after, and the sugar follows', async () => {
    const created = await sugarmaker.post('/api/deliveries', lot({ volumeL: 150, brix: 2.0 }));
    const res = await coordinator.patch(`/api/deliveries/${created.body.id}`, { volumeL: 165, brix: 2.3, reason: 'Meter read again: 165 L.' });
    expect(res.status).toBe(200);
    expect(res.body.sugarKg).toBeCloseTo(sugarKg(165, 2.3), 9);
    const revs = await rows<{ before: unknown; after: unknown; reason: string }>('SELECT before, after, reason FROM delivery_revisions WHERE delivery_id = :id', {
      id: created.body.id,
    });
    expect(revs).toHaveLength(1);
    expect(revs[0]).toEqual({ before: { volumeL: 150, brix: 2 }, after: { volumeL: 165, brix: 2.3 }, reason: 'Meter read again: 165 L.' });
    expect(res.body.revisions).toHaveLength(1);
    const listed = (await coordinator.get(`/api/deliveries?householdId=${households.Okafor}`)).body.find((l: { id: string }) => l.id === created.body.id);
    expect(listed.sugarKg).toBeCloseTo(sugarKg(165, 2.3), 9);
  });

  it('needs a reason, refuses members, and writes nothing when refused', async () => {
    const created = await sugarmaker.post('/api/deliveries', lot());
    expect((await coordinator.patch(`/api/deliveries/${created.body.id}`, { volumeL: 99 })).status).toBe(422);
    expect((await okafor.patch(`/api/deliveries/${created.body.id}`, { volumeL: 99, reason: 'mine' })).status).toBe(403);
    expect((await coordinator.patch(`/api/deliveries/${created.body.id}`, { volumeL: -1, reason: 'typo' })).status).toBe(422);
    expect(await rows('SELECT id FROM delivery_revisions WHERE delivery_id = :id', { id: created.body.id })).toHaveLength(0);
  });
  it('refuses with 409 to lower a volume below the litres already boiled, or to reject a lot partly boiled', async () => {
    const created = await sugarmaker.post('/api/deliveries', lot({ volumeL: 200 }));
    await testDb().query('UPDATE sap_deliveries SET litres_boiled = 150 WHERE id = :id', { replacements: { id: created.body.id } });
    const lower = await coordinator.patch(`/api/deliveries/${created.body.id}`, { volumeL: 140, reason: 'Meter misread' });
    expect(lower.status).toBe(409);
    expect(lower.body.error.code).toBe('lot_already_boiled');
    expect(lower.body.error.fields.volumeL).toBeTruthy();
    const reject = await coordinator.patch(`/api/deliveries/${created.body.id}`, { status: 'rejected', reason: 'Found insects afterwards' });
    expect(reject.status).toBe(409);
    expect(await rows('SELECT id FROM delivery_revisions WHERE delivery_id = :id', { id: created.body.id })).toHaveLength(0);
    const [row] = await rows<{ volume_l: number; status: string }>('SELECT volume_l, status FROM sap_deliveries WHERE id = :id', { id: created.body.id });
    expect(row).toEqual({ volume_l: 200, status: 'accepted' });
    expect((await coordinator.patch(`/api/deliveries/${created.body.id}`, { volumeL: 160, reason: 'Meter misread' })).status).toBe(200);
  });
});

describe('rejected lots', () => {
  it('e-mails every person of the household with the reason', async () => {
    await clearMail();
    const res = await sugarmaker.post('/api/deliveries', lot({ householdId: households.Szabo, clarity: 'cloudy' }));
    expect(res.status).toBe(201);
    expect(res.body.status).toBe('rejected');
    expect(res.body.reason).toMatch(/cloudy/i);
    const people = await rows<{ email: string }>('SELECT email FROM users WHERE household_id = :h', { h: households.Szabo });
    expect(people.length).toBeGreaterThan(0);
    for (const p of people) {
      const mail = await waitForMail({ to: p.email, subject: 'Sap drop-off not accepted' });
      expect(mail.text).toContain(res.body.reason);
      // The lot's figures as the desk shows them (Larkspur works in US units): "56.1 gal", not "56.11 gal".
      expect(mail.subject).toContain(`${showVolume(212.4, 'us')} on`);
      expect(mail.text).toContain(`Lot: ${showVolume(212.4, 'us')} at ${showBrix(2.6)}, ${showTemperature(3.1, 'us')} at the tank`);
    }
    expect((await listMail()).some((m) => m.to.some((t) => t.address === 'okafor@larkspur.example'))).toBe(false);
  });

  it('do not count in the planning strip; accepted lots do', async () => {
    const before = (await coordinator.get('/api/planning')).body.waitingL;
    const rejected = await sugarmaker.post('/api/deliveries', lot({ volumeL: 300, contamination: 'insects' }));
    expect(rejected.body.status).toBe('rejected');
    expect((await coordinator.get('/api/planning')).body.waitingL).toBeCloseTo(before, 6);
    await sugarmaker.post('/api/deliveries', lot({ volumeL: 120 }));
    expect((await coordinator.get('/api/planning')).body.waitingL).toBeCloseTo(before + 120, 6);
  });
});

describe('photos', () => {
  it('stores an image and serves it to the co-op only, privately', async () => {
    const up = await upload(sugarmaker, PNG, 'lot.png', 'image/png');
    expect(up.status).toBe(201);
    expect(up.body.photoKey.startsWith(`${(await rows<{ cooperative_id: string }>('SELECT cooperative_id FROM households WHERE id = :h', { h: households.Okafor }))[0].cooperative_id}/`)).toBe(true);
    const res = await fetch(`${BASE_URL}/api/photos/${up.body.photoKey}`, { headers: { cookie: okafor.cookieHeader } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/png');
    expect(res.headers.get('cache-control')).toMatch(/private/);
    expect(Buffer.from(await res.arrayBuffer()).equals(PNG)).toBe(true);
    expect((await fetch(`${BASE_URL}/api/photos/${up.body.photoKey}`)).status).toBe(401);

    const created = await sugarmaker.post('/api/deliveries', lot({ photoKey: up.body.photoKey }));
    expect(created.status).toBe(201);
    expect(created.body.photoKey).toBe(up.body.photoKey);
  });

  it('answers 415 for a file that is not an image, whatever it claims, and 413 over 10 MB', async () => {
    const text = await upload(sugarmaker, new TextEncoder().encode('just some text, not a photo'), 'lot.png', 'image/png');
    expect(text.status).toBe(415);
    expect(text.body.error.fields.file).toBeTruthy();
    const big = new Uint8Array(10 * 1024 * 1024 + 1);
    big.set(PNG);
    const tooBig = await upload(sugarmaker, big, 'big.png', 'image/png');
    expect(tooBig.status).toBe(413);
  });

  it('answers 413 for a photo over 10 MB sent in chunks with no Content-Length, while it arrives', async () => {
    const boundary = 'brixhouse-test-boundary';
    const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.png"\r\nContent-Type: image/png\r\n\r\n`);
    const chunk = new Uint8Array(256 * 1024);
    chunk.set(PNG);
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(head);
      },
      pull(controller) {
        // 11 MB of file: past the limit before the form could end.
        if (sent >= 11 * 1024 * 1024) return controller.close();
        sent += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const res = await fetch(`${BASE_URL}/api/uploads`, {
      method: 'POST',
      headers: { cookie: sugarmaker.cookieHeader, 'content-type': `multipart/form-data; boundary=${boundary}` },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
    expect((await res.json()).error.fields.file).toMatch(/10 MB/);
  });

  it('answers 404 for a photo key of another cooperative, and refuses it on a lot', async () => {
    const foreign = `${otherCoop.cooperativeId}/photos/2026-12/abcdefghijklmnopqrstuvwxyz012345.png`;
    const res = await fetch(`${BASE_URL}/api/photos/${foreign}`, { headers: { cookie: sugarmaker.cookieHeader } });
    expect(res.status).toBe(404);
    const before = await lotCount();
    const posted = await sugarmaker.post('/api/deliveries', lot({ photoKey: foreign }));
    expect(posted.status).toBe(422);
    expect(posted.body.error.fields.photoKey).toBeTruthy();
    expect(await lotCount()).toBe(before);
  });

  it('refuses uploads from members', async () => {
    expect((await upload(okafor, PNG, 'lot.png', 'image/png')).status).toBe(403);
  });
});

describe('the database', () => {
  it('refuses what the checks forbid even without the service', async () => {
    // A lot nothing was boiled from, so each update meets the check it is about and no other.
    const [l] = await rows<{ id: string }>("SELECT id FROM sap_deliveries WHERE status = 'accepted' AND litres_boiled = 0 ORDER BY received_at LIMIT 1");
    const q = (sql: string) => testDb().query(sql, { replacements: { id: l.id } });
    await expect(q('UPDATE sap_deliveries SET volume_l = 0 WHERE id = :id')).rejects.toThrow(/sap_deliveries_volume/);
    await expect(q('UPDATE sap_deliveries SET brix = 85.5 WHERE id = :id')).rejects.toThrow(/sap_deliveries_brix/);
    await expect(q("UPDATE sap_deliveries SET status = 'rejected', reason = NULL WHERE id = :id")).rejects.toThrow(/reason/);
    await expect(q("UPDATE sap_deliveries SET collected_on = (received_at + interval '3 days')::date WHERE id = :id")).rejects.toThrow(/collected_before_received/);
    await expect(q('UPDATE sap_deliveries SET sugar_maple_pct = 50, red_maple_pct = 40, other_pct = 5 WHERE id = :id')).rejects.toThrow(/sap_deliveries_mix/);
    await expect(
      testDb().query('UPDATE sap_deliveries SET household_id = :h WHERE id = :id', { replacements: { id: l.id, h: otherCoop.householdId } }),
    ).rejects.toThrow(/household_fk/);
  });
});
