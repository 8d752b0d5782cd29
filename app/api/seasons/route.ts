import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { listSeasons } from '@/lib/coop';

export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json(await listSeasons({ cooperativeId: user.cooperativeId }));
});
