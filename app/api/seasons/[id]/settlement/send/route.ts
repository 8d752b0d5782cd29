import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { contextOf, sendSettlement } from '@/lib/ledger/service';

/** Settles a closed season and queues each household's statement once (coordinator). */
export const POST = route(async (_req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await sendSettlement(contextOf(user), id));
});
