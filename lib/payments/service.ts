import 'server-only';
import Stripe from 'stripe';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import { env } from '@/lib/env';
import { recordChange } from '@/lib/events';
import { fail, getStatement, type LedgerContext } from '@/lib/ledger/service';
import { statementUrl } from '@/lib/ledger/statement-mail';
import { paymentClient } from './client';

/**
 * Starts paying a statement's balance: a checkout session on the payment service for exactly the
 * balance, and the address of its hosted page. The household's people and coordinators only.
 */
export async function startCheckout(ctx: LedgerContext, statementId: string): Promise<{ url: string; sessionId: string }> {
  const s = await getStatement(ctx, statementId);
  if (s.balanceCents <= 0) throw fail('conflict', 'nothing_to_pay', 'This statement is paid in full.');
  const session = await paymentClient().checkout.sessions.create({
    mode: 'payment',
    client_reference_id: s.id,
    metadata: { settlementId: s.id, cooperativeId: ctx.cooperativeId },
    line_items: [
      {
        quantity: 1,
        price_data: {
          currency: s.currency.toLowerCase(),
          unit_amount: s.balanceCents,
          product_data: { name: `${s.seasonLabel} statement, ${s.householdName} household` },
        },
      },
    ],
    success_url: `${statementUrl(s.id)}?paid=1`,
    cancel_url: statementUrl(s.id),
  });
  if (!session.url) throw fail('unavailable', 'payment_service', 'The payment service gave no checkout page.');
  return { url: session.url, sessionId: session.id };
}

/**
 * Handles one webhook call of the payment service. The signature is checked against the raw
 * body with the SDK's own verifier (400 when wrong); each event id is recorded once, so a replay
 * changes nothing; a completed checkout must pay exactly the statement's balance, in its
 * currency, or it is refused (422) and nothing is written.
 */
export async function handleWebhook(rawBody: string, signature: string | null): Promise<{ received: true; duplicate?: true }> {
  let event: Stripe.Event;
  try {
    if (!signature) throw new Error('missing signature');
    event = paymentClient().webhooks.constructEvent(rawBody, signature, env().STRIPE_WEBHOOK_SECRET);
  } catch {
    throw fail('bad_request', 'invalid_signature', 'The webhook signature does not match.');
  }
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const recorded = await sequelize.query<{ event_id: string }>(
      `INSERT INTO payment_events (event_id, type) VALUES (:id, :type) ON CONFLICT (event_id) DO NOTHING RETURNING event_id`,
      { replacements: { id: event.id, type: event.type }, type: QueryTypes.SELECT, transaction },
    );
    if (recorded.length === 0) return { received: true as const, duplicate: true as const };
    if (event.type !== 'checkout.session.completed') return { received: true as const };

    const session = event.data.object as Stripe.Checkout.Session;
    const settlementId = session.metadata?.settlementId ?? session.client_reference_id ?? '';
    const cooperativeId = session.metadata?.cooperativeId ?? '';
    if (!/^[0-9a-f-]{36}$/i.test(settlementId) || !/^[0-9a-f-]{36}$/i.test(cooperativeId)) {
      throw fail('invalid', 'unknown_statement', 'The payment names no statement of this co-op.');
    }
    const [st] = await sequelize.query<{ id: string; householdId: string; dueCents: number; currency: string }>(
      `SELECT s.id, s.household_id AS "householdId", s.due_cents AS "dueCents", c.currency
         FROM settlements s JOIN cooperatives c ON c.id = s.cooperative_id
        WHERE s.id = :settlementId AND s.cooperative_id = :cooperativeId FOR UPDATE OF s`,
      { replacements: { settlementId, cooperativeId }, type: QueryTypes.SELECT, transaction },
    );
    if (!st) throw fail('invalid', 'unknown_statement', 'The payment names no statement of this co-op.');
    const [{ paid }] = await sequelize.query<{ paid: string }>(
      `SELECT COALESCE(sum(amount_cents), 0) AS paid FROM payments WHERE settlement_id = :settlementId`,
      { replacements: { settlementId }, type: QueryTypes.SELECT, transaction },
    );
    const balance = st.dueCents - Number(paid);
    if (session.amount_total !== balance || (session.currency ?? '').toUpperCase() !== st.currency) {
      throw fail('invalid', 'amount_mismatch', `The payment (${session.amount_total} ${session.currency}) does not match the statement's balance (${balance} ${st.currency}).`, {
        amount: 'Does not match the balance.',
      });
    }
    await sequelize.query(
      `INSERT INTO payments (cooperative_id, settlement_id, household_id, amount_cents, method, checkout_session_id, paid_at)
       VALUES (:cooperativeId, :settlementId, :householdId, :amount, 'card', :sessionId, now())`,
      { replacements: { cooperativeId, settlementId, householdId: st.householdId, amount: balance, sessionId: session.id }, transaction },
    );
    await sequelize.query(`UPDATE payment_events SET settlement_id = :settlementId WHERE event_id = :id`, {
      replacements: { settlementId, id: event.id },
      transaction,
    });
    await recordChange({ cooperativeId, transaction }, { type: 'payment.received', settlementId });
    return { received: true as const };
  });
}

/** A coordinator records a payment by cheque or cash (never more than the balance). */
export async function recordPayment(
  ctx: LedgerContext,
  statementId: string,
  input: { amountCents: number; method: 'cheque' | 'cash'; reference?: string | null; paidOn?: string | null },
) {
  if (ctx.actor.role !== 'coordinator') throw fail('forbidden', 'forbidden', 'Only a coordinator can record a payment.');
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const s = await getStatement({ ...ctx, transaction }, statementId);
    if (input.amountCents > s.balanceCents) {
      throw fail('invalid', 'over_balance', `That is more than the ${s.balanceCents} cents still owed.`, { amountCents: 'More than the balance.' });
    }
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO payments (cooperative_id, settlement_id, household_id, amount_cents, method, reference, paid_at, recorded_by_id)
       VALUES (:cooperativeId, :settlementId, :householdId, :amount, :method, :reference, COALESCE(CAST(:paidOn AS date)::timestamptz, now()), :actorId)
       RETURNING id`,
      {
        replacements: {
          cooperativeId: ctx.cooperativeId,
          settlementId: s.id,
          householdId: s.householdId,
          amount: input.amountCents,
          method: input.method,
          reference: input.reference?.trim() || null,
          paidOn: input.paidOn ?? null,
          actorId: ctx.actor.userId,
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordChange({ cooperativeId: ctx.cooperativeId, transaction }, { type: 'payment.received', settlementId: s.id });
    return { paymentId: row.id, statement: await getStatement({ ...ctx, transaction }, statementId) };
  });
}
