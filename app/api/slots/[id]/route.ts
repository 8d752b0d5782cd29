import { NextResponse } from 'next/server';
import { z } from 'zod';
import { requireUser } from '@/lib/auth/session';
import { ApiError, readJson, route } from '@/lib/api/errors';
import { cancelSlot, updateSlot } from '@/lib/slots';
import { SlotPatch } from '@/lib/validations/slots';

type Ctx = { params: Promise<{ id: string }> };

async function slotId(params: Ctx['params']) {
  const { id } = await params;
  if (!z.string().uuid().safeParse(id).success) throw new ApiError(404, 'That boil slot was not found.');
  return id;
}

export const PATCH = route<Ctx>(async (req, { params }) => {
  const user = await requireUser();
  const id = await slotId(params);
  const patch = SlotPatch.parse(await readJson(req));
  return NextResponse.json(await updateSlot({ user, id, patch }));
});

export const DELETE = route<Ctx>(async (_req, { params }) => {
  const user = await requireUser();
  const id = await slotId(params);
  return NextResponse.json(await cancelSlot({ user, id }));
});
