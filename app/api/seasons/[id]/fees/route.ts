import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { setSeasonFee } from '@/lib/ledger/service';
import { FeeInput } from '@/lib/ledger/schema';

/** Sets one household's season fee (coordinator; 0 allowed). */
export const PUT = route<{ id: string }>(async ({ ctx, req, params }) => {
  const input = await readJson(req, FeeInput);
  return setSeasonFee(ctx, params.id, input.householdId, input.feeCents);
});
