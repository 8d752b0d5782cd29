import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { getPlanning } from '@/lib/planning-data';

export const GET = route(async () => {
  const user = await requireUser();
  return NextResponse.json(await getPlanning({ cooperativeId: user.cooperativeId }));
});
