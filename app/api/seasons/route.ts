import { jsonText } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { seasonsJson } from '@/lib/coop/service';

export const GET = route(async ({ ctx }) => {
  // Nothing was written in this request: the version read with the person may pick a kept list.
  const body = await seasonsJson(ctx, { knownVersion: ctx.changeVersion });
  return jsonText(body);
});
