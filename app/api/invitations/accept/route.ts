import bcrypt from 'bcryptjs';
import { readJson } from '@/lib/server/http';
import { publicRoute } from '@/lib/server/route';
import { acceptInvitation } from '@/lib/households/service';
import { AcceptInvitation } from '@/lib/households/schema';

export const POST = publicRoute(async ({ req }) => {
  const input = await readJson(req, AcceptInvitation);
  const passwordHash = await bcrypt.hash(input.password, 10);
  return acceptInvitation({ token: input.token, passwordHash });
});
