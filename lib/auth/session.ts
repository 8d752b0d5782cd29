import 'server-only';
import { getServerSession, type Session } from 'next-auth';
import { redirect } from 'next/navigation';
import { authOptions } from './options';
import type { Role } from '@/lib/roles';
import { ApiError } from '@/lib/api/errors';

/** The signed-in person as the session carries them (see types/next-auth.d.ts). */
export type SessionUser = Session['user'];

type OnFail = 'throw' | 'redirect';

/**
 * The signed-in person. In route handlers (the default) a missing session throws a 401
 * ApiError; in layouts and pages pass `{ onFail: 'redirect' }` to go to the sign-in page.
 */
export async function requireUser({ onFail = 'throw' }: { onFail?: OnFail } = {}): Promise<SessionUser> {
  const session = await getServerSession(authOptions);
  if (!session?.user?.id) {
    if (onFail === 'redirect') redirect('/sign-in');
    throw new ApiError(401, 'Please sign in first.');
  }
  return session.user;
}

/** The signed-in person, who must hold one of `roles`; otherwise 403 (or the "not for your role" page). */
export async function requireRole(roles: readonly Role[], { onFail = 'throw' }: { onFail?: OnFail } = {}): Promise<SessionUser> {
  const user = await requireUser({ onFail });
  if (!roles.includes(user.role)) {
    if (onFail === 'redirect') redirect('/not-allowed');
    throw new ApiError(403, `This is for ${roles.map((r) => `${r}s`).join(' and ')} only.`);
  }
  return user;
}

/** The session if there is one, for pages that show differently to signed-in people. */
export async function optionalUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  return session?.user?.id ? session.user : null;
}
