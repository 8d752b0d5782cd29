import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { reopenRun } from '@/lib/ledger/service';
import { ReopenInput } from '@/lib/ledger/schema';

/** A coordinator reopens a finished run; finishing it again recomputes its allocation. */
export const POST = route<{ id: string }>(async ({ ctx, req, params }) => reopenRun(ctx, params.id, (await readJson(req, ReopenInput)).reason));
