import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { PaymentInput } from '@/lib/ledger/schema';
import { recordPayment } from '@/lib/payments/service';

/** A coordinator records a payment by cheque or cash. */
export const POST = route<{ id: string }>(async ({ ctx, req, params }) => json(await recordPayment(ctx, params.id, await readJson(req, PaymentInput)), 201));
