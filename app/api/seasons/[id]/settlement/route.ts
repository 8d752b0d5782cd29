import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { contextOf, getSettlement } from '@/lib/ledger/service';

/** The season's settlement by sugar; a member gets its own household only. */
export const GET = route(async (_req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await getSettlement(contextOf(user), id));
});
