/**
 * @deprecated The first shape of the session helpers, kept so code written against it keeps
 * working while it moves to requireContext() from lib/server/context. The person now comes from
 * the database on every call (role, household and cooperative as they are now; a stale or
 * deleted person's token answers 401), never from the session token.
 */
import 'server-only';
import type { Role } from '@/lib/roles';
import { optionalContext, requireContext, type PersonCtx } from '@/lib/server/context';

/** @deprecated Use PersonCtx / PersonActor. */
export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
  cooperativeId: string;
  householdId: string | null;
}

type OnFail = 'throw' | 'redirect';

const toUser = ({ actor, cooperativeId }: PersonCtx): SessionUser => ({
  id: actor.userId,
  name: actor.name,
  email: actor.email,
  role: actor.role,
  cooperativeId,
  householdId: actor.householdId,
});

/** @deprecated Use requireContext(). */
export async function requireUser({ onFail = 'throw' }: { onFail?: OnFail } = {}): Promise<SessionUser> {
  return toUser(await requireContext({ onFail }));
}

/** @deprecated Use requireContext({ roles }). */
export async function requireRole(roles: readonly Role[], { onFail = 'throw' }: { onFail?: OnFail } = {}): Promise<SessionUser> {
  return toUser(await requireContext({ roles, onFail }));
}

/** @deprecated Use optionalContext(). */
export async function optionalUser(): Promise<SessionUser | null> {
  const ctx = await optionalContext();
  return ctx ? toUser(ctx) : null;
}
