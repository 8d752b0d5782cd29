import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes, Sequelize } from 'sequelize';
import pg from 'pg';
import { createMigrator } from '@/db/migrator';
import { migrations } from '@/db/migrations';
import { TEST_DATABASE_URL } from '../test-env';

const SCRATCH = 'brixhouse_migration_check_test';
const scratchUrl = TEST_DATABASE_URL.replace(/\/[^/]+$/, `/${SCRATCH}`);
const admin = new Sequelize(TEST_DATABASE_URL, { dialect: 'postgres', dialectModule: pg, logging: false });
let scratch: Sequelize | undefined;

async function tables(s: Sequelize) {
  // pg_tables rather than information_schema: Sequelize rewrites the shape of a "show tables" query.
  const r = await s.query<{ name: string }>(
    "SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'schema_migrations' ORDER BY 1",
    { type: QueryTypes.SELECT },
  );
  return r.map((t) => t.name);
}

afterAll(async () => {
  await scratch?.close();
  await admin.query(`DROP DATABASE IF EXISTS ${SCRATCH} WITH (FORCE)`);
  await admin.close();
});

describe('migrations', () => {
  it('go up, down to zero and up again on an empty database', async () => {
    await admin.query(`DROP DATABASE IF EXISTS ${SCRATCH} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${SCRATCH}`);
    scratch = new Sequelize(scratchUrl, { dialect: 'postgres', dialectModule: pg, logging: false });
    const migrator = createMigrator(scratch, { quiet: true });

    expect(await tables(scratch)).toEqual([]);
    const up = await migrator.up();
    expect(up.map((m) => m.name)).toEqual(migrations.map((m) => m.name));
    const all = await tables(scratch);
    // Every feature adds tables; these must be there whatever else is.
    expect(all).toEqual(
      expect.arrayContaining(['boil_slots', 'cooperatives', 'delivery_revisions', 'evaporators', 'households', 'sap_deliveries', 'seasons', 'socket_io_attachments', 'users']),
    );

    const down = await migrator.down({ to: 0 });
    expect(down).toHaveLength(migrations.length);
    expect(await tables(scratch)).toEqual([]);
    const types = await scratch.query("SELECT typname FROM pg_type WHERE typname IN ('user_role', 'boil_slot_status')", { type: QueryTypes.SELECT });
    expect(types).toEqual([]);

    await migrator.up();
    expect(await tables(scratch)).toEqual(all);
    expect(await migrator.pending()).toEqual([]);
  });
});
