import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Sessions follow the database: a session token carries the person's session_version from
 * sign-in; a role or household change, a password change or "sign out everywhere" raises it,
 * and every request compares the two with one primary-key lookup.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE users ADD COLUMN session_version integer NOT NULL DEFAULT 1
      CONSTRAINT users_session_version_positive CHECK (session_version > 0);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE users DROP COLUMN IF EXISTS session_version');
};
