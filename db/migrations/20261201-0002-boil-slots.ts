import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Boil slots on an evaporator, and the co-op's booking rules. Two active slots never overlap on
 * one evaporator: an exclusion constraint over the half-open time range says so in PostgreSQL,
 * so a slot that ends when the next starts is allowed.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE EXTENSION IF NOT EXISTS btree_gist;

    ALTER TABLE cooperatives
      ADD COLUMN opens_at time NOT NULL DEFAULT '06:00',
      ADD COLUMN closes_at time NOT NULL DEFAULT '22:00',
      ADD COLUMN slot_min_minutes integer NOT NULL DEFAULT 60,
      ADD COLUMN slot_max_minutes integer NOT NULL DEFAULT 720,
      ADD COLUMN cancel_notice_hours integer NOT NULL DEFAULT 12,
      ADD COLUMN syrup_brix double precision NOT NULL DEFAULT 66.9,
      ADD COLUMN shelf_days double precision NOT NULL DEFAULT 7,
      ADD COLUMN warm_above_c double precision NOT NULL DEFAULT 7,
      ADD COLUMN warm_shelf_days double precision NOT NULL DEFAULT 3,
      ADD CONSTRAINT cooperatives_hours CHECK (closes_at > opens_at),
      ADD CONSTRAINT cooperatives_slot_lengths CHECK (slot_min_minutes >= 15 AND slot_max_minutes >= slot_min_minutes AND slot_max_minutes <= 2880),
      ADD CONSTRAINT cooperatives_cancel_notice CHECK (cancel_notice_hours BETWEEN 0 AND 336),
      ADD CONSTRAINT cooperatives_syrup_brix CHECK (syrup_brix BETWEEN 60 AND 70),
      ADD CONSTRAINT cooperatives_shelf CHECK (shelf_days > 0 AND warm_shelf_days > 0 AND warm_shelf_days <= shelf_days);

    CREATE TYPE boil_slot_status AS ENUM ('booked', 'cancelled', 'done');

    CREATE TABLE boil_slots (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      season_id uuid NOT NULL,
      evaporator_id uuid NOT NULL,
      household_id uuid NOT NULL,
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      crew text[] NOT NULL DEFAULT '{}',
      expected_sap_l double precision CHECK (expected_sap_l IS NULL OR (expected_sap_l >= 0 AND expected_sap_l <= 1000000)),
      note text CHECK (note IS NULL OR length(note) <= 500),
      status boil_slot_status NOT NULL DEFAULT 'booked',
      booked_by_id uuid,
      cancelled_at timestamptz,
      cancelled_by_id uuid,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (season_id, cooperative_id) REFERENCES seasons (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (evaporator_id, cooperative_id) REFERENCES evaporators (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (household_id, cooperative_id) REFERENCES households (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (booked_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (booked_by_id),
      FOREIGN KEY (cancelled_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (cancelled_by_id),
      CONSTRAINT boil_slots_order CHECK (ends_at > starts_at),
      CONSTRAINT boil_slots_crew_size CHECK (cardinality(crew) <= 12),
      CONSTRAINT boil_slots_cancelled CHECK ((status = 'cancelled') = (cancelled_at IS NOT NULL)),
      CONSTRAINT boil_slots_no_overlap EXCLUDE USING gist (
        evaporator_id WITH =,
        tstzrange(starts_at, ends_at, '[)') WITH &&
      ) WHERE (status <> 'cancelled')
    );
    CREATE INDEX boil_slots_coop_time ON boil_slots (cooperative_id, starts_at);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS boil_slots;
    DROP TYPE IF EXISTS boil_slot_status;
    ALTER TABLE cooperatives
      DROP CONSTRAINT IF EXISTS cooperatives_hours,
      DROP CONSTRAINT IF EXISTS cooperatives_slot_lengths,
      DROP CONSTRAINT IF EXISTS cooperatives_cancel_notice,
      DROP CONSTRAINT IF EXISTS cooperatives_syrup_brix,
      DROP CONSTRAINT IF EXISTS cooperatives_shelf,
      DROP COLUMN IF EXISTS opens_at, DROP COLUMN IF EXISTS closes_at,
      DROP COLUMN IF EXISTS slot_min_minutes, DROP COLUMN IF EXISTS slot_max_minutes,
      DROP COLUMN IF EXISTS cancel_notice_hours, DROP COLUMN IF EXISTS syrup_brix,
      DROP COLUMN IF EXISTS shelf_days, DROP COLUMN IF EXISTS warm_above_c,
      DROP COLUMN IF EXISTS warm_shelf_days;
  `);
};
