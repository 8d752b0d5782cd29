import { json, readJson } from '@/lib/server/http';
import { publicRoute } from '@/lib/server/route';
import { ForgotPasswordInput } from '@/lib/account/schema';
import { requestPasswordReset } from '@/lib/account/service';

/** Asks for a reset link; the answer is the same whether or not the address has an account. */
export const POST = publicRoute(async ({ req }) => {
  await requestPasswordReset(await readJson(req, ForgotPasswordInput));
  return json({ ok: true, message: 'If that address has a Brixhouse account, a link to choose a new password is on its way.' }, 202);
});
