import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { createHousehold, listHouseholds } from '@/lib/households/service';
import { HouseholdInput } from '@/lib/households/schema';

export const GET = route(async ({ ctx }) => listHouseholds(ctx), { roles: ['coordinator'] });

export const POST = route(async ({ ctx, req }) => json(await createHousehold(ctx, await readJson(req, HouseholdInput)), 201), {
  roles: ['coordinator'],
});
