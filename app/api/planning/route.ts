import { route } from '@/lib/server/route';
import { getPlanning } from '@/lib/planning-data';

export const GET = route(async ({ ctx }) => getPlanning(ctx));
