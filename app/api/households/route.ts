import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { createHousehold, listHouseholds } from '@/lib/households';
import { HouseholdInput } from '@/lib/validations/households';

export const GET = route(async () => {
  const user = await requireRole(['coordinator']);
  return NextResponse.json(await listHouseholds({ cooperativeId: user.cooperativeId }));
});

export const POST = route(async (req) => {
  const user = await requireRole(['coordinator']);
  const input = HouseholdInput.parse(await readJson(req));
  return NextResponse.json(await createHousehold({ cooperativeId: user.cooperativeId, input }), { status: 201 });
});
