import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/** The base of the co-op: cooperatives, households, people, seasons and evaporators. */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TYPE unit_system AS ENUM ('metric', 'us');
    CREATE TYPE user_role AS ENUM ('coordinator', 'sugarmaker', 'member');
    CREATE TYPE season_status AS ENUM ('planned', 'open', 'closed', 'settled');
    CREATE TYPE fuel_kind AS ENUM ('wood', 'oil', 'propane', 'natural-gas', 'pellets');

    CREATE TABLE cooperatives (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 120),
      time_zone text NOT NULL,
      elevation_m double precision NOT NULL CHECK (elevation_m BETWEEN -500 AND 5000),
      unit_system unit_system NOT NULL DEFAULT 'metric',
      currency char(3) NOT NULL CHECK (currency ~ '^[A-Z]{3}$'),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE households (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 120),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id)
    );
    CREATE UNIQUE INDEX households_name_per_coop ON households (cooperative_id, lower(name));

    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      household_id uuid,
      name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 120),
      email text NOT NULL CHECK (email = lower(email) AND email ~ '^[^@\\s]+@[^@\\s]+$'),
      password_hash text,
      role user_role NOT NULL,
      invite_token_hash text UNIQUE,
      invite_expires_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      FOREIGN KEY (household_id, cooperative_id) REFERENCES households (id, cooperative_id) ON DELETE RESTRICT,
      CONSTRAINT users_member_has_household CHECK (role <> 'member' OR household_id IS NOT NULL)
    );
    CREATE UNIQUE INDEX users_email_unique ON users (email);
    CREATE INDEX users_household ON users (household_id);

    CREATE TABLE seasons (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      label text NOT NULL CHECK (length(btrim(label)) BETWEEN 1 AND 60),
      starts_on date NOT NULL,
      ends_on date NOT NULL,
      status season_status NOT NULL DEFAULT 'planned',
      fuel_price_cents integer NOT NULL DEFAULT 0 CHECK (fuel_price_cents >= 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      UNIQUE (cooperative_id, label),
      CHECK (ends_on >= starts_on)
    );
    CREATE UNIQUE INDEX seasons_one_open_per_coop ON seasons (cooperative_id) WHERE status = 'open';

    CREATE TABLE evaporators (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 80),
      evaporation_lph double precision NOT NULL CHECK (evaporation_lph > 0 AND evaporation_lph <= 5000),
      fuel_kind fuel_kind NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      UNIQUE (cooperative_id, name)
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS evaporators, seasons, users, households, cooperatives;
    DROP TYPE IF EXISTS fuel_kind, season_status, user_role, unit_system;
  `);
};
