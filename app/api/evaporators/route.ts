import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { listEvaporators } from '@/lib/coop';

export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json(await listEvaporators({ cooperativeId: user.cooperativeId }));
});
