import { requireUser } from '@/lib/auth/session';
import { ApiError, route } from '@/lib/api/errors';
import { currentSnapshot } from '@/lib/queue/service';

/** The Boil queue; the same JSON the `queue` socket event carries. */
export const GET = route(async () => {
  const user = await requireUser();
  const cached = await currentSnapshot(user.cooperativeId);
  if (!cached) throw new ApiError(404, 'Your cooperative was not found.');
  return new Response(cached.json, { headers: { 'content-type': 'application/json', 'cache-control': 'no-store' } });
});
