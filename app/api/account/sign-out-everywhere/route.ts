import { route } from '@/lib/server/route';
import { signOutEverywhere } from '@/lib/households/service';

/** Ends every session of the signed-in person, this one included. */
export const POST = route(async ({ ctx }) => {
  await signOutEverywhere(ctx);
  return { ok: true };
});
