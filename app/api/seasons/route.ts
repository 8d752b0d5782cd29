import { route } from '@/lib/server/route';
import { listSeasons } from '@/lib/coop/service';

export const GET = route(async ({ ctx }) => listSeasons(ctx));
