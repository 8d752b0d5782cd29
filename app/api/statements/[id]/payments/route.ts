import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { contextOf } from '@/lib/ledger/service';
import { PaymentInput } from '@/lib/ledger/schema';
import { recordPayment } from '@/lib/payments/service';

/** A coordinator records a payment by cheque or cash. */
export const POST = route(async (req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  const input = PaymentInput.parse(await readJson(req));
  return NextResponse.json(await recordPayment(contextOf(user), id, input), { status: 201 });
});
