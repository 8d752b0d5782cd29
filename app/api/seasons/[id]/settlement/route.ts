import { route } from '@/lib/server/route';
import { getSettlement } from '@/lib/ledger/service';

/** The season's settlement by sugar; a member gets its own household only. */
export const GET = route<{ id: string }>(async ({ ctx, params }) => getSettlement(ctx, params.id));
