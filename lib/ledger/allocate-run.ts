import type { Transaction } from 'sequelize';

/** What the allocation needs: the acting co-op and the open transaction of the finish. */
export interface AllocateRunContext {
  cooperativeId: string;
  transaction: Transaction;
  actor?: { id: string; role: string };
}

/**
 * Allocates a finished run's syrup and fuel to the households whose sap went in, inside the
 * finish's transaction.
 *
 * PLACEHOLDER for the season ledger: it does nothing yet. The ledger replaces this body with the
 * per-run allocation (Allocation rows by sugar through lib/sugar `allocateRun`); the Runs
 * service already calls it at the one place a run finishes.
 */
export async function allocateRun(ctx: AllocateRunContext, runId: string): Promise<void> {
  void ctx;
  void runId;
}
