import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';
import { migrations } from './migrations';

/**
 * Umzug over the migrations listed in db/migrations/index.ts, recorded in "schema_migrations".
 * The list is imported rather than globbed so the same code runs under tsx and vitest.
 */
export function createMigrator(sequelize: Sequelize, { quiet = false } = {}) {
  return new Umzug<QueryInterface>({
    migrations: migrations.map(({ name, module }) => ({ name, up: module.up, down: module.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: quiet ? undefined : console,
  });
}
