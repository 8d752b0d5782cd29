import { json, readJson, readQuery } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { createSlot, listSlots } from '@/lib/slots';
import { SlotInput, SlotQuery } from '@/lib/validations/slots';

export const GET = route(async ({ ctx, req }) => listSlots(ctx, readQuery(req, SlotQuery)));

export const POST = route(async ({ ctx, req }) => json(await createSlot(ctx, await readJson(req, SlotInput)), 201));
