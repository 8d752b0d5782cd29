import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { Transaction } from 'sequelize';
import { errorResponse } from '@/lib/server/http';
import { registerConstraints, sqlState } from '@/lib/server/db-errors';
import pg from 'pg';
import { BASE_URL, TEST_DATABASE_URL } from '../test-env';
import { signedIn, type Client } from './http';

/** Next year's number: an impossible day in it (30 February) is never a real date, whenever the test runs. */
const NEXT_YEAR = DateTime.now().year + 1;
import { closeTestDb, rows, testDb } from './db';
import { fillPath, routeHandlers } from './routes';

// The HTTP error mapping, first from real database refusals: each statement below makes the test
// database raise one SQLSTATE, and the error Sequelize throws goes through the same mapper the
// route handlers use (lib/server/http errorResponse). Then over HTTP against the test server:
// malformed ids, malformed and year-0 dates, a household named "\" and text holding a NUL
// character each answer 4xx and change nothing.

const PROBE = 'error_mapping_probe';

interface Mapped {
  status: number;
  code: string;
  fields?: Record<string, string>;
}

async function mapped(err: unknown, idsInPath = false): Promise<Mapped> {
  const res = errorResponse(err, { idsInPath });
  const body = (await res.json()) as { error: Mapped };
  return { status: res.status, code: body.error.code, ...(body.error.fields ? { fields: body.error.fields } : {}) };
}

/** Runs `setup` then `failing` in one transaction (temporary tables live there) and returns what `failing` threw. */
async function provoke(setup: string[], failing: string, bind?: unknown[]): Promise<unknown> {
  const db = testDb();
  const t = await db.transaction();
  try {
    for (const sql of setup) await db.query(sql, { transaction: t });
    await db.query(failing, { transaction: t, ...(bind ? { bind } : {}) });
  } catch (err) {
    return err;
  } finally {
    await t.rollback();
  }
  throw new Error(`The statement did not fail: ${failing}`);
}

/** What the pg driver throws when a parameter holds a NUL character. */
async function nulParameter(): Promise<unknown> {
  const client = new pg.Client({ connectionString: TEST_DATABASE_URL });
  await client.connect();
  try {
    await client.query('SELECT $1::text', ['Abel\u0000Marchetti']);
  } catch (err) {
    return err;
  } finally {
    await client.end();
  }
  throw new Error('The NUL character was stored.');
}

/** A real serialization failure: a repeatable-read transaction updates a row changed since its snapshot. */
async function serializationFailure(): Promise<unknown> {
  const db = testDb();
  const t = await db.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.REPEATABLE_READ });
  try {
    await db.query(`SELECT v FROM ${PROBE} WHERE id = 1`, { transaction: t });
    await db.query(`UPDATE ${PROBE} SET v = v + 1 WHERE id = 1`); // another connection, committed
    await db.query(`UPDATE ${PROBE} SET v = v + 1 WHERE id = 1`, { transaction: t });
  } catch (err) {
    return err;
  } finally {
    await t.rollback();
  }
  throw new Error('No serialization failure happened.');
}

/** A real deadlock: two transactions each hold one advisory lock and wait for the other's. */
async function deadlock(): Promise<unknown> {
  const db = testDb();
  const [a, b] = [880_001, 880_002];
  const t1 = await db.transaction();
  const t2 = await db.transaction();
  const done = new Set<Transaction>();
  const end = async (t: Transaction) => {
    if (!done.has(t)) {
      done.add(t);
      await t.rollback();
    }
  };
  try {
    await db.query(`SELECT pg_advisory_xact_lock(${a})`, { transaction: t1 });
    await db.query(`SELECT pg_advisory_xact_lock(${b})`, { transaction: t2 });
    // The victim rolls back at once, so the other transaction gets its lock and finishes.
    const wait = (t: Transaction, key: number) =>
      db.query(`SELECT pg_advisory_xact_lock(${key})`, { transaction: t }).then(
        () => null,
        async (err: unknown) => {
          await end(t);
          return err;
        },
      );
    const errors = (await Promise.all([wait(t1, b), wait(t2, a)])).filter((e) => e !== null);
    if (errors.length !== 1) throw new Error(`Expected one deadlock victim, got ${errors.length}.`);
    return errors[0];
  } finally {
    await end(t1);
    await end(t2);
  }
}

interface Case {
  state: string;
  what: string;
  raise: () => Promise<unknown>;
  expected: Mapped;
  /** Also mapped as for a path that carries ids. */
  inIdPath?: Mapped;
}

// Column names follow the schema's habit (snake_case); the mapper names the request field (camelCase).
const CASES: Case[] = [
  {
    state: '23505',
    what: 'a second row with the same unique value',
    raise: () =>
      provoke(
        ['CREATE TEMP TABLE em_unique (household_name text UNIQUE) ON COMMIT DROP', "INSERT INTO em_unique VALUES ('Okafor')"],
        "INSERT INTO em_unique VALUES ('Okafor')",
      ),
    expected: { status: 409, code: 'already_exists', fields: { householdName: 'That already exists.' } },
  },
  {
    state: '23505',
    what: 'a registered unique constraint (its own code and field)',
    raise: () =>
      provoke(
        [
          'CREATE TEMP TABLE em_named_unique (email text, CONSTRAINT em_test_email_unique UNIQUE (email)) ON COMMIT DROP',
          "INSERT INTO em_named_unique VALUES ('a@example.org')",
        ],
        "INSERT INTO em_named_unique VALUES ('a@example.org')",
      ),
    expected: { status: 409, code: 'em_email_taken', fields: { email: 'This address is in use.' } },
  },
  {
    state: '23503',
    what: 'a reference to a row that does not exist',
    raise: () =>
      provoke(
        [
          'CREATE TEMP TABLE em_parent (id int PRIMARY KEY) ON COMMIT DROP',
          'CREATE TEMP TABLE em_child (household_id int REFERENCES em_parent (id)) ON COMMIT DROP',
        ],
        'INSERT INTO em_child VALUES (5)',
      ),
    expected: { status: 422, code: 'reference_not_found', fields: { householdId: 'A record this refers to does not exist.' } },
  },
  {
    state: '23514',
    what: 'a check constraint nobody registered',
    raise: () => provoke(['CREATE TEMP TABLE em_check (volume_l numeric CHECK (volume_l > 0)) ON COMMIT DROP'], 'INSERT INTO em_check VALUES (-1)'),
    expected: { status: 422, code: 'rule_violated' },
  },
  {
    state: '23514',
    what: 'a registered check constraint (its own code and field)',
    raise: () =>
      provoke(
        ['CREATE TEMP TABLE em_named_check (volume_l numeric, CONSTRAINT em_test_volume_positive CHECK (volume_l > 0)) ON COMMIT DROP'],
        'INSERT INTO em_named_check VALUES (0)',
      ),
    expected: { status: 422, code: 'em_volume_invalid', fields: { volumeL: 'Enter a volume above 0 L.' } },
  },
  {
    state: '23P01',
    what: 'two overlapping time ranges under an exclusion constraint',
    raise: () =>
      provoke(
        [
          'CREATE TEMP TABLE em_overlap (during tstzrange, EXCLUDE USING gist (during WITH &&)) ON COMMIT DROP',
          "INSERT INTO em_overlap VALUES (tstzrange(now(), now() + interval '3 hours'))",
        ],
        "INSERT INTO em_overlap VALUES (tstzrange(now() + interval '1 hour', now() + interval '4 hours'))",
      ),
    expected: { status: 409, code: 'overlaps' },
  },
  {
    state: '23P01',
    what: 'a registered exclusion constraint (its own code and field)',
    raise: () =>
      provoke(
        [
          'CREATE TEMP TABLE em_named_overlap (during tstzrange, CONSTRAINT em_test_no_overlap EXCLUDE USING gist (during WITH &&)) ON COMMIT DROP',
          "INSERT INTO em_named_overlap VALUES (tstzrange(now(), now() + interval '3 hours'))",
        ],
        "INSERT INTO em_named_overlap VALUES (tstzrange(now() + interval '1 hour', now() + interval '4 hours'))",
      ),
    expected: { status: 409, code: 'em_slot_conflict', fields: { startsAt: 'This time is taken.' } },
  },
  {
    state: '22P02',
    what: 'text that is not a UUID',
    raise: () => provoke([], "SELECT 'not-a-uuid'::uuid"),
    expected: { status: 422, code: 'invalid_format' },
    inIdPath: { status: 404, code: 'not_found' },
  },
  {
    state: '22007',
    what: 'text that is not a date',
    raise: () => provoke([], "SELECT 'next tuesday'::date"),
    expected: { status: 422, code: 'invalid_date' },
  },
  {
    state: '22008',
    what: 'a year-0 date',
    raise: () => provoke([], "SELECT '0000-01-01'::date"),
    expected: { status: 422, code: 'invalid_date' },
  },
  {
    state: '22008',
    what: 'a day that does not exist (30 February)',
    raise: () => provoke([], `SELECT '${NEXT_YEAR}-02-30T09:00:00-05:00'::timestamptz`),
    expected: { status: 422, code: 'invalid_date' },
  },
  {
    state: '22021',
    what: 'bytes holding a NUL character read as text',
    raise: () => provoke([], "SELECT convert_from('\\x416200'::bytea, 'UTF8')"),
    expected: { status: 422, code: 'invalid_text' },
  },
  {
    state: '22021',
    what: 'text holding a NUL character sent as a parameter by the pg driver (Sequelize escapes it, pg does not)',
    raise: nulParameter,
    expected: { status: 422, code: 'invalid_text' },
  },
  { state: '40001', what: 'a serialization failure between two transactions', raise: serializationFailure, expected: { status: 409, code: 'busy' } },
  { state: '40P01', what: 'a deadlock between two transactions', raise: deadlock, expected: { status: 409, code: 'busy' } },
];

describe('database errors map by SQLSTATE and constraint name', () => {
  beforeAll(async () => {
    registerConstraints({
      em_test_email_unique: { code: 'em_email_taken', field: 'email', message: 'That address already has an account.', fieldMessage: 'This address is in use.' },
      em_test_volume_positive: { code: 'em_volume_invalid', field: 'volumeL', message: 'Enter a volume above 0 L.' },
      em_test_no_overlap: { code: 'em_slot_conflict', field: 'startsAt', message: 'That time was just taken.', fieldMessage: 'This time is taken.' },
    });
    await testDb().query(`CREATE TABLE IF NOT EXISTS ${PROBE} (id int PRIMARY KEY, v int NOT NULL)`);
    await testDb().query(`INSERT INTO ${PROBE} VALUES (1, 0) ON CONFLICT (id) DO NOTHING`);
  });
  afterAll(async () => {
    await testDb().query(`DROP TABLE IF EXISTS ${PROBE}`);
  });

  it('covers every SQLSTATE the mapping promises', () => {
    expect(new Set(CASES.map((c) => c.state))).toEqual(new Set(['23505', '23503', '23514', '23P01', '22P02', '22007', '22008', '22021', '40001', '40P01']));
  });

  for (const c of CASES) {
    it(`${c.state}, ${c.what}: ${c.expected.status} ${c.expected.code}${c.expected.fields ? ` on ${Object.keys(c.expected.fields)}` : ''}`, async () => {
      const err = await c.raise();
      expect(sqlState(err)).toBe(c.state);
      expect(await mapped(err)).toEqual(c.expected);
      if (c.inIdPath) expect(await mapped(err, true)).toEqual(c.inIdPath);
    });
  }

  it('an error that is not the database’s, or a SQLSTATE outside the table, stays a 500 without detail', async () => {
    const err = await provoke([], 'SELECT 1 / 0'); // 22012: our own bug, nothing a person can fix
    expect(sqlState(err)).toBe('22012');
    const res = errorResponse(err);
    expect(res.status).toBe(500);
    expect(JSON.stringify(await res.json())).not.toContain('division');
  });
});

// ---------------------------------------------------------------------------------------------
// Over HTTP. The demo co-op's coordinator; a refused request may not change a row.

const MALFORMED_IDS = ['not-an-id', '42', "x'--", '00000000-0000-0000-0000-00000000000g', '%00'];
const WATCHED = ['households', 'users', 'boil_slots', 'sap_deliveries', 'boil_runs', 'run_inputs', 'syrup_draws', 'fuel_uses', 'seasons', 'season_fees', 'settlements', 'payments', 'display_links'];

let client: Client;
let slot: { id: string; evaporator_id: string; household_id: string };
let household: string;

/** A digest of every row of the tables a refused request could have touched. */
async function snapshot(): Promise<string> {
  const parts = WATCHED.map((t) => `(SELECT md5(coalesce(string_agg(x::text, '|' ORDER BY x::text), '')) FROM "${t}" x)`);
  const [row] = await rows<{ s: string }>(`SELECT concat_ws(',', ${parts.join(', ')}) AS s`);
  return row.s;
}

/** Sends the request and expects a 4xx that changed nothing; returns the answer. */
async function refused(method: string, path: string, body?: unknown) {
  const before = await snapshot();
  const res = await client.request(method, path, body);
  expect(res.status, `${method} ${path} answered ${res.status}: ${JSON.stringify(res.body)}`).toBeGreaterThanOrEqual(400);
  expect(res.status).toBeLessThan(500);
  expect(typeof res.body?.error?.code).toBe('string');
  expect(await snapshot()).toBe(before);
  return res;
}

const day = () => DateTime.now().setZone('America/New_York').startOf('day');

describe('over HTTP: bad input answers 4xx and changes nothing', () => {
  beforeAll(async () => {
    client = await signedIn('coordinator@larkspur.example');
    const [s] = await rows<typeof slot>(
      `SELECT s.id, s.evaporator_id, s.household_id FROM boil_slots s JOIN cooperatives c ON c.id = s.cooperative_id
        WHERE c.name = 'Larkspur Hollow Sugar Cooperative' AND s.status = 'booked' AND s.starts_at > now() + interval '3 days'
        ORDER BY s.starts_at LIMIT 1`,
    );
    slot = s;
    household = s.household_id;
  });
  afterAll(closeTestDb);

  const withIds = routeHandlers().filter((h) => h.params.includes('id'));

  it('finds the route handlers with an [id] in their path', () => {
    expect(withIds.length).toBeGreaterThanOrEqual(10);
    expect(withIds.some((h) => h.method === 'PATCH' && h.pattern === '/api/slots/[id]')).toBe(true);
  });

  for (const h of withIds) {
    it(`${h.method} ${h.pattern} with a malformed id answers 404 not_found, never 500`, async () => {
      for (const bad of MALFORMED_IDS) {
        const path = fillPath(h.pattern, { id: bad }).replace(encodeURIComponent('%00'), '%00');
        const res = await refused(h.method, path, h.method === 'GET' || h.method === 'DELETE' ? undefined : {});
        expect(res.status, `${h.method} ${path}`).toBe(404);
        expect(res.body.error.code).toBe('not_found');
      }
    }, 120_000);
  }

  it('a malformed date answers 422 with the field named', async () => {
    const start = day().plus({ days: 30, hours: 9 });
    const slotBody = { evaporatorId: slot.evaporator_id, householdId: household, startsAt: start.toISO(), endsAt: start.plus({ hours: 3 }).toISO() };

    let res = await refused('POST', '/api/slots', { ...slotBody, startsAt: `${NEXT_YEAR}-02-30T09:00:00-05:00` });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('startsAt');

    res = await refused('POST', '/api/slots', { ...slotBody, endsAt: 'tomorrow at noon' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('endsAt');

    res = await refused('GET', `/api/slots?from=${NEXT_YEAR}-13-45&to=${day().plus({ days: 7 }).toISODate()}`);
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('from');

    res = await refused('POST', '/api/deliveries', { householdId: household, volumeL: 120, brix: 2.1, sapTempC: 3, collectedOn: `${NEXT_YEAR}-02-30`, clarity: 'clear', contamination: 'none', idempotencyKey: `error-mapping-${Date.now()}` });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('collectedOn');
  });

  it('a year-0 date (0000-01-01) answers 422 with the field named', async () => {
    const start = day().plus({ days: 30, hours: 9 });
    let res = await refused('POST', '/api/slots', {
      evaporatorId: slot.evaporator_id,
      householdId: household,
      startsAt: '0000-01-01T09:00:00-05:00',
      endsAt: start.toISO(),
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('startsAt');

    res = await refused('PATCH', `/api/slots/${slot.id}`, { startsAt: '0000-01-01T09:00:00-05:00', endsAt: '0000-01-01T12:00:00-05:00' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['startsAt', 'endsAt']));

    res = await refused('GET', '/api/slots?from=0000-01-01&to=0000-02-01');
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('from');

    res = await refused('POST', '/api/deliveries', { householdId: household, volumeL: 120, brix: 2.1, sapTempC: 3, collectedOn: '0000-01-01', clarity: 'clear', contamination: 'none', idempotencyKey: `error-mapping-${Date.now()}` });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain('collectedOn');
  });

  it('a household named "\\" answers 422 on its name', async () => {
    for (const name of ['\\', '\\\\', ' \\ ']) {
      const res = await refused('POST', '/api/households', { name });
      expect(res.status).toBe(422);
      expect(Object.keys(res.body.error.fields)).toEqual(['name']);
    }
  });

  it('a crew name or note holding a NUL character answers 422 on that field', async () => {
    let res = await refused('PATCH', `/api/slots/${slot.id}`, { note: 'Bring the cup\u0000' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['note']);

    res = await refused('PATCH', `/api/slots/${slot.id}`, { crew: ['Abel', 'Ju\u0000no'] });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['crew.1']);

    const start = day().plus({ days: 30, hours: 9 });
    res = await refused('POST', '/api/slots', {
      evaporatorId: slot.evaporator_id,
      householdId: household,
      startsAt: start.toISO(),
      endsAt: start.plus({ hours: 3 }).toISO(),
      crew: ['\u0000'],
    });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['crew.0']);

    res = await refused('POST', '/api/households', { name: 'Nul\u0000house' });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['name']);
  });

  it('the same NUL sent raw in the JSON text (\\u0000 escape) is refused the same way', async () => {
    const before = await snapshot();
    const res = await fetch(`${BASE_URL}/api/slots/${slot.id}`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/json', accept: 'application/json', cookie: client.cookieHeader, origin: BASE_URL },
      body: '{"note":"a\\u0000b"}',
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty('note');
    expect(await snapshot()).toBe(before);
  });
});
