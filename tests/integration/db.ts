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

/**
 * A test that writes a co-op's rows straight into the database bumps its change version, as the
 * app's own writes do in their transactions: answers kept per version must not outlive the write.
 */
export async function markChanged(cooperativeId: string): Promise<void> {
  await testDb().query('UPDATE cooperatives SET change_version = change_version + 1 WHERE id = :cooperativeId', { replacements: { cooperativeId } });
}

export async function closeTestDb() {
  await sequelize?.close();
  sequelize = undefined;
}

/**
 * The demo co-op's households, name → id. Other suites generate co-ops of their own in the same
 * database (some with the same household names), so every lookup is scoped to Larkspur.
 */
export async function larkspurHouseholds(): Promise<Record<string, string>> {
  const hh = await rows<{ id: string; name: string }>(
    `SELECT h.id, h.name FROM households h
       JOIN cooperatives c ON c.id = h.cooperative_id
      WHERE c.id = (SELECT cooperative_id FROM users WHERE email = 'coordinator@larkspur.example')
      ORDER BY h.name`,
  );
  return Object.fromEntries(hh.map((h) => [h.name, h.id]));
}
