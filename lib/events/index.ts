// Server code only (it talks to the database), but without the 'server-only' marker: server.ts
// and the tests import it under plain Node, where that marker throws.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

/**
 * Typed change events. A write calls `recordChange` inside its transaction: the co-op's change
 * version grows by one when that transaction commits (a deferred trigger, so the co-op row is
 * locked only for the commit itself and versions follow commit order, even across server
 * processes), and once it has committed every listener hears `{ cooperativeId, event }`. A
 * rolled-back write tells nobody and leaves the version.
 */
export type ChangeEvent =
  | { type: 'delivery.accepted'; deliveryId: string; householdId: string }
  | { type: 'delivery.rejected'; deliveryId: string; householdId: string }
  | { type: 'delivery.corrected'; deliveryId: string; householdId: string; revisionId: string }
  | { type: 'slot.booked' | 'slot.moved' | 'slot.cancelled'; slotId: string }
  | { type: 'run.started' | 'run.finished'; runId: string }
  | { type: 'run.input'; runId: string; deliveryId: string }
  | { type: 'run.draw'; runId: string; drawId: string }
  | { type: 'run.fuel'; runId: string; fuelId: string }
  | { type: 'run.reopened'; runId: string }
  | { type: 'season.closed' | 'season.settled'; seasonId: string }
  | { type: 'season.fee'; seasonId: string; householdId: string }
  | { type: 'payment.received' | 'statement.sent'; settlementId: string }
  | { type: 'household.added'; householdId: string }
  | { type: 'person.renamed'; userId: string }
  | { type: 'settings.changed' };

export type ChangeEventType = ChangeEvent['type'];

export interface ChangeNotice<E extends { type: string } = ChangeEvent> {
  cooperativeId: string;
  event: E;
}

export type ChangeListener = (notice: ChangeNotice) => void | Promise<void>;

/** What `recordChange` needs: the acting co-op and the open transaction of the write. */
export interface ChangeContext {
  cooperativeId: string;
  transaction: Transaction;
}

// On globalThis so Next's bundles and server.ts share one set of listeners.
const globalForEvents = globalThis as unknown as { __brixhouseChangeListeners?: Set<ChangeListener> };
const listeners = () => (globalForEvents.__brixhouseChangeListeners ??= new Set());

/** Subscribes to every committed change; returns the unsubscribe function. */
export function onChange(listener: ChangeListener): () => void {
  listeners().add(listener);
  return () => listeners().delete(listener);
}

function sequelizeOf(transaction: Transaction): Sequelize {
  return (transaction as unknown as { sequelize: Sequelize }).sequelize;
}

/**
 * Marks the co-op changed in the caller's transaction: its version grows by one as the
 * transaction commits (once however many changes it records), and after the commit every
 * listener is told. A listener's failure is logged, never thrown at the writer.
 */
export async function recordChange<E extends { type: string } = ChangeEvent>(ctx: ChangeContext, event: E): Promise<void> {
  const { cooperativeId, transaction } = ctx;
  await sequelizeOf(transaction).query(
    'INSERT INTO change_marks (txid, cooperative_id) VALUES (txid_current(), :cooperativeId) ON CONFLICT DO NOTHING',
    { replacements: { cooperativeId }, transaction },
  );
  const notice = { cooperativeId, event } as unknown as ChangeNotice;
  transaction.afterCommit(() => announceChange(notice));
}

/**
 * For a write made of one statement outside a transaction (its own transaction): a step of its
 * `WITH` that marks changed the co-op of every row the step `rows` wrote, so the version grows as
 * that statement commits, and not at all when it wrote nothing. Call `announceChange` once the
 * statement returned rows.
 *
 *   WITH lot AS (INSERT … RETURNING *), marked AS (${changeMarkOf('lot')}) SELECT * FROM lot
 */
export function changeMarkOf(rows: string): string {
  return `INSERT INTO change_marks (txid, cooperative_id) SELECT DISTINCT txid_current(), cooperative_id FROM ${rows} ON CONFLICT DO NOTHING`;
}

/** Tells every listener of a committed change. A listener's failure is logged, never thrown. */
export function announceChange(notice: ChangeNotice): void {
  for (const listener of listeners()) {
    try {
      const r = listener(notice);
      if (r && typeof (r as Promise<void>).catch === 'function') (r as Promise<void>).catch((err) => console.error('change listener failed', err));
    } catch (err) {
      console.error('change listener failed', err);
    }
  }
}

/** The co-op's current change version (0 before its first change). */
export async function currentVersion(sequelize: Sequelize, cooperativeId: string, transaction?: Transaction): Promise<number> {
  const rows = await sequelize.query<{ change_version: string }>('SELECT change_version FROM cooperatives WHERE id = :cooperativeId', {
    replacements: { cooperativeId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return rows.length ? Number(rows[0].change_version) : 0;
}
