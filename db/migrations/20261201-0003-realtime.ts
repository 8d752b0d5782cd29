import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * socket.io's PostgreSQL adapter sends events between server processes with NOTIFY; payloads
 * too large for NOTIFY go through this table.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE socket_io_attachments (
      id bigserial UNIQUE,
      created_at timestamptz DEFAULT now(),
      payload bytea
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS socket_io_attachments');
};
