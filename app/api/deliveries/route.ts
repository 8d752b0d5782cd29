import { DeliveryInput, DeliveryQuery } from '@/lib/deliveries/schema';
import { createDelivery, deliveriesJson } from '@/lib/deliveries/service';
import { json, readJson, readQuery, jsonText } from '@/lib/server/http';
import { route } from '@/lib/server/route';

export const GET = route(async ({ ctx, req }) => {
  // Nothing was written in this request: the version read with the person may pick a kept list.
  const body = await deliveriesJson(ctx, readQuery(req, DeliveryQuery), { knownVersion: ctx.changeVersion });
  return jsonText(body);
});

/** 201 with the new lot; 200 with the first lot when the idempotency key was seen before. */
export const POST = route(async ({ ctx, req }) => {
  const { lot, created } = await createDelivery(ctx, await readJson(req, DeliveryInput));
  return json(lot, created ? 201 : 200);
});
