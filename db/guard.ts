import type { Sequelize } from 'sequelize';

/** Only databases named like this are emptied without an explicit force. */
export const DISPOSABLE_SUFFIX = '_test';

export class UnsafeDatabaseError extends Error {
  constructor(database: string, action: string) {
    super(
      `Refusing to ${action} the database "${database}": only a database whose name ends in ${DISPOSABLE_SUFFIX} ` +
        'is emptied without --force.',
    );
    this.name = 'UnsafeDatabaseError';
  }
}

/**
 * Throws unless `sequelize` is connected to a disposable (…_test) database or `force` is set;
 * called by every helper that deletes data, so no test or script empties a development or
 * production database by mistake.
 */
export function assertDisposable(sequelize: Sequelize, action: string, { force = false }: { force?: boolean } = {}) {
  const name = sequelize.getDatabaseName();
  if (!force && !name.endsWith(DISPOSABLE_SUFFIX)) throw new UnsafeDatabaseError(name, action);
}
