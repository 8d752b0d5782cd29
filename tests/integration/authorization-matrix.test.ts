import { randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { BASE_URL } from '../test-env';
import { Client, signedIn } from './http';
import { closeTestDb, markChanged, rows } from './db';
import { generateCoop, OTHER_COOP } from './coops';
import { routeHandlers } from './routes';
import type { GeneratedCoop } from '@/db/seeds/scale';

// The authorization matrix: every route × each role × own / other cooperative × own / other
// household, against the table below. Larkspur Hollow (the demo co-op) is "own"; Brennan is the
// member's own household and Szabo another one; Quillfeather Glen (a co-op made for the tests)
// is the other cooperative. Write cases act on records made fresh for each request. Besides
// the status, no answer to a Larkspur person may carry an id of the other co-op's records.

type Actor = 'anonymous' | 'coordinator' | 'sugarmaker' | 'member';
type Scope = 'own-household' | 'other-household' | 'other-coop' | 'co-op';
type Expect = Record<Actor, number | number[]>;
const ACTORS: Actor[] = ['anonymous', 'coordinator', 'sugarmaker', 'member'];

const everyone = (ok: number | number[]): Expect => ({ anonymous: 401, coordinator: ok, sugarmaker: ok, member: ok });
const staffOnly = (ok: number | number[], member: number | number[] = 403): Expect => ({ anonymous: 401, coordinator: ok, sugarmaker: ok, member });
const coordinatorOnly = (ok: number | number[], denied: number | number[] = 403): Expect => ({ anonymous: 401, coordinator: ok, sugarmaker: denied, member: denied });
/** Another co-op's record: not found for anyone signed in (a role refusal may come first). */
const otherCoop = (roleDenied: Actor[] = []): Expect =>
  Object.fromEntries(ACTORS.map((a) => [a, a === 'anonymous' ? 401 : roleDenied.includes(a) ? [403, 404, 422] : [404, 422]])) as Expect;

interface Fixtures {
  own: { coop: string; season: string; lastSeason: string; brennan: string; szabo: string; evaporator: string };
  other: GeneratedCoop & { household: string; evaporator: string; person: string; ids: Set<string> };
}

interface Case {
  route: string;
  scope: Scope;
  expect: Expect;
  /** The request for one actor (fresh records are made here for writes). */
  request: (fx: Fixtures, actor: Actor) => Promise<{ path: string; body?: unknown; form?: FormData }>;
  /** Checks on a 2xx answer beyond the status. */
  check?: (body: unknown, actor: Actor, fx: Fixtures) => Promise<void> | void;
}

let fx: Fixtures;
const clients: Partial<Record<Actor, Client>> = {};
let counter = 0;
const ZONE = 'America/New_York';
const future = (days: number, hour: number) => DateTime.now().setZone(ZONE).startOf('day').plus({ days }).set({ hour });

// Fresh records, straight into the database, so each write case meets a record in a known state.
async function lot(coop: string, household: string) {
  const [season] = await rows<{ id: string }>("SELECT id FROM seasons WHERE cooperative_id = :coop AND status = 'open'", { coop });
  const [r] = await rows<{ id: string }>(
    `INSERT INTO sap_deliveries (cooperative_id, season_id, household_id, collected_on, volume_l, brix, sap_temp_c, clarity, contamination,
                                 recommendation, status, idempotency_key)
     VALUES (:coop, :season, :household, current_date - 1, 300, 2.4, 3, 'clear', 'none', 'accept', 'accepted', :key) RETURNING id`,
    { coop, season: season.id, household, key: `matrix-${randomUUID()}` },
  );
  await markChanged(coop);
  return r.id;
}

/** A booked slot 18 days ahead (far beyond the cancel notice) on an evaporator of its own. */
async function slot(coop: string, household: string) {
  const [season] = await rows<{ id: string }>("SELECT id FROM seasons WHERE cooperative_id = :coop AND status = 'open'", { coop });
  const start = future(18, 9);
  const [r] = await rows<{ id: string }>(
    `INSERT INTO boil_slots (cooperative_id, season_id, evaporator_id, household_id, starts_at, ends_at, note)
     VALUES (:coop, :season, :evaporator, :household, :s, :e, 'matrix') RETURNING id`,
    { coop, season: season.id, evaporator: await evaporator(coop), household, s: start.toISO(), e: start.plus({ hours: 2 }).toISO() },
  );
  await markChanged(coop);
  return r.id;
}

/** A finished run of the season whose sap came (or did not come) from the household. */
async function runWith(season: string, household: string, withIt: boolean) {
  const [r] = await rows<{ run: string }>(
    `SELECT run_id AS run FROM allocations WHERE season_id = :season GROUP BY run_id
      HAVING bool_or(household_id = :household) = :withIt ORDER BY run_id LIMIT 1`,
    { season, household, withIt },
  );
  if (!r) throw new Error(`no run ${withIt ? 'with' : 'without'} that household's sap in the demo season`);
  return r.run;
}

async function evaporator(coop: string) {
  const [r] = await rows<{ id: string }>(
    "INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind) VALUES (:coop, :name, 120, 'wood') RETURNING id",
    { coop, name: `Matrix pan ${counter++}` },
  );
  return r.id;
}

/** A running run on an evaporator of its own; with `input`, a lot already in it. */
async function run(coop: string, household: string, { input = false } = {}) {
  const [season] = await rows<{ id: string; year: string }>(
    "SELECT id, to_char(starts_on, 'YYYY') AS year FROM seasons WHERE cooperative_id = :coop AND status = 'open'",
    { coop },
  );
  const [{ next }] = await rows<{ next: number }>('SELECT coalesce(max(run_number), 0) + 1 AS next FROM boil_runs WHERE season_id = :s', { s: season.id });
  const [r] = await rows<{ id: string }>(
    `INSERT INTO boil_runs (cooperative_id, season_id, evaporator_id, run_number, lot_code, started_at)
     VALUES (:coop, :season, :evaporator, :n, :code, now() - interval '1 hour') RETURNING id`,
    { coop, season: season.id, evaporator: await evaporator(coop), n: next, code: `${season.year}-${String(next).padStart(3, '0')}` },
  );
  if (input) {
    await rows('INSERT INTO run_inputs (cooperative_id, run_id, delivery_id, litres) VALUES (:coop, :run, :lot, 50)', {
      coop,
      run: r.id,
      lot: await lot(coop, household),
    });
  }
  await markChanged(coop);
  return r.id;
}

async function person(coop: string) {
  const [r] = await rows<{ id: string }>(
    "INSERT INTO users (cooperative_id, name, email, role) VALUES (:coop, 'Matrix Person', :email, 'sugarmaker') RETURNING id",
    { coop, email: `matrix-${randomUUID()}@${coop === fx.own.coop ? 'larkspur' : 'quillfeather'}.example` },
  );
  return r.id;
}

async function displayLink(coop: string) {
  const [r] = await rows<{ id: string }>(
    "INSERT INTO display_links (cooperative_id, name, token_hash) VALUES (:coop, 'Matrix screen', :hash) RETURNING id",
    { coop, hash: randomBytes(32).toString('hex') },
  );
  return r.id;
}

/** The signed-in actor's own name as the database has it. */
const EMAIL: Record<Exclude<Actor, 'anonymous'>, string> = {
  coordinator: 'coordinator@larkspur.example',
  sugarmaker: 'sugarmaker@larkspur.example',
  member: 'brennan@larkspur.example',
};
async function ownName(actor: Actor): Promise<string> {
  if (actor === 'anonymous') return 'Nobody Signed In';
  return (await rows<{ name: string }>('SELECT name FROM users WHERE email = :e', { e: EMAIL[actor] }))[0].name;
}

const deliveryBody = (householdId: string) => ({
  householdId,
  volumeL: 150,
  brix: 2.2,
  sapTempC: 3,
  collectedOn: DateTime.now().setZone(ZONE).toISODate(),
  clarity: 'clear',
  contamination: 'none',
  idempotencyKey: `matrix-${randomUUID()}`,
});

/** A booking 18 days ahead inside the sugarhouse hours, on a fresh evaporator of the acting co-op. */
const slotBody = async (fx: Fixtures, householdId: string) => {
  const start = future(18, 9);
  return { evaporatorId: await evaporator(fx.own.coop), householdId, startsAt: start.toISO(), endsAt: start.plus({ hours: 2 }).toISO() };
};

/** A one-pixel PNG: the smallest real image. */
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

const memberSeesOwnHousehold = (body: unknown, actor: Actor, fx: Fixtures) => {
  if (actor !== 'member') return;
  for (const lot of body as { householdId: string }[]) expect(lot.householdId).toBe(fx.own.brennan);
};

const TABLE: Case[] = [
  // Reads of the co-op's collections.
  { route: 'GET /api/deliveries', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/deliveries' }), check: memberSeesOwnHousehold },
  { route: 'GET /api/display-links', scope: 'co-op', expect: coordinatorOnly(200), request: async () => ({ path: '/api/display-links' }) },
  { route: 'GET /api/estimate', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/estimate?volumeL=100&brix=2.5' }) },
  { route: 'GET /api/evaporators', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/evaporators' }) },
  { route: 'GET /api/health', scope: 'co-op', expect: { anonymous: 200, coordinator: 200, sugarmaker: 200, member: 200 }, request: async () => ({ path: '/api/health' }) },
  { route: 'GET /api/households', scope: 'co-op', expect: coordinatorOnly(200), request: async () => ({ path: '/api/households' }) },
  { route: 'GET /api/people', scope: 'co-op', expect: coordinatorOnly(200), request: async () => ({ path: '/api/people' }) },
  { route: 'GET /api/planning', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/planning' }) },
  { route: 'GET /api/queue', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/queue' }) },
  { route: 'GET /api/runs', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/runs' }) },
  { route: 'GET /api/seasons', scope: 'co-op', expect: everyone(200), request: async () => ({ path: '/api/seasons' }) },
  { route: 'GET /api/settings', scope: 'co-op', expect: coordinatorOnly(200), request: async () => ({ path: '/api/settings' }) },
  {
    route: 'GET /api/slots',
    scope: 'co-op',
    expect: everyone(200),
    request: async () => ({ path: `/api/slots?from=${future(-30, 0).toISODate()}&to=${future(30, 0).toISODate()}` }),
  },

  // One record, by whose it is.
  { route: 'GET /api/deliveries/[id]', scope: 'own-household', expect: everyone(200), request: async (f) => ({ path: `/api/deliveries/${await lot(f.own.coop, f.own.brennan)}` }) },
  { route: 'GET /api/deliveries/[id]', scope: 'other-household', expect: staffOnly(200, 404), request: async (f) => ({ path: `/api/deliveries/${await lot(f.own.coop, f.own.szabo)}` }) },
  { route: 'GET /api/deliveries/[id]', scope: 'other-coop', expect: otherCoop(), request: async (f) => ({ path: `/api/deliveries/${await lot(f.other.cooperativeId, f.other.household)}` }) },
  { route: 'GET /api/runs/[id]', scope: 'co-op', expect: everyone(200), request: async (f) => ({ path: `/api/runs/${await run(f.own.coop, f.own.brennan)}` }) },
  { route: 'GET /api/runs/[id]', scope: 'other-coop', expect: otherCoop(), request: async (f) => ({ path: `/api/runs/${await run(f.other.cooperativeId, f.other.household)}` }) },
  { route: 'GET /api/photos/[...key]', scope: 'other-coop', expect: otherCoop(), request: async (f) => ({ path: `/api/photos/${f.other.cooperativeId}/${randomUUID()}.jpg` }) },

  // Writes.
  { route: 'POST /api/deliveries', scope: 'own-household', expect: staffOnly(201), request: async (f) => ({ path: '/api/deliveries', body: deliveryBody(f.own.brennan) }) },
  { route: 'POST /api/deliveries', scope: 'other-household', expect: staffOnly(201), request: async (f) => ({ path: '/api/deliveries', body: deliveryBody(f.own.szabo) }) },
  { route: 'POST /api/deliveries', scope: 'other-coop', expect: otherCoop(['member']), request: async (f) => ({ path: '/api/deliveries', body: deliveryBody(f.other.household) }) },
  {
    route: 'PATCH /api/deliveries/[id]',
    scope: 'co-op',
    expect: staffOnly(200),
    request: async (f) => ({ path: `/api/deliveries/${await lot(f.own.coop, f.own.brennan)}`, body: { volumeL: 310, reason: 'Meter read again.' } }),
  },
  {
    route: 'PATCH /api/deliveries/[id]',
    scope: 'other-coop',
    expect: otherCoop(['sugarmaker', 'member']),
    request: async (f) => ({ path: `/api/deliveries/${await lot(f.other.cooperativeId, f.other.household)}`, body: { volumeL: 310, reason: 'Meter read again.' } }),
  },
  { route: 'POST /api/display-links', scope: 'co-op', expect: coordinatorOnly(201), request: async () => ({ path: '/api/display-links', body: { name: `Screen ${counter++}` } }) },
  { route: 'DELETE /api/display-links/[id]', scope: 'co-op', expect: coordinatorOnly(200), request: async (f) => ({ path: `/api/display-links/${await displayLink(f.own.coop)}` }) },
  {
    route: 'DELETE /api/display-links/[id]',
    scope: 'other-coop',
    expect: otherCoop(['sugarmaker', 'member']),
    request: async (f) => ({ path: `/api/display-links/${await displayLink(f.other.cooperativeId)}` }),
  },
  { route: 'POST /api/households', scope: 'co-op', expect: coordinatorOnly(201), request: async () => ({ path: '/api/households', body: { name: `Matrix household ${randomUUID().slice(0, 8)}` } }) },
  {
    route: 'POST /api/invitations/accept',
    scope: 'co-op',
    expect: { anonymous: [400, 404, 410, 422], coordinator: [400, 404, 410, 422], sugarmaker: [400, 404, 410, 422], member: [400, 404, 410, 422] },
    request: async () => ({ path: '/api/invitations/accept', body: { token: randomBytes(24).toString('hex'), password: 'a-long-enough-password' } }),
  },
  // The signed-in person's own account: everyone acts on themself only. The name is set to what
  // it is, and the password change carries a wrong current password, so the matrix's sessions
  // live on (sign out everywhere ends them: tests/integration/sessions.test.ts covers it, and
  // the signed-out check at the end covers its 401).
  {
    route: 'PATCH /api/account',
    scope: 'co-op',
    expect: everyone(200),
    request: async (_f, actor) => ({ path: '/api/account', body: { name: await ownName(actor) } }),
    check: async (body, actor) => {
      expect(JSON.stringify(body)).toContain(await ownName(actor));
    },
  },
  {
    route: 'POST /api/account/password',
    scope: 'co-op',
    expect: everyone(422),
    request: async () => ({ path: '/api/account/password', body: { currentPassword: 'not-the-password', newPassword: 'a-long-enough-password' } }),
  },
  // Asked for and accepted by people who cannot sign in: the same answer whoever asks, and never
  // whether an address has an account.
  {
    route: 'POST /api/password-resets',
    scope: 'co-op',
    expect: { anonymous: 202, coordinator: 202, sugarmaker: 202, member: 202 },
    request: async () => ({ path: '/api/password-resets', body: { email: `matrix-nobody-${counter++}@larkspur.example` } }),
  },
  {
    route: 'POST /api/password-resets/accept',
    scope: 'co-op',
    expect: { anonymous: [400, 404, 410, 422], coordinator: [400, 404, 410, 422], sugarmaker: [400, 404, 410, 422], member: [400, 404, 410, 422] },
    request: async () => ({ path: '/api/password-resets/accept', body: { token: randomBytes(24).toString('hex'), password: 'a-long-enough-password' } }),
  },
  {
    route: 'POST /api/people',
    scope: 'co-op',
    expect: coordinatorOnly(201),
    request: async () => ({ path: '/api/people', body: { name: 'Matrix Newcomer', email: `matrix-${randomUUID()}@larkspur.example`, role: 'sugarmaker' } }),
  },
  { route: 'PATCH /api/people/[id]', scope: 'co-op', expect: coordinatorOnly(200), request: async (f) => ({ path: `/api/people/${await person(f.own.coop)}`, body: { role: 'coordinator' } }) },
  {
    route: 'PATCH /api/people/[id]',
    scope: 'other-coop',
    expect: otherCoop(['sugarmaker', 'member']),
    request: async (f) => ({ path: `/api/people/${await person(f.other.cooperativeId)}`, body: { role: 'coordinator' } }),
  },
  { route: 'POST /api/runs', scope: 'co-op', expect: staffOnly(201), request: async (f) => ({ path: '/api/runs', body: { evaporatorId: await evaporator(f.own.coop), slotId: null } }) },
  {
    route: 'POST /api/runs',
    scope: 'other-coop',
    expect: otherCoop(['member']),
    request: async (f) => ({ path: '/api/runs', body: { evaporatorId: await evaporator(f.other.cooperativeId), slotId: null } }),
  },
  ...(['inputs', 'draws', 'fuel', 'finish'] as const).flatMap((sub): Case[] => {
    const body = async (coop: string, household: string) =>
      sub === 'inputs' ? { deliveryId: await lot(coop, household), litres: 5 } : sub === 'draws' ? { litres: 2, brix: 66.9, transmittancePct: 60 } : sub === 'fuel' ? { quantity: 0.1 } : {};
    return [
      {
        route: `POST /api/runs/[id]/${sub}`,
        scope: 'co-op',
        expect: staffOnly(sub === 'finish' ? [200, 201] : 201),
        request: async (f) => ({ path: `/api/runs/${await run(f.own.coop, f.own.brennan, { input: sub === 'finish' })}/${sub}`, body: await body(f.own.coop, f.own.brennan) }),
      },
      {
        route: `POST /api/runs/[id]/${sub}`,
        scope: 'other-coop',
        expect: otherCoop(['member']),
        request: async (f) => ({
          path: `/api/runs/${await run(f.other.cooperativeId, f.other.household, { input: sub === 'finish' })}/${sub}`,
          body: await body(f.own.coop, f.own.brennan),
        }),
      },
    ];
  }),
  {
    route: 'PATCH /api/settings',
    scope: 'co-op',
    expect: coordinatorOnly(200),
    // The settings as they are: a valid change that changes nothing.
    request: async () => ({ path: '/api/settings', body: (await clients.coordinator!.get('/api/settings')).body }),
  },
  { route: 'POST /api/slots', scope: 'own-household', expect: everyone(201), request: async (f) => ({ path: '/api/slots', body: await slotBody(f, f.own.brennan) }) },
  { route: 'POST /api/slots', scope: 'other-household', expect: staffOnly(201), request: async (f) => ({ path: '/api/slots', body: await slotBody(f, f.own.szabo) }) },
  { route: 'POST /api/slots', scope: 'other-coop', expect: otherCoop(['member']), request: async (f) => ({ path: '/api/slots', body: await slotBody(f, f.other.household) }) },
  ...(['PATCH', 'DELETE'] as const).flatMap((method): Case[] => {
    const body = method === 'PATCH' ? { note: 'Bring the skimmer.' } : undefined;
    return [
      { route: `${method} /api/slots/[id]`, scope: 'own-household', expect: everyone(200), request: async (f) => ({ path: `/api/slots/${await slot(f.own.coop, f.own.brennan)}`, body }) },
      { route: `${method} /api/slots/[id]`, scope: 'other-household', expect: staffOnly(200), request: async (f) => ({ path: `/api/slots/${await slot(f.own.coop, f.own.szabo)}`, body }) },
      {
        route: `${method} /api/slots/[id]`,
        scope: 'other-coop',
        expect: otherCoop(['member']),
        request: async (f) => ({ path: `/api/slots/${await slot(f.other.cooperativeId, f.other.household)}`, body }),
      },
    ];
  }),
  // The season ledger. Closing and sending act on last year's settled season: refused as done
  // already (409) or a no-op, so the open season other tests use stays open.
  { route: 'GET /api/seasons/[id]/ledger', scope: 'co-op', expect: everyone(200), request: async (f) => ({ path: `/api/seasons/${f.own.season}/ledger` }) },
  { route: 'GET /api/seasons/[id]/ledger', scope: 'other-coop', expect: otherCoop(), request: async (f) => ({ path: `/api/seasons/${f.other.openSeasonId}/ledger` }) },
  // One run's split (last year's settled season): a member sees its own part of a run its sap went into, nothing else.
  {
    route: 'GET /api/seasons/[id]/ledger/runs/[runId]',
    scope: 'own-household',
    expect: everyone(200),
    request: async (f) => ({ path: `/api/seasons/${f.own.lastSeason}/ledger/runs/${await runWith(f.own.lastSeason, f.own.brennan, true)}` }),
    check: (body, actor, f) => {
      const ids = (body as { allocations: { householdId: string }[] }).allocations.map((a) => a.householdId);
      expect(ids).toContain(f.own.brennan);
      if (actor === 'member') expect(ids).toEqual([f.own.brennan]);
    },
  },
  {
    route: 'GET /api/seasons/[id]/ledger/runs/[runId]',
    scope: 'other-household',
    expect: staffOnly(200, 404),
    request: async (f) => ({ path: `/api/seasons/${f.own.lastSeason}/ledger/runs/${await runWith(f.own.lastSeason, f.own.brennan, false)}` }),
  },
  {
    route: 'GET /api/seasons/[id]/ledger/runs/[runId]',
    scope: 'other-coop',
    expect: otherCoop(),
    request: async (f) => {
      const [r] = await rows<{ run: string; season: string }>('SELECT run_id AS run, season_id AS season FROM allocations WHERE cooperative_id = :coop LIMIT 1', { coop: f.other.cooperativeId });
      return { path: `/api/seasons/${r?.season ?? f.other.openSeasonId}/ledger/runs/${r?.run ?? randomUUID()}` };
    },
  },
  {
    route: 'GET /api/seasons/[id]/settlement',
    scope: 'co-op',
    expect: everyone(200),
    request: async (f) => ({ path: `/api/seasons/${f.own.season}/settlement` }),
    check: (body, actor, f) => {
      if (actor === 'member') for (const h of (body as { households: { householdId: string }[] }).households) expect(h.householdId).toBe(f.own.brennan);
    },
  },
  { route: 'GET /api/seasons/[id]/settlement', scope: 'other-coop', expect: otherCoop(), request: async (f) => ({ path: `/api/seasons/${f.other.openSeasonId}/settlement` }) },
  { route: 'POST /api/seasons/[id]/close', scope: 'co-op', expect: coordinatorOnly([200, 409]), request: async (f) => ({ path: `/api/seasons/${f.own.lastSeason}/close`, body: {} }) },
  { route: 'POST /api/seasons/[id]/close', scope: 'other-coop', expect: otherCoop(['sugarmaker', 'member']), request: async (f) => ({ path: `/api/seasons/${f.other.lastSeasonId}/close`, body: {} }) },
  {
    route: 'POST /api/seasons/[id]/settlement/send',
    scope: 'co-op',
    expect: coordinatorOnly([200, 202, 409]),
    request: async (f) => ({ path: `/api/seasons/${f.own.lastSeason}/settlement/send`, body: {} }),
  },
  {
    route: 'POST /api/seasons/[id]/settlement/send',
    scope: 'other-coop',
    expect: otherCoop(['sugarmaker', 'member']),
    request: async (f) => ({ path: `/api/seasons/${f.other.lastSeasonId}/settlement/send`, body: {} }),
  },
  { route: 'PUT /api/seasons/[id]/fees', scope: 'co-op', expect: coordinatorOnly([200, 409]), request: async (f) => ({ path: `/api/seasons/${f.own.season}/fees`, body: { householdId: f.own.szabo, feeCents: 0 } }) },
  {
    route: 'PUT /api/seasons/[id]/fees',
    scope: 'other-coop',
    expect: otherCoop(['sugarmaker', 'member']),
    request: async (f) => ({ path: `/api/seasons/${f.other.openSeasonId}/fees`, body: { householdId: f.other.household, feeCents: 0 } }),
  },
  ...(f_statements()),
  { route: 'POST /api/runs/[id]/reopen', scope: 'other-coop', expect: otherCoop(['sugarmaker', 'member']), request: async (f) => ({ path: `/api/runs/${await run(f.other.cooperativeId, f.other.household)}/reopen`, body: { reason: 'Matrix.' } }) },
  {
    route: 'POST /api/payments/webhook',
    scope: 'co-op',
    // The payment service calls it unsigned by anybody's session: a missing signature is refused.
    expect: { anonymous: 400, coordinator: 400, sugarmaker: 400, member: 400 },
    request: async () => ({ path: '/api/payments/webhook', body: { id: 'evt_matrix', type: 'checkout.session.completed' } }),
  },
  {
    route: 'POST /api/uploads',
    scope: 'co-op',
    expect: staffOnly(201),
    request: async () => {
      const form = new FormData();
      form.set('file', new Blob([PNG], { type: 'image/png' }), 'lot.png');
      return { path: '/api/uploads', form };
    },
  },
];

/** Statements of last year's settled season: the member's household's and another's. */
function f_statements(): Case[] {
  const statement = async (household: string) =>
    (await rows<{ id: string }>('SELECT id FROM settlements WHERE household_id = :household ORDER BY settled_at DESC LIMIT 1', { household }))[0]?.id ?? randomUUID();
  return [
    {
      route: 'GET /api/statements/[id]',
      scope: 'own-household',
      expect: { anonymous: 401, coordinator: 200, sugarmaker: [403, 404], member: 200 },
      request: async (f) => ({ path: `/api/statements/${await statement(f.own.brennan)}` }),
    },
    {
      route: 'GET /api/statements/[id]',
      scope: 'other-household',
      expect: { anonymous: 401, coordinator: 200, sugarmaker: [403, 404], member: [403, 404] },
      request: async (f) => ({ path: `/api/statements/${await statement(f.own.szabo)}` }),
    },
    {
      route: 'POST /api/statements/[id]/payments',
      scope: 'other-household',
      // One cent by cheque: accepted, or refused as more than is owed on a statement already paid.
      expect: { anonymous: 401, coordinator: [201, 409, 422], sugarmaker: [403, 404], member: [403, 404] },
      request: async (f) => ({ path: `/api/statements/${await statement(f.own.szabo)}/payments`, body: { amountCents: 1, method: 'cheque' } }),
    },
    {
      route: 'POST /api/statements/[id]/checkout',
      scope: 'other-household',
      expect: { anonymous: 401, coordinator: [200, 201, 403, 404, 409], sugarmaker: [403, 404], member: [403, 404] },
      request: async (f) => ({ path: `/api/statements/${await statement(f.own.szabo)}/checkout`, body: {} }),
    },
  ];
}

beforeAll(async () => {
  const other = await generateCoop(OTHER_COOP);
  const [own] = await rows<{ coop: string; season: string; evaporator: string }>(
    `SELECT c.id AS coop, s.id AS season, (SELECT id FROM evaporators e WHERE e.cooperative_id = c.id ORDER BY name LIMIT 1) AS evaporator
       FROM cooperatives c JOIN seasons s ON s.cooperative_id = c.id AND s.status = 'open' WHERE c.name = 'Larkspur Hollow Sugar Cooperative'`,
  );
  const households = await rows<{ id: string; name: string }>('SELECT id, name FROM households WHERE cooperative_id = :c', { c: own.coop });
  const [last] = await rows<{ id: string }>("SELECT id FROM seasons WHERE cooperative_id = :c AND status <> 'open' ORDER BY starts_on LIMIT 1", { c: own.coop });
  const [otherHousehold] = await rows<{ id: string }>('SELECT id FROM households WHERE cooperative_id = :c ORDER BY name LIMIT 1', { c: other.cooperativeId });
  const [otherEvaporator] = await rows<{ id: string }>('SELECT id FROM evaporators WHERE cooperative_id = :c LIMIT 1', { c: other.cooperativeId });
  const [otherPerson] = await rows<{ id: string }>('SELECT id FROM users WHERE cooperative_id = :c LIMIT 1', { c: other.cooperativeId });
  // Every id of the other co-op: none may appear in an answer to a Larkspur person.
  const otherIds = await rows<{ id: string }>(
    `SELECT id::text FROM households WHERE cooperative_id = :c UNION ALL SELECT id::text FROM users WHERE cooperative_id = :c
     UNION ALL SELECT id::text FROM sap_deliveries WHERE cooperative_id = :c UNION ALL SELECT id::text FROM boil_runs WHERE cooperative_id = :c
     UNION ALL SELECT id::text FROM boil_slots WHERE cooperative_id = :c UNION ALL SELECT id::text FROM seasons WHERE cooperative_id = :c
     UNION ALL SELECT id::text FROM evaporators WHERE cooperative_id = :c`,
    { c: other.cooperativeId },
  );
  fx = {
    own: {
      coop: own.coop,
      season: own.season,
      lastSeason: last.id,
      evaporator: own.evaporator,
      brennan: households.find((h) => h.name === 'Brennan')!.id,
      szabo: households.find((h) => h.name === 'Szabo')!.id,
    },
    other: { ...other, household: otherHousehold.id, evaporator: otherEvaporator.id, person: otherPerson.id, ids: new Set(otherIds.map((r) => r.id)) },
  };
  clients.anonymous = new Client();
  clients.coordinator = await signedIn(EMAIL.coordinator);
  clients.sugarmaker = await signedIn(EMAIL.sugarmaker);
  clients.member = await signedIn(EMAIL.member);
}, 120_000);

// Leave Larkspur as the other test files expect it: remove what the matrix added there.
afterAll(async () => {
  const c = fx?.own.coop;
  if (c) {
    await rows("DELETE FROM evaporators WHERE cooperative_id = :c AND name LIKE 'Matrix pan %'", { c });
    await rows("DELETE FROM sap_deliveries WHERE cooperative_id = :c AND idempotency_key LIKE 'matrix-%'", { c });
    await rows("DELETE FROM display_links WHERE cooperative_id = :c AND (name = 'Matrix screen' OR name LIKE 'Screen %')", { c });
    await rows("DELETE FROM users WHERE cooperative_id = :c AND email LIKE 'matrix-%'", { c });
    await rows("DELETE FROM households WHERE cooperative_id = :c AND name LIKE 'Matrix household %'", { c });
  }
  await closeTestDb();
});

async function send(client: Client, method: string, req: { path: string; body?: unknown; form?: FormData }) {
  if (!req.form) return client.request(method, req.path, req.body);
  const res = await fetch(`${BASE_URL}${req.path}`, {
    method,
    headers: { origin: BASE_URL, ...(client.cookieHeader ? { cookie: client.cookieHeader } : {}) },
    body: req.form,
  });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    /* not JSON */
  }
  return { status: res.status, body };
}

describe('authorization matrix', () => {
  it('covers every route handler (routes not in the table get the generic checks below)', () => {
    const known = new Set(TABLE.map((c) => c.route));
    const missing = routeHandlers()
      .filter((h) => !/^\/api\/((auth|bench)\/|\[\.\.\.path\])/.test(h.pattern))
      .map((h) => `${h.method} ${h.pattern}`)
      .filter((r) => !known.has(r));
    if (missing.length) console.warn(`authorization matrix: not in the table yet: ${missing.join(', ')}`);
    expect(TABLE.length).toBeGreaterThan(40);
  });

  for (const c of TABLE) {
    it(`${c.route} on ${c.scope}: ${ACTORS.map((a) => `${a} ${[c.expect[a]].flat().join('/')}`).join(', ')}`, async () => {
      const [method] = c.route.split(' ');
      for (const actor of ACTORS) {
        const req = await c.request(fx, actor);
        const res = await send(clients[actor]!, method, req);
        const allowed = [c.expect[actor]].flat();
        expect(allowed, `${actor}: ${method} ${req.path} answered ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`).toContain(res.status);
        if (res.status < 300 && actor !== 'anonymous') {
          const text = JSON.stringify(res.body);
          const leaked = [...fx.other.ids].filter((id) => text.includes(id));
          expect(leaked, `${actor}: ${method} ${req.path} shows the other co-op's records`).toEqual([]);
          await c.check?.(res.body, actor, fx);
        }
      }
    });
  }

  it('every other route answers 401 to a signed-out request', async () => {
    const known = new Set(TABLE.map((c) => c.route));
    for (const h of routeHandlers()) {
      // Password resets are asked for and accepted by people who cannot sign in; /api/[...path]
      // answers every address no route has (404 to anyone, web-security.test.ts).
      if (/^\/api\/(auth\/|bench\/|password-resets|\[\.\.\.path\])/.test(h.pattern) || known.has(`${h.method} ${h.pattern}`)) continue;
      const path = h.pattern.replace(/\[(\.\.\.)?[^\]]+\]/g, randomUUID());
      const res = await clients.anonymous!.request(h.method, path, h.method === 'GET' ? undefined : {});
      expect(res.status, `${h.method} ${path}`).toBe(401);
    }
  });
});
