import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Sign-in limits (the rate limiter's table, in the shape rate-limiter-flexible reads) and
 * one-time password reset links.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE rate_limits (
      key varchar(255) PRIMARY KEY,
      points integer NOT NULL DEFAULT 0,
      expire bigint
    );
    CREATE INDEX rate_limits_expire ON rate_limits (expire);

    CREATE TABLE password_resets (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL,
      user_id uuid NOT NULL,
      token_hash text NOT NULL CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (user_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE CASCADE,
      CONSTRAINT password_resets_token_unique UNIQUE (token_hash),
      CONSTRAINT password_resets_expiry_after_creation CHECK (expires_at > created_at),
      CONSTRAINT password_resets_used_after_creation CHECK (used_at IS NULL OR used_at >= created_at)
    );
    CREATE INDEX password_resets_user ON password_resets (user_id, created_at);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS password_resets, rate_limits;`);
};
