import 'server-only';
import type { Transaction } from 'sequelize';
import { cache } from 'react';
import { decode, getToken, type JWT, type JWTDecodeParams } from 'next-auth/jwt';
import { redirect } from 'next/navigation';
import { cookies, headers } from 'next/headers';
import { env } from '@/lib/env';
import type { Role } from '@/lib/roles';
import { type Actor, type DisplayActor, type PersonActor, hasRole } from './actor';
import { forbidden, unauthenticated } from './errors';
import { personFromClaims } from './person';

export type { Actor, PersonActor, SystemActor, DisplayActor } from './actor';

/**
 * One request context, passed to every service: who acts, in which cooperative, and the open
 * transaction when there is one (lib/server/tx.ts adds it).
 */
export interface Ctx<A extends Actor = Actor> {
  actor: A;
  cooperativeId: string;
  transaction?: Transaction;
  /**
   * The co-op's change version when the context was read (people's contexts). A GET route
   * handler may serve an answer cached at this version or later without asking the database
   * again; never use it after a write in the same request (it is from before the write).
   */
  changeVersion?: string;
}
export type PersonCtx = Ctx<PersonActor>;
export type TxCtx<C extends Ctx = Ctx> = C & { transaction: Transaction };

/** What getToken needs to find the session cookie: a request, or the cookies and headers of one. */
type TokenSource = Parameters<typeof getToken>[0]['req'];

async function currentRequest(): Promise<TokenSource> {
  const [c, h] = await Promise.all([cookies(), headers()]);
  return { cookies: c, headers: h } as unknown as TokenSource;
}

/**
 * The signed-in person's context, read fresh from the database (role, household, cooperative);
 * null when signed out, the person no longer exists, or their sessions were ended.
 */
export async function optionalContext(req?: Request): Promise<PersonCtx | null> {
  return req ? contextFrom(req as unknown as TokenSource) : renderContext();
}

// Decrypted session tokens by their text, until they expire: a token is immutable, so decrypting
// it again on every request (a key derivation and a decryption) would only repeat the same answer.
// Who the token speaks for is still read fresh from the database on every request.
const decoded = new Map<string, { claims: JWT; until: number }>();
const DECODED_MAX = 5_000;
const DECODED_TTL_MS = 5 * 60_000;
let decodedWith: JWTDecodeParams['secret'] | undefined;

async function cachedDecode(params: JWTDecodeParams): Promise<JWT | null> {
  const { token, secret } = params;
  if (!token) return null;
  if (secret !== decodedWith) {
    decoded.clear();
    decodedWith = secret;
  }
  const now = Date.now();
  const hit = decoded.get(token);
  if (hit && hit.until > now) return hit.claims;
  const claims = await decode(params);
  if (claims) {
    const exp = typeof claims.exp === 'number' ? claims.exp * 1000 : Infinity;
    if (decoded.size >= DECODED_MAX) decoded.clear();
    decoded.set(token, { claims, until: Math.min(exp, now + DECODED_TTL_MS) });
  }
  return claims;
}

async function contextFrom(source: TokenSource): Promise<PersonCtx | null> {
  const claims = await getToken({ req: source, secret: env().NEXTAUTH_SECRET, decode: cachedDecode });
  return personFromClaims(claims);
}

// A layout and its page share one lookup per render.
const renderContext = cache(async () => contextFrom(await currentRequest()));

export interface RequireOptions {
  /** Only these roles may go on (403, or the "not for your role" page). */
  roles?: readonly Role[];
  /** Route handlers and server actions throw (the default); pages and layouts redirect. */
  onFail?: 'throw' | 'redirect';
  /** The route handler's request (saves reading next/headers). */
  req?: Request;
}

/** The signed-in person's context; 401/403 (or a redirect) otherwise. */
export async function requireContext({ roles, onFail = 'throw', req }: RequireOptions = {}): Promise<PersonCtx> {
  const ctx = await optionalContext(req);
  if (!ctx) {
    if (onFail === 'redirect') redirect('/sign-in');
    throw unauthenticated();
  }
  if (roles && !hasRole(ctx.actor, roles)) {
    if (onFail === 'redirect') redirect('/not-allowed');
    throw forbidden(`This is for ${roles.map((r) => `${r}s`).join(' and ')} only.`, 'role_not_allowed');
  }
  return ctx;
}

/** The application acting on its own for one cooperative (workers, jobs, seeds). */
export const systemContext = (cooperativeId: string, transaction?: Transaction): Ctx => ({
  actor: { kind: 'system' },
  cooperativeId,
  ...(transaction ? { transaction } : {}),
});

/** A sugarhouse display acting through its link (the display feature resolves the link). */
export const displayContext = (displayLinkId: string, cooperativeId: string): Ctx<DisplayActor> => ({
  actor: { kind: 'display', displayLinkId },
  cooperativeId,
});

/** The acting person's id, or null for the system or a display (for columns like booked_by_id). */
export const actorUserId = (ctx: Ctx): string | null => (ctx.actor.kind === 'person' ? ctx.actor.userId : null);
