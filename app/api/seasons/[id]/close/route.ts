import { route } from '@/lib/server/route';
import { closeSeason } from '@/lib/ledger/service';

/** Closes a season (coordinator): no more lots or runs. */
export const POST = route<{ id: string }>(async ({ ctx, params }) => closeSeason(ctx, params.id));
