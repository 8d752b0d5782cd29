import { jsonText } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { settlementView } from '@/lib/ledger/service';

/** The season's settlement by sugar; a member gets its own household only. */
export const GET = route<{ id: string }>(async ({ ctx, params }) => {
  // Nothing was written in this request: the version read with the person may pick a kept answer.
  const { json } = await settlementView(ctx, params.id, { knownVersion: ctx.changeVersion });
  return jsonText(json);
});
