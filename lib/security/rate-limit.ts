import 'server-only';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getSequelize } from '@/db';
import { TooManyAttemptsError } from './too-many-attempts';

export { TooManyAttemptsError };

/**
 * Sign-in limits, kept in PostgreSQL (table rate_limits) so that every server process counts
 * together. Failures count: 10 wrong passwords for one account within the window lock that
 * account until the window ends; an address gets many more (a sugarhouse of people may share
 * one), so a neighbour's typos never lock out the rest. Invitation and reset links count the
 * same way, keyed by the link.
 */
export const ACCOUNT_FAILURES = 10;

function windowSeconds(): number {
  const v = Number(process.env.SIGN_IN_WINDOW_SECONDS ?? 60);
  return Number.isFinite(v) && v >= 1 ? Math.round(v) : 60;
}
function addressFailures(): number {
  const v = Number(process.env.SIGN_IN_ADDRESS_FAILURES ?? 200);
  return Number.isFinite(v) && v >= 1 ? Math.round(v) : 200;
}

interface Limiters {
  account: RateLimiterPostgres;
  address: RateLimiterPostgres;
}
const globalForLimits = globalThis as unknown as { __brixhouseLimits?: Limiters };

function limiters(): Limiters {
  if (!globalForLimits.__brixhouseLimits) {
    const common = {
      storeClient: getSequelize(),
      storeType: 'sequelize',
      tableName: 'rate_limits',
      tableCreated: true,
      clearExpiredByTimeout: false,
      duration: windowSeconds(),
    };
    globalForLimits.__brixhouseLimits = {
      account: new RateLimiterPostgres({ ...common, keyPrefix: 'signin-account', points: ACCOUNT_FAILURES }),
      address: new RateLimiterPostgres({ ...common, keyPrefix: 'signin-address', points: addressFailures() }),
    };
  }
  return globalForLimits.__brixhouseLimits;
}

/** What is being tried: an account (e-mail, or a link's token hash) from an address. */
export interface Attempt {
  account: string;
  address: string;
}


function secondsLeft(res: RateLimiterRes | null): number {
  return Math.max(1, Math.ceil((res?.msBeforeNext ?? 1000) / 1000));
}

/** Throws TooManyAttemptsError when the account or the address has used up its failures. */
export async function assertNotLocked({ account, address }: Attempt): Promise<void> {
  const l = limiters();
  const [a, b] = await Promise.all([l.account.get(account.toLowerCase()), l.address.get(address)]);
  if (a && a.consumedPoints >= ACCOUNT_FAILURES) throw new TooManyAttemptsError(secondsLeft(a));
  if (b && b.consumedPoints >= addressFailures()) throw new TooManyAttemptsError(secondsLeft(b));
}

/** Counts one failure against the account and the address. */
export async function recordFailure({ account, address }: Attempt): Promise<void> {
  const l = limiters();
  // consume() rejects once the points are gone; the count is kept either way.
  await Promise.allSettled([l.account.consume(account.toLowerCase()), l.address.consume(address)]);
}

/**
 * Runs `fn` under the limits: refused while locked, and a failure (an error for which
 * `isFailure` says so) counts against the account and the address.
 */
export async function underLimits<T>(attempt: Attempt, isFailure: (err: unknown) => boolean, fn: () => Promise<T>): Promise<T> {
  await assertNotLocked(attempt);
  try {
    return await fn();
  } catch (err) {
    if (isFailure(err)) await recordFailure(attempt);
    throw err;
  }
}

/** The 429 answer: the API's error shape, Retry-After, and the address next-auth's client reads. */
export function tooManyAttemptsResponse(err: TooManyAttemptsError, signInUrl?: string): Response {
  return Response.json(
    {
      error: { code: 'too_many_attempts', message: err.message, retryAfterSeconds: err.retryAfterSeconds },
      ...(signInUrl ? { url: signInUrl } : {}),
    },
    { status: 429, headers: { 'Retry-After': String(err.retryAfterSeconds), 'Cache-Control': 'no-store' } },
  );
}
