import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { parseOr422 } from '@/lib/deliveries/validate';
import { readJson, route } from '@/lib/api/errors';
import { DeliveryPatch } from '@/lib/deliveries/schema';
import { correctDelivery, getDelivery } from '@/lib/deliveries/service';

type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, { params }) => {
  const user = await requireUser();
  const { id } = await params;
  return NextResponse.json(await getDelivery({ actor: user, cooperativeId: user.cooperativeId }, id));
});

export const PATCH = route<Ctx>(async (req, { params }) => {
  const user = await requireUser();
  const { id } = await params;
  const patch = parseOr422(DeliveryPatch, await readJson(req));
  return NextResponse.json(await correctDelivery({ actor: user, cooperativeId: user.cooperativeId }, id, patch));
});
