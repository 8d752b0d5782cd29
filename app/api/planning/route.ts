import { jsonText } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { planningJson } from '@/lib/planning/service';

export const GET = route(async ({ ctx }) => {
  // Nothing was written in this request: the version read with the person may pick a kept strip.
  const body = await planningJson(ctx, { knownVersion: ctx.changeVersion });
  return jsonText(body);
});
