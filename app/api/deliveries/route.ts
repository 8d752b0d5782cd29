import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { parseOr422 } from '@/lib/deliveries/validate';
import { readJson, route } from '@/lib/api/errors';
import { DeliveryInput, DeliveryQuery } from '@/lib/deliveries/schema';
import { createDelivery, listDeliveries } from '@/lib/deliveries/service';

export const GET = route(async (req) => {
  const user = await requireUser();
  const q = parseOr422(DeliveryQuery, Object.fromEntries(new URL(req.url).searchParams));
  return NextResponse.json(await listDeliveries({ actor: user, cooperativeId: user.cooperativeId }, q));
});

/** 201 with the new lot; 200 with the first lot when the idempotency key was seen before. */
export const POST = route(async (req) => {
  const user = await requireUser();
  const body = await readJson(req);
  const input = parseOr422(DeliveryInput, body);
  const { lot, created } = await createDelivery({ actor: user, cooperativeId: user.cooperativeId }, input);
  return NextResponse.json(lot, { status: created ? 201 : 200 });
});
