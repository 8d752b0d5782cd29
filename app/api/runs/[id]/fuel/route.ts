import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { addFuel } from '@/lib/runs/service';
import { FuelInput } from '@/lib/runs/schema';

export const POST = route<{ id: string }>(async ({ ctx, req, params }) => json(await addFuel(ctx, params.id, await readJson(req, FuelInput)), 201), {
  roles: ['sugarmaker', 'coordinator'],
});
