import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { route } from '@/lib/api/errors';
import { revokeDisplayLink } from '@/lib/display/service';

type Ctx = { params: Promise<{ id: string }> };

/** Revokes the link (it stays listed as revoked). */
export const DELETE = route<Ctx>(async (_req, { params }) => {
  const user = await requireRole(['coordinator']);
  const { id } = await params;
  return NextResponse.json(await revokeDisplayLink({ actor: user, cooperativeId: user.cooperativeId }, id));
});
