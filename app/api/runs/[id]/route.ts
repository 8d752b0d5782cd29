import { route } from '@/lib/server/route';
import { getRun } from '@/lib/runs/service';

export const GET = route<{ id: string }>(async ({ ctx, params }) => getRun(ctx, params.id));
