import { route } from '@/lib/server/route';
import { json } from '@/lib/server/http';
import { ledgerRun } from '@/lib/ledger/service';

/** One finished run's split between households (the Season ledger's drill-down). A member sees its own part. */
export const GET = route<{ id: string; runId: string }>(async ({ ctx, params }) => {
  return json(await ledgerRun(ctx, params.id, params.runId));
});
