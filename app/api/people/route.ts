import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { addPerson, listStaff } from '@/lib/households/service';
import { PersonInput } from '@/lib/households/schema';

/** People without a household (staff); household members come with GET /api/households. */
export const GET = route(async ({ ctx }) => listStaff(ctx), { roles: ['coordinator'] });

export const POST = route(async ({ ctx, req }) => json(await addPerson(ctx, await readJson(req, PersonInput)), 201), { roles: ['coordinator'] });
