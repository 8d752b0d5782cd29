import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { closeSeason, contextOf } from '@/lib/ledger/service';

/** Closes a season (coordinator): no more lots or runs. */
export const POST = route(async (_req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await closeSeason(contextOf(user), id));
});
