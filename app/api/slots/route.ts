import { json, readJson, readQuery } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { createSlot, listSlots } from '@/lib/slots/service';
import { SlotInput, SlotQuery } from '@/lib/slots/schema';

export const GET = route(async ({ ctx, req }) => listSlots(ctx, readQuery(req, SlotQuery)));

export const POST = route(async ({ ctx, req }) => json(await createSlot(ctx, await readJson(req, SlotInput)), 201));
