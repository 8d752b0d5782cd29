import { route } from '@/lib/server/route';
import { listEvaporators } from '@/lib/coop';

export const GET = route(async ({ ctx }) => listEvaporators(ctx));
