import { NextResponse } from 'next/server';
import { requireRole, requireUser } from '@/lib/auth/session';
import { readJson, route } from '@/lib/api/errors';
import { listRuns, startRun } from '@/lib/runs/service';
import { RunsQuery, StartRunInput } from '@/lib/runs/schema';

export const GET = route(async (req) => {
  const user = await requireUser();
  const q = RunsQuery.parse({ seasonId: new URL(req.url).searchParams.get('seasonId') ?? undefined });
  return NextResponse.json(await listRuns({ actor: user, cooperativeId: user.cooperativeId }, q));
});

export const POST = route(async (req) => {
  const user = await requireRole(['sugarmaker', 'coordinator']);
  const input = StartRunInput.parse(await readJson(req));
  return NextResponse.json(await startRun({ actor: user, cooperativeId: user.cooperativeId }, input), { status: 201 });
});
