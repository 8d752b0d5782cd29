import { DeliveryPatch } from '@/lib/deliveries/schema';
import { correctDelivery, getDelivery } from '@/lib/deliveries/service';
import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';

export const GET = route<{ id: string }>(async ({ ctx, params }) => getDelivery(ctx, params.id));

export const PATCH = route<{ id: string }>(async ({ ctx, req, params }) => correctDelivery(ctx, params.id, await readJson(req, DeliveryPatch)));
