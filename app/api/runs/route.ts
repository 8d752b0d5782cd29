import { json, readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { listRuns, startRun } from '@/lib/runs/service';
import { RunsQuery, StartRunInput } from '@/lib/runs/schema';

export const GET = route(async ({ ctx, url }) => listRuns(ctx, RunsQuery.parse({ seasonId: url.searchParams.get('seasonId') ?? undefined })));

export const POST = route(async ({ ctx, req }) => json(await startRun(ctx, await readJson(req, StartRunInput)), 201), {
  roles: ['sugarmaker', 'coordinator'],
});
