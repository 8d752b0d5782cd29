import { NextResponse } from 'next/server';
import { z } from 'zod';
import { requireRole } from '@/lib/auth/session';
import { ApiError, readJson, route } from '@/lib/api/errors';
import { changeRole } from '@/lib/households';
import { RoleChange } from '@/lib/validations/households';

export const PATCH = route<{ params: Promise<{ id: string }> }>(async (req, { params }) => {
  const user = await requireRole(['coordinator']);
  const { id } = await params;
  if (!z.string().uuid().safeParse(id).success) throw new ApiError(404, 'That person was not found in your co-op.');
  const input = RoleChange.parse(await readJson(req));
  return NextResponse.json(await changeRole({ cooperativeId: user.cooperativeId, userId: id, input }));
});
