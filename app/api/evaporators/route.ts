import { route } from '@/lib/server/route';
import { listEvaporators } from '@/lib/coop/service';

export const GET = route(async ({ ctx }) => listEvaporators(ctx));
