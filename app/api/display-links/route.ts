import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { createDisplayLink, listDisplayLinks } from '@/lib/display/service';
import { DisplayLinkInput } from '@/lib/display/schema';

export const GET = route(async () => {
  const user = await requireRole(['coordinator']);
  return NextResponse.json(await listDisplayLinks({ actor: user, cooperativeId: user.cooperativeId }));
});

export const POST = route(async (req) => {
  const user = await requireRole(['coordinator']);
  const input = DisplayLinkInput.parse(await readJson(req));
  return NextResponse.json(await createDisplayLink({ actor: user, cooperativeId: user.cooperativeId }, input), { status: 201 });
});
