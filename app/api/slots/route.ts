import { json, readJson, readQuery, jsonText } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { createSlot, slotsJson } from '@/lib/slots/service';
import { SlotInput, SlotQuery } from '@/lib/slots/schema';

export const GET = route(async ({ ctx, req }) => {
  // Nothing was written in this request: the version read with the person may pick a kept list.
  const body = await slotsJson(ctx, readQuery(req, SlotQuery), { knownVersion: ctx.changeVersion });
  return jsonText(body);
});

export const POST = route(async ({ ctx, req }) => json(await createSlot(ctx, await readJson(req, SlotInput)), 201));
