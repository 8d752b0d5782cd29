import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { getRun } from '@/lib/runs/service';

type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, { params }) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await getRun({ actor: user, cooperativeId: user.cooperativeId }, id));
});
