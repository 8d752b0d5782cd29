import { route } from '@/lib/server/route';
import { getPlanning } from '@/lib/planning/service';

export const GET = route(async ({ ctx }) => getPlanning(ctx));
