import { NextResponse } from 'next/server';
import { route } from '@/lib/api/errors';
import { handleWebhook } from '@/lib/payments/service';

/** The payment service's webhook: signed events, each handled once. */
export const POST = route(async (req) => {
  const raw = await req.text();
  return NextResponse.json(await handleWebhook(raw, req.headers.get('stripe-signature')));
});
