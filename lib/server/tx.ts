import 'server-only';
import { Transaction } from 'sequelize';
import { getSequelize } from '@/db';
import type { Ctx, TxCtx } from './context';
import { isConnectionError, isRetryableTransactionError } from './db-errors';

export interface TxOptions {
  /** Default 'read committed'; 'serializable' where a rule spans rows no lock covers. */
  isolation?: 'read committed' | 'repeatable read' | 'serializable';
  /** Attempts in all for serialization failures and deadlocks (40001, 40P01); default 5. */
  attempts?: number;
  /**
   * The work only reads, or writes in a way that is safe to repeat (an idempotency key, an
   * upsert to the same value): then a lost connection is retried too. Never set it for a write
   * that could land twice.
   */
  idempotent?: boolean;
}

const LEVELS = {
  'repeatable read': Transaction.ISOLATION_LEVELS.REPEATABLE_READ,
  serializable: Transaction.ISOLATION_LEVELS.SERIALIZABLE,
} as const;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
/** 10, 20, 40 … ms, each between half and one and a half of that, so two retriers part ways. */
const backoff = (attempt: number) => 10 * 2 ** (attempt - 1) * (0.5 + Math.random());

/**
 * Runs `fn` in one database transaction, retrying the whole of it on a serialization failure or
 * deadlock a bounded number of times (and on a lost connection when `idempotent`). The context
 * handed to `fn` carries the transaction; pass it to every query and service inside. Called with
 * a context that already has a transaction, it joins that one (the outer call retries).
 *
 *   await withTransaction(ctx, async (tx) => { ...; await Model.create(row, { transaction: tx.transaction }); });
 *   await withTransaction(async (transaction) => ...);   // no acting person (scripts, workers)
 */
export async function withTransaction<T>(fn: (transaction: Transaction) => Promise<T>, opts?: TxOptions): Promise<T>;
export async function withTransaction<C extends Ctx, T>(ctx: C, fn: (ctx: TxCtx<C>) => Promise<T>, opts?: TxOptions): Promise<T>;
export async function withTransaction<C extends Ctx, T>(
  ctxOrFn: C | ((transaction: Transaction) => Promise<T>),
  fnOrOpts?: ((ctx: TxCtx<C>) => Promise<T>) | TxOptions,
  maybeOpts?: TxOptions,
): Promise<T> {
  const bare = typeof ctxOrFn === 'function';
  const opts = (bare ? fnOrOpts : maybeOpts) as TxOptions | undefined;
  const body = bare
    ? (t: Transaction) => (ctxOrFn as (t: Transaction) => Promise<T>)(t)
    : (t: Transaction) => (fnOrOpts as (ctx: TxCtx<C>) => Promise<T>)({ ...(ctxOrFn as C), transaction: t });
  if (!bare && (ctxOrFn as C).transaction) return body((ctxOrFn as C).transaction!);

  const attempts = opts?.attempts ?? 5;
  // Read committed is every session's default (db/index.ts): asking for it again would cost a
  // SET TRANSACTION round trip on every write.
  const level = opts?.isolation ?? 'read committed';
  const isolationLevel = level === 'read committed' ? undefined : LEVELS[level];
  const sequelize = getSequelize();
  for (let attempt = 1; ; attempt++) {
    try {
      return await sequelize.transaction({ isolationLevel }, body);
    } catch (err) {
      const again = isRetryableTransactionError(err) || (opts?.idempotent === true && isConnectionError(err));
      if (!again || attempt >= attempts) throw err;
      await sleep(backoff(attempt));
    }
  }
}

/** Runs `fn` after the context's transaction commits (at once when there is none): broadcasts, wake-ups. */
export function afterCommit(ctx: Ctx | Transaction | undefined, fn: () => void | Promise<void>) {
  const t = ctx instanceof Transaction ? ctx : ctx?.transaction;
  const run = () => void Promise.resolve().then(fn).catch((err) => console.error('after commit:', err));
  if (t) t.afterCommit(run);
  else run();
}
