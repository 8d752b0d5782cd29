import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { cancelSlot, updateSlot } from '@/lib/slots/service';
import { SlotPatch } from '@/lib/slots/schema';

export const PATCH = route<{ id: string }>(async ({ ctx, req, params }) => updateSlot(ctx, params.id, await readJson(req, SlotPatch)));

export const DELETE = route<{ id: string }>(async ({ ctx, params }) => cancelSlot(ctx, params.id));
