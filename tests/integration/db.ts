import { Sequelize, QueryTypes } from 'sequelize';
import pg from 'pg';
import { TEST_DATABASE_URL } from '../test-env';

let sequelize: Sequelize | undefined;

/** A direct connection to the test database, to check what the HTTP calls wrote. */
export function testDb(): Sequelize {
  sequelize ??= new Sequelize(TEST_DATABASE_URL, { dialect: 'postgres', dialectModule: pg, logging: false });
  return sequelize;
}

export async function rows<T extends object = Record<string, unknown>>(sql: string, replacements: Record<string, unknown> = {}): Promise<T[]> {
  return testDb().query<T>(sql, { replacements, type: QueryTypes.SELECT }) as unknown as Promise<T[]>;
}

export async function closeTestDb() {
  await sequelize?.close();
  sequelize = undefined;
}
