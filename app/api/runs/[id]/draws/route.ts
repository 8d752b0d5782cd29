import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { addDraw } from '@/lib/runs/service';
import { DrawInput } from '@/lib/runs/schema';

export const POST = route<{ id: string }>(async ({ ctx, req, params }) => json(await addDraw(ctx, params.id, await readJson(req, DrawInput)), 201), {
  roles: ['sugarmaker', 'coordinator'],
});
