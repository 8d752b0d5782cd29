import NextAuth from 'next-auth';
import { authOptions } from '@/lib/auth/options';
import { clientIp } from '@/lib/security/client-ip';
import { assertNotLocked, recordFailure, TooManyAttemptsError, tooManyAttemptsResponse } from '@/lib/security/rate-limit';
import { appUrl } from '@/lib/env';
import { guarded } from '@/lib/security/api-guard';

const nextAuth = NextAuth(authOptions);
const handler = (req: Request, ctx: Ctx): Promise<Response> => nextAuth(req, ctx);

interface Ctx {
  params: Promise<{ nextauth: string[] }>;
}

/**
 * next-auth's own routes, with the sign-in limits around the password check: a locked account
 * or address gets 429 and Retry-After before any password is compared, and each failed
 * sign-in counts against both.
 */
async function signInAware(req: Request, ctx: Ctx): Promise<Response> {
  const { nextauth } = await ctx.params;
  if (nextauth.join('/') !== 'callback/credentials') return handler(req, ctx);

  const form = await req.clone().formData().catch(() => null);
  const account = String(form?.get('email') ?? '').trim().toLowerCase() || '(none)';
  const attempt = { account, address: clientIp(req) };
  try {
    await assertNotLocked(attempt);
  } catch (err) {
    if (err instanceof TooManyAttemptsError) return tooManyAttemptsResponse(err, `${appUrl()}/sign-in?error=TooManyAttempts`);
    throw err;
  }
  const res: Response = await handler(req, ctx);
  const signedIn = res.headers.getSetCookie().some((c) => /next-auth\.session-token=[^;]+/.test(c));
  if (!signedIn) await recordFailure(attempt);
  return res;
}

// Behind the API's checks like every route: a sign-in posted from another site is refused.
export const GET = guarded(handler);
export const POST = guarded(signInAware);
