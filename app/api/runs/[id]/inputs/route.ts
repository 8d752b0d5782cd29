import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { addInputs } from '@/lib/runs/service';
import { RunInputsInput } from '@/lib/runs/schema';

export const POST = route<{ id: string }>(async ({ ctx, req, params }) => json(await addInputs(ctx, params.id, await readJson(req, RunInputsInput)), 201), {
  roles: ['sugarmaker', 'coordinator'],
});
