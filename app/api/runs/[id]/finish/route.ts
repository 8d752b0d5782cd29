import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/session';
import { ApiError, route } from '@/lib/api/errors';
import { finishRun } from '@/lib/runs/service';
import { FinishInput } from '@/lib/runs/schema';

type Ctx = { params: Promise<{ id: string }> };

/** Finishes the run; the body (`{ finishedAt? }`) may be empty. */
export const POST = route<Ctx>(async (req, { params }) => {
  const user = await requireRole(['sugarmaker', 'coordinator']);
  const { id } = await params;
  const text = await req.text();
  let body: unknown = {};
  try {
    if (text.trim()) body = JSON.parse(text);
  } catch {
    throw new ApiError(400, 'The request body must be JSON.');
  }
  const input = FinishInput.parse(body);
  return NextResponse.json(await finishRun({ actor: user, cooperativeId: user.cooperativeId }, id, input));
});
