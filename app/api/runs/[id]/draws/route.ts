import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { addDraw } from '@/lib/runs/service';
import { DrawInput } from '@/lib/runs/schema';

type Ctx = { params: Promise<{ id: string }> };

export const POST = route<Ctx>(async (req, { params }) => {
  const user = await requireRole(['sugarmaker', 'coordinator']);
  const { id } = await params;
  const input = DrawInput.parse(await readJson(req));
  return NextResponse.json(await addDraw({ actor: user, cooperativeId: user.cooperativeId }, id, input), { status: 201 });
});
