import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import Stripe from 'stripe';
import { BASE_URL } from '../test-env';
import { signedIn, type Client } from './http';
import { closeTestDb, rows } from './db';
import type { WorkedExample } from './ledger-fixture';
import { closedWorkedExample, statementIds } from './ledger-settle';

// The same secret the server verifies with (scripts/test-env.sh; lib/env.ts default).
const SECRET = process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_brixhouse_local_only';
const signer = new Stripe('sk_test_signing_only');

let ex: WorkedExample;
let coordinator: Client;
let ids: Record<'ash' | 'birch' | 'cedar', string>;

function completedEvent(settlementId: string, amount: number, currency = 'usd', eventId = `evt_test_${randomUUID()}`) {
  posted.push(eventId);
  return JSON.stringify({
    id: eventId,
    object: 'event',
    type: 'checkout.session.completed',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: { object: { id: `cs_test_${randomUUID()}`, object: 'checkout.session', amount_total: amount, currency, client_reference_id: settlementId, metadata: { settlementId, cooperativeId: ex.cooperativeId }, payment_status: 'paid', status: 'complete' } },
  });
}

const post = (payload: string, secret = SECRET) =>
  fetch(`${BASE_URL}/api/payments/webhook`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'stripe-signature': signer.webhooks.generateTestHeaderString({ payload, secret }) },
    body: payload,
  });

// Only this co-op's payments and the events these tests post: other tests' webhooks may land meanwhile.
const posted: string[] = [];
const counts = async () => {
  const [p] = await rows<{ n: string }>(`SELECT count(*) AS n FROM payments WHERE cooperative_id = :c`, { c: ex.cooperativeId });
  const [e] = posted.length ? await rows<{ n: string }>(`SELECT count(*) AS n FROM payment_events WHERE event_id IN (:ids)`, { ids: posted }) : [{ n: '0' }];
  return { payments: Number(p.n), events: Number(e.n) };
};

beforeAll(async () => {
  ({ ex, coordinator } = await closedWorkedExample());
  expect((await coordinator.post(`/api/seasons/${ex.seasonId}/settlement/send`)).body).toEqual({ queued: 3 });
  ids = await statementIds(ex);
}, 240_000);

afterAll(closeTestDb);

describe('the payment webhook', () => {
  it('refuses a wrong signature (400) and changes nothing', async () => {
    const before = await counts();
    const res = await post(completedEvent(ids.ash, 12912), 'whsec_not_the_right_one');
    expect(res.status).toBe(400);
    expect((await res.json()).error.code).toBe('invalid_signature');
    const unsigned = await fetch(`${BASE_URL}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: completedEvent(ids.ash, 12912) });
    expect(unsigned.status).toBe(400);
    expect(await counts()).toEqual(before);
  });

  it('refuses an amount that does not match the statement, writing nothing', async () => {
    const before = await counts();
    const res = await post(completedEvent(ids.ash, 12911));
    expect(res.status).toBe(422);
    expect((await res.json()).error.code).toBe('amount_mismatch');
    expect((await post(completedEvent(ids.ash, 12912, 'cad'))).status).toBe(422);
    expect(await counts()).toEqual(before);
  });

  it('pays once for a good event, and a replay does not pay twice', async () => {
    const before = await counts();
    const payload = completedEvent(ids.ash, 12912);
    expect((await post(payload)).status).toBe(200);
    const replay = await post(payload);
    expect(replay.status).toBe(200);
    expect((await replay.json()).duplicate).toBe(true);
    expect(await counts()).toEqual({ payments: before.payments + 1, events: before.events + 1 });
    const ash = await signedIn(ex.emails.ash);
    const st = (await ash.get(`/api/statements/${ids.ash}`)).body;
    expect(st).toMatchObject({ dueCents: 12912, paidCents: 12912, balanceCents: 0, paid: true });
    expect((await coordinator.get(`/api/seasons/${ex.seasonId}/ledger`)).body.households.find((h: { name: string }) => h.name === 'Ash')).toMatchObject({ paidCents: 12912, balanceCents: 0 });
    // Nothing left to pay: a new checkout is refused.
    expect((await ash.post(`/api/statements/${ids.ash}/checkout`)).status).toBe(409);
  });
});

describe('paying through the checkout of the payment service (local stand-in)', () => {
  it('pay link → checkout session → hosted page → signed webhook → statement paid', async () => {
    const birch = await signedIn(ex.emails.birch);
    const started = await birch.post(`/api/statements/${ids.birch}/checkout`);
    expect(started.status).toBe(201);
    expect(started.body.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/checkout\/cs_test_/);
    const page = await fetch(started.body.url);
    expect(await page.text()).toContain('Pay $53.71');
    const confirmed = await fetch(`${started.body.url}/confirm`, { method: 'POST', redirect: 'manual' });
    expect(confirmed.status).toBe(303);
    expect(confirmed.headers.get('location')).toBe(`${BASE_URL}/statements/${ids.birch}?paid=1`);
    expect((await birch.get(`/api/statements/${ids.birch}`)).body).toMatchObject({ paidCents: 5371, balanceCents: 0, paid: true });
    const [p] = await rows<{ method: string; checkout_session_id: string }>(`SELECT method, checkout_session_id FROM payments WHERE settlement_id = :s`, { s: ids.birch });
    expect(p.method).toBe('card');
    expect(p.checkout_session_id).toBe(started.body.sessionId);
  });

  it('keeps other households’ statements out of reach', async () => {
    const birch = await signedIn(ex.emails.birch);
    expect((await birch.get(`/api/statements/${ids.cedar}`)).status).toBe(404);
    expect((await birch.post(`/api/statements/${ids.cedar}/checkout`)).status).toBe(404);
    const demo = await signedIn('coordinator@larkspur.example');
    expect((await demo.get(`/api/statements/${ids.cedar}`)).status).toBe(404);
  });
});

describe('a payment by cheque or cash', () => {
  it('is recorded by a coordinator, never past the balance', async () => {
    const cedar = await signedIn(ex.emails.cedar);
    expect((await cedar.post(`/api/statements/${ids.cedar}/payments`, { amountCents: 1000, method: 'cash' })).status).toBe(403);
    expect((await coordinator.post(`/api/statements/${ids.cedar}/payments`, { amountCents: -5, method: 'cash' })).status).toBe(422);
    const over = await coordinator.post(`/api/statements/${ids.cedar}/payments`, { amountCents: 6218, method: 'cheque' });
    expect(over.status).toBe(422);
    expect(over.body.error.fields.amountCents).toBeTruthy();
    const part = await coordinator.post(`/api/statements/${ids.cedar}/payments`, { amountCents: 5000, method: 'cheque', reference: 'Cheque 0412' });
    expect(part.status).toBe(201);
    expect(part.body.statement).toMatchObject({ paidCents: 5000, balanceCents: 1217, paid: false });
    const rest = await coordinator.post(`/api/statements/${ids.cedar}/payments`, { amountCents: 1217, method: 'cash' });
    expect(rest.body.statement.paid).toBe(true);
  });
});
