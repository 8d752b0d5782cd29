import { readJson } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { ChangePasswordInput } from '@/lib/account/schema';
import { changePassword, isWrongPassword } from '@/lib/account/service';
import { clientIp } from '@/lib/security/client-ip';
import { underLimits } from '@/lib/security/rate-limit';

/** Changes the signed-in person's password; a wrong current password counts like a failed sign-in. */
export const POST = route(async ({ ctx, req }) => {
  const input = await readJson(req, ChangePasswordInput);
  await underLimits({ account: ctx.actor.email, address: clientIp(req) }, isWrongPassword, () => changePassword(ctx, input));
  return { ok: true };
});
