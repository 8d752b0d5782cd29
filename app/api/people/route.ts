import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { addPerson, listStaff } from '@/lib/households';
import { PersonInput } from '@/lib/validations/households';

/** People without a household (staff); household members come with GET /api/households. */
export const GET = route(async () => {
  const user = await requireRole(['coordinator']);
  return NextResponse.json(await listStaff({ cooperativeId: user.cooperativeId }));
});

export const POST = route(async (req) => {
  const user = await requireRole(['coordinator']);
  const input = PersonInput.parse(await readJson(req));
  return NextResponse.json(await addPerson({ cooperativeId: user.cooperativeId, input }), { status: 201 });
});
