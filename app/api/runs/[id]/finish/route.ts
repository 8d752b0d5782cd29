import { badRequest } from '@/lib/server/errors';
import { route } from '@/lib/server/route';
import { finishRun } from '@/lib/runs/service';
import { FinishInput } from '@/lib/runs/schema';

/** Finishes the run; the body (`{ finishedAt? }`) may be empty. */
export const POST = route<{ id: string }>(
  async ({ ctx, req, params }) => {
    const text = await req.text();
    let body: unknown = {};
    try {
      if (text.trim()) body = JSON.parse(text);
    } catch {
      throw badRequest('The request body must be JSON.');
    }
    return finishRun(ctx, params.id, FinishInput.parse(body));
  },
  { roles: ['sugarmaker', 'coordinator'] },
);
