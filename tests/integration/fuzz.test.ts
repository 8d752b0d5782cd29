import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DateTime } from 'luxon';
import { BASE_URL } from '../test-env';
import { signedIn, type Client } from './http';
import { closeTestDb, rows } from './db';
import { FUZZ_COOP, generateCoop } from './coops';
import { fillPath, routeHandlers, type RouteHandler } from './routes';

// Fuzz: every route handler under app/api (found from the files, so new routes are covered
// without editing this test) gets at least 200 generated query strings or bodies, with a fixed
// seed. No answer may be a 5xx, and a refused request (4xx) may not change a single row.
// The requests come from the coordinator of a co-op made for this test, so an input that
// happens to be valid only writes to that co-op.

const SEED = 20261202;
const RUNS = 200;
/** next-auth's own endpoints sign in and out; the bench route is off outside benchmarks. */
const SKIP = [/^\/api\/auth\//, /^\/api\/bench\//];
/** Bookkeeping tables that a refused request may touch (migrations, socket.io, rate limits). */
const NOT_DOMAIN = /^(SequelizeMeta|socket_io_attachments)$|rate_?limit|login_attempt|throttle/i;

const handlers = routeHandlers().filter((h) => !SKIP.some((re) => re.test(h.pattern)));

let client: Client;
let ids: Record<string, string[]> = {};
let valid: Record<string, Record<string, unknown>> = {};
let domainTables: string[] = [];

/** Which table holds the records a path's `[id]` names, by the path's first segment. */
const TABLE_OF: Record<string, string> = {
  deliveries: 'sap_deliveries',
  runs: 'boil_runs',
  slots: 'boil_slots',
  seasons: 'seasons',
  people: 'users',
  households: 'households',
  'display-links': 'display_links',
  statements: 'statements',
  evaporators: 'evaporators',
};

beforeAll(async () => {
  const coop = await generateCoop(FUZZ_COOP);
  client = await signedIn(coop.coordinatorEmail);
  const tables = await rows<{ t: string }>("SELECT tablename AS t FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename");
  domainTables = tables.map((r) => r.t).filter((t) => !NOT_DOMAIN.test(t));
  ids = {};
  for (const table of new Set(Object.values(TABLE_OF))) {
    if (!tables.some((r) => r.t === table)) continue;
    const found = await rows<{ id: string }>(`SELECT id FROM "${table}" WHERE cooperative_id = :c ORDER BY id LIMIT 3`, { c: coop.cooperativeId });
    ids[table] = found.map((r) => r.id);
  }
  const household = ids.households[0];
  const evaporator = ids.evaporators[0];
  const [waiting] = await rows<{ id: string }>(
    "SELECT id FROM sap_deliveries WHERE cooperative_id = :c AND status = 'accepted' AND litres_boiled < volume_l LIMIT 1",
    { c: coop.cooperativeId },
  );
  const day = DateTime.now().setZone('America/New_York').startOf('day');
  // A valid body per handler, so generated variations also reach the checks behind the schema.
  valid = {
    'POST /api/deliveries': {
      householdId: household,
      volumeL: 120,
      brix: 2.1,
      sapTempC: 3,
      collectedOn: day.toISODate(),
      clarity: 'clear',
      contamination: 'none',
      idempotencyKey: 'fuzz-base-key',
    },
    'PATCH /api/deliveries/[id]': { volumeL: 130, reason: 'Meter read again.' },
    'POST /api/slots': { evaporatorId: evaporator, householdId: household, startsAt: day.plus({ days: 22, hours: 8 }).toISO(), endsAt: day.plus({ days: 22, hours: 11 }).toISO() },
    'PATCH /api/slots/[id]': { note: 'Bring the hydrometer cup.' },
    'POST /api/runs': { evaporatorId: evaporator },
    'POST /api/runs/[id]/inputs': { deliveryId: waiting?.id, litres: 10 },
    'POST /api/runs/[id]/draws': { litres: 5, brix: 66.9, transmittancePct: 60 },
    'POST /api/runs/[id]/fuel': { quantity: 1 },
    'POST /api/households': { name: 'Fuzz household' },
    'PATCH /api/settings': { syrupBrix: 66.9 },
  };
}, 120_000);

afterAll(closeTestDb);

const KEYS = [
  'householdId', 'volumeL', 'brix', 'sapTempC', 'collectedOn', 'clarity', 'contamination', 'decision', 'reason', 'photoKey',
  'mix', 'note', 'idempotencyKey', 'evaporatorId', 'startsAt', 'endsAt', 'crew', 'expectedSapL', 'name', 'email', 'role',
  'label', 'status', 'deliveryId', 'litres', 'inputs', 'drawnAt', 'transmittancePct', 'gradeClass', 'temperatureC', 'kind',
  'quantity', 'unit', 'startedAt', 'finishedAt', 'seasonId', 'slotId', 'from', 'to', 'password', 'token', 'unitSystem',
  'timeZone', 'elevationM', 'currency', 'syrupBrix', 'amountCents', 'method', 'feeCents', 'householdIds', 'statusReason',
];

const nasty = fc.constantFrom(
  '', ' ', '\\', '\u0000', 'null', 'NaN', 'Infinity', '-0', '0x10', '1e309', '9999-99-99', '0000-01-01', '2026-02-30',
  '0001-01-01T00:00:00+00:00', '275760-09-13T00:00:00Z', '-1', "' OR 1=1 --", '%00', '../../etc/passwd', 'x'.repeat(3000),
  '00000000-0000-0000-0000-000000000000', '😀', 'true', '[60]', '{}', 'coordinator', 'member', 'accept', 'reject',
);
const scalar = fc.oneof(
  nasty,
  fc.string({ maxLength: 40 }),
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.uuid(),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
);
const value = fc.oneof(scalar, fc.array(scalar, { maxLength: 3 }), fc.dictionary(fc.constantFrom(...KEYS), scalar, { maxKeys: 3 }));
const structured = fc.dictionary(fc.constantFrom(...KEYS), value, { maxKeys: 8 });

interface Sample {
  query: string;
  params: Record<string, string>;
  /** The raw body text (null: no body) and its content type. */
  body: string | null;
  type: string;
}

function paramArb(h: RouteHandler) {
  const table = TABLE_OF[h.pattern.split('/')[2]];
  const real = table && ids[table]?.length ? [fc.constantFrom(...ids[table])] : [];
  const one = fc.oneof(...real, ...real, fc.uuid(), fc.string({ minLength: 1, maxLength: 30 }), nasty.filter((s) => s.length > 0 && s.length < 100));
  return fc.record(Object.fromEntries(h.params.map((p) => [p, one])) as Record<string, fc.Arbitrary<string>>);
}

function bodyArb(h: RouteHandler): fc.Arbitrary<{ body: string | null; type: string }> {
  if (h.method === 'GET' || h.method === 'DELETE') return fc.constant({ body: null, type: 'application/json' });
  const base = valid[`${h.method} ${h.pattern}`];
  const json = (v: unknown) => ({ body: JSON.stringify(v) ?? 'null', type: 'application/json' });
  const variants: fc.Arbitrary<{ body: string | null; type: string }>[] = [
    structured.map(json),
    fc.jsonValue({ maxDepth: 3 }).map(json),
    fc.string({ maxLength: 60 }).map((s) => ({ body: s, type: 'application/json' })),
    structured.map((v) => ({ body: JSON.stringify(v), type: 'text/plain' })),
  ];
  if (base) {
    // The valid body with one or two fields changed or dropped.
    const mutated = fc
      .tuple(fc.subarray(Object.keys(base), { minLength: 1, maxLength: Math.min(2, Object.keys(base).length) }), fc.array(fc.option(value, { nil: undefined }), { minLength: 2, maxLength: 2 }))
      .map(([keys, vals]) => {
        const copy: Record<string, unknown> = { ...base };
        keys.forEach((k, i) => (vals[i] === undefined ? delete copy[k] : (copy[k] = vals[i])));
        return json(copy);
      });
    variants.push(mutated, mutated, mutated);
  }
  return fc.oneof(...variants);
}

function queryArb(): fc.Arbitrary<string> {
  const pairs = fc.array(fc.tuple(fc.constantFrom(...KEYS), scalar.map((v) => String(v))), { maxLength: 5 });
  return fc.oneof(
    pairs.map((p) => (p.length ? `?${new URLSearchParams(p)}` : '')),
    fc.constantFrom('?from=%ZZ', '?to=2026-13-45', '?householdId=', '?status=accepted&status=rejected', '?%', '?seasonId[]=1'),
  );
}

function samples(h: RouteHandler): Sample[] {
  const arb = fc.record({ query: queryArb(), params: paramArb(h), payload: bodyArb(h) });
  return fc.sample(arb, { numRuns: RUNS, seed: SEED + h.pattern.length * 31 + h.method.length }).map((s) => ({
    query: s.query,
    params: s.params,
    body: s.payload.body,
    type: s.payload.type,
  }));
}

async function fingerprint(): Promise<string> {
  const parts = domainTables.map((t) => `(SELECT count(*) || '/' || coalesce(max(xmin::text::bigint), 0) FROM "${t}")`);
  const [row] = await rows<{ f: string }>(`SELECT concat_ws(',', ${parts.join(', ')}) AS f`);
  return row.f;
}

/**
 * The fingerprint once background work has finished: an accepted write may queue jobs (e-mail,
 * statements) that write a moment later; those writes belong to the accepted request.
 */
async function settled(): Promise<string> {
  let last = await fingerprint();
  for (let i = 0; i < 30; i++) {
    await new Promise((r) => setTimeout(r, 400));
    const now = await fingerprint();
    if (now === last) return now;
    last = now;
  }
  return last;
}

async function send(h: RouteHandler, s: Sample): Promise<number> {
  const res = await fetch(`${BASE_URL}${fillPath(h.pattern, s.params)}${s.query}`, {
    method: h.method,
    redirect: 'manual',
    headers: { accept: 'application/json', cookie: client.cookieHeader, origin: BASE_URL, ...(s.body !== null ? { 'content-type': s.type } : {}) },
    body: s.body ?? undefined,
    signal: AbortSignal.timeout(20_000),
  });
  await res.arrayBuffer();
  return res.status;
}

describe('fuzzing every route handler', () => {
  it('finds the route handlers under app/api', () => {
    expect(handlers.length).toBeGreaterThan(15);
    expect(handlers.some((h) => h.method === 'POST' && h.pattern === '/api/slots')).toBe(true);
  });

  for (const h of handlers) {
    it(`${h.method} ${h.pattern}: ${RUNS} generated inputs, never a 5xx, nothing written when refused`, async () => {
      const problems: string[] = [];
      const inputs = samples(h);
      const reads = h.method === 'GET';
      let before = await settled();
      const statuses: number[] = [];
      if (reads) {
        // Reads go four at a time; none may write anything.
        for (let i = 0; i < inputs.length; i += 4) {
          const batch = inputs.slice(i, i + 4);
          const got = await Promise.all(batch.map((s) => send(h, s)));
          got.forEach((status, j) => {
            statuses.push(status);
            if (status >= 500) problems.push(`${status} for ${JSON.stringify(batch[j])}`);
          });
        }
        const after = await fingerprint();
        if (after !== before) problems.push('a read changed rows');
      } else {
        for (const s of inputs) {
          const status = await send(h, s);
          statuses.push(status);
          const after = status < 400 ? await settled() : await fingerprint();
          if (status >= 500) problems.push(`${status} for ${JSON.stringify(s)}`);
          if (status >= 400 && after !== before) problems.push(`refused with ${status} but rows changed, for ${JSON.stringify(s)}`);
          before = after;
        }
      }
      expect(statuses).toHaveLength(RUNS);
      expect(problems.slice(0, 5)).toEqual([]);
    }, 240_000);
  }
});
