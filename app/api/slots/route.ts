import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { createSlot, listSlots } from '@/lib/slots';
import { SlotInput, SlotQuery } from '@/lib/validations/slots';

export const GET = route(async (req) => {
  const user = await requireUser();
  const url = new URL(req.url);
  const q = SlotQuery.parse({ from: url.searchParams.get('from') ?? undefined, to: url.searchParams.get('to') ?? undefined });
  return NextResponse.json(await listSlots({ user, from: q.from, to: q.to }));
});

export const POST = route(async (req) => {
  const user = await requireUser();
  const input = SlotInput.parse(await readJson(req));
  return NextResponse.json(await createSlot({ user, input }), { status: 201 });
});
