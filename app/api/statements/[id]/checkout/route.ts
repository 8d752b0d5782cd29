import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { contextOf } from '@/lib/ledger/service';
import { startCheckout } from '@/lib/payments/service';

/** Starts paying the statement's balance: `{ url }` of the payment service's checkout page. */
export const POST = route(async (_req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await startCheckout(contextOf(user), id), { status: 201 });
});
