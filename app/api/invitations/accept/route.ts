import { readJson } from '@/lib/server/http';
import { publicRoute } from '@/lib/server/route';
import { isAppError } from '@/lib/server/errors';
import { acceptInvitation, findUsableInvitation, sha256 } from '@/lib/households/service';
import { hashPassword } from '@/lib/account/service';
import { AcceptInvitation } from '@/lib/households/schema';
import { clientIp } from '@/lib/security/client-ip';
import { underLimits } from '@/lib/security/rate-limit';

export const POST = publicRoute(async ({ req }) => {
  const input = await readJson(req, AcceptInvitation);
  return underLimits(
    { account: `invite:${sha256(input.token)}`, address: clientIp(req) },
    (err) => isAppError(err) && err.kind === 'not_found',
    async () => {
      // The link is checked before any work goes into hashing the password.
      await findUsableInvitation(input.token);
      return acceptInvitation({ token: input.token, passwordHash: await hashPassword(input.password) });
    },
  );
});
