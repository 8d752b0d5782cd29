import { readJson } from '@/lib/server/http';
import { publicRoute } from '@/lib/server/route';
import { isAppError } from '@/lib/server/errors';
import { ResetPasswordInput } from '@/lib/account/schema';
import { assertUsableReset, hashPassword, resetPassword, tokenHash } from '@/lib/account/service';
import { clientIp } from '@/lib/security/client-ip';
import { underLimits } from '@/lib/security/rate-limit';

/** Sets a new password from a one-time reset link. */
export const POST = publicRoute(async ({ req }) => {
  const input = await readJson(req, ResetPasswordInput);
  return underLimits(
    { account: `reset:${tokenHash(input.token)}`, address: clientIp(req) },
    (err) => isAppError(err) && err.kind === 'not_found',
    async () => {
      // The link is checked before any work goes into hashing the password.
      await assertUsableReset(input.token);
      return resetPassword(input, await hashPassword(input.password));
    },
  );
});
