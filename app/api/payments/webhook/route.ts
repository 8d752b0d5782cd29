import { publicRoute } from '@/lib/server/route';
import { handleWebhook } from '@/lib/payments/service';

/** The payment service's webhook: signed events, each handled once. */
export const POST = publicRoute(async ({ req }) => handleWebhook(await req.text(), req.headers.get('stripe-signature')));
