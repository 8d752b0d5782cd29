import { route } from '@/lib/server/route';
import { sendSettlement } from '@/lib/ledger/service';

/** Settles a closed season and queues each household's statement once (coordinator). */
export const POST = route<{ id: string }>(async ({ ctx, params }) => sendSettlement(ctx, params.id));
