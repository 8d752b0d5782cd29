import { route } from '@/lib/server/route';
import { notFound } from '@/lib/server/errors';
import { currentSnapshot } from '@/lib/queue/service';

/** The Boil queue; the same JSON the `queue` socket event carries. */
export const GET = route(async ({ ctx }) => {
  const cached = await currentSnapshot(ctx.cooperativeId, ctx.changeVersion);
  if (!cached) throw notFound('Your cooperative');
  return new Response(cached.json, { headers: { 'content-type': 'application/json', 'cache-control': 'no-store' } });
});
