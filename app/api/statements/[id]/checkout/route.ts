import { json } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { startCheckout } from '@/lib/payments/service';

/** Starts paying the statement's balance: `{ url }` of the payment service's checkout page. */
export const POST = route<{ id: string }>(async ({ ctx, params }) => json(await startCheckout(ctx, params.id), 201));
