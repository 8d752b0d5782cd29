import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { contextOf, setSeasonFee } from '@/lib/ledger/service';
import { FeeInput } from '@/lib/ledger/schema';

/** Sets one household's season fee (coordinator; 0 allowed). */
export const PUT = route(async (req, { params }: { params: Promise<{ id: string }> }) => {
  const user = await requireUser();
  const { id } = await params;
  const input = FeeInput.parse(await readJson(req));
  return NextResponse.json(await setSeasonFee(contextOf(user), id, input.householdId, input.feeCents));
});
