// Server code only (it talks to the database), but without the 'server-only' marker: server.ts
// and the tests import it under plain Node, where that marker throws.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

/**
 * Typed change events. A write calls `recordChange` inside its transaction: the co-op's change
 * version grows by one in that same transaction (so versions only grow, even across server
 * processes), and once the transaction commits every listener hears `{ cooperativeId, version,
 * event }`. A rolled-back write tells nobody.
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
  /** The co-op's change version after this change. */
  version: number;
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
 * Bumps the co-op's change version in the caller's transaction and, after commit, tells every
 * listener. Returns the new version. A listener's failure is logged, never thrown at the writer.
 */
export async function recordChange<E extends { type: string } = ChangeEvent>(ctx: ChangeContext, event: E): Promise<number> {
  const { cooperativeId, transaction } = ctx;
  const rows = await sequelizeOf(transaction).query<{ change_version: string }>(
    'UPDATE cooperatives SET change_version = change_version + 1 WHERE id = :cooperativeId RETURNING change_version',
    { replacements: { cooperativeId }, type: QueryTypes.SELECT, transaction },
  );
  if (!rows.length) throw new Error(`recordChange: no cooperative ${cooperativeId}`);
  const version = Number(rows[0].change_version);
  const notice = { cooperativeId, version, event } as unknown as ChangeNotice;
  transaction.afterCommit(() => {
    for (const listener of listeners()) {
      try {
        const r = listener(notice);
        if (r && typeof (r as Promise<void>).catch === 'function') (r as Promise<void>).catch((err) => console.error('change listener failed', err));
      } catch (err) {
        console.error('change listener failed', err);
      }
    }
  });
  return version;
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
