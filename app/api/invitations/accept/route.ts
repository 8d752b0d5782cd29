import { NextResponse } from 'next/server';
import bcrypt from 'bcryptjs';
import { readJson, route } from '@/lib/api/errors';
import { acceptInvitation } from '@/lib/households';
import { AcceptInvitation } from '@/lib/validations/households';

export const POST = route(async (req) => {
  const input = AcceptInvitation.parse(await readJson(req));
  const passwordHash = await bcrypt.hash(input.password, 10);
  return NextResponse.json(await acceptInvitation({ token: input.token, passwordHash }));
});
