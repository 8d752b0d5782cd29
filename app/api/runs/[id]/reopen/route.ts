import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { contextOf, reopenRun } from '@/lib/ledger/service';
import { ReopenInput } from '@/lib/ledger/schema';

/** A coordinator reopens a finished run; finishing it again recomputes its allocation. */
export const POST = route(async (req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  const input = ReopenInput.parse(await readJson(req));
  return NextResponse.json(await reopenRun(contextOf(user), id, input.reason));
});
