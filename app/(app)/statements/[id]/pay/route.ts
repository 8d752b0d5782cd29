import { NextResponse } from 'next/server';
import { optionalContext } from '@/lib/server/context';
import { errorResponse } from '@/lib/server/http';
import { startCheckout } from '@/lib/payments/service';

/**
 * The pay link of the statement e-mail: after sign-in, straight to the payment service's page
 * for the statement's balance.
 */
export async function GET(req: Request, { params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const url = new URL(req.url);
  const ctx = await optionalContext(req);
  if (!ctx) {
    const signIn = new URL('/sign-in', url);
    signIn.searchParams.set('callbackUrl', `/statements/${id}/pay`);
    return NextResponse.redirect(signIn, 303);
  }
  try {
    const { url: checkout } = await startCheckout(ctx, id);
    return NextResponse.redirect(checkout, 303);
  } catch (err) {
    const res = errorResponse(err);
    if (res.status === 409) return NextResponse.redirect(new URL(`/statements/${id}`, url), 303);
    return res;
  }
}
