import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Boil runs and what goes in and comes out of them, and the sugarhouse display links.
 *
 * - One running run per evaporator (a partial unique index).
 * - A lot is never drawn into runs beyond its litres: a trigger on run_inputs keeps
 *   sap_deliveries.litres_boiled equal to the litres taken, under the lot's row lock, and a check
 *   on sap_deliveries refuses more than the lot holds, also when two requests race. A rejected
 *   lot holds no boiled litres, so it can never be taken.
 * - Every reference stays inside one cooperative (composite foreign keys).
 * - A run's lot code ("2027-014": season year and run number) is unique in the co-op.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TYPE boil_run_status AS ENUM ('running', 'finished');
    CREATE TYPE fuel_unit AS ENUM ('cord', 'litre');

    ALTER TABLE boil_slots ADD CONSTRAINT boil_slots_id_coop UNIQUE (id, cooperative_id);

    CREATE TABLE boil_runs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      season_id uuid NOT NULL,
      evaporator_id uuid NOT NULL,
      slot_id uuid,
      run_number integer NOT NULL CHECK (run_number BETWEEN 1 AND 999),
      lot_code text NOT NULL CHECK (lot_code ~ '^[0-9]{4}-[0-9]{3}$'),
      status boil_run_status NOT NULL DEFAULT 'running',
      started_at timestamptz NOT NULL,
      finished_at timestamptz,
      started_by_id uuid,
      finished_by_id uuid,
      note text CHECK (note IS NULL OR length(note) <= 500),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      CONSTRAINT boil_runs_number_per_season UNIQUE (season_id, run_number),
      CONSTRAINT boil_runs_lot_code_unique UNIQUE (cooperative_id, lot_code),
      FOREIGN KEY (season_id, cooperative_id) REFERENCES seasons (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (evaporator_id, cooperative_id) REFERENCES evaporators (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (slot_id, cooperative_id) REFERENCES boil_slots (id, cooperative_id) ON DELETE SET NULL (slot_id),
      FOREIGN KEY (started_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (started_by_id),
      FOREIGN KEY (finished_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (finished_by_id),
      CONSTRAINT boil_runs_finished CHECK ((status = 'finished') = (finished_at IS NOT NULL)),
      CONSTRAINT boil_runs_order CHECK (finished_at IS NULL OR finished_at >= started_at)
    );
    CREATE UNIQUE INDEX boil_runs_one_running_per_evaporator ON boil_runs (evaporator_id) WHERE status = 'running';
    CREATE INDEX boil_runs_coop_started ON boil_runs (cooperative_id, started_at DESC);

    CREATE TABLE run_inputs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      run_id uuid NOT NULL,
      delivery_id uuid NOT NULL,
      litres double precision NOT NULL CHECK (litres > 0 AND litres <= 1000000),
      taken_at timestamptz NOT NULL DEFAULT now(),
      taken_by_id uuid,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      FOREIGN KEY (run_id, cooperative_id) REFERENCES boil_runs (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (delivery_id, cooperative_id) REFERENCES sap_deliveries (id, cooperative_id) ON DELETE RESTRICT,
      FOREIGN KEY (taken_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (taken_by_id)
    );
    CREATE INDEX run_inputs_run ON run_inputs (run_id);
    CREATE INDEX run_inputs_delivery ON run_inputs (delivery_id);

    CREATE TABLE syrup_draws (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      run_id uuid NOT NULL,
      drawn_at timestamptz NOT NULL,
      litres double precision NOT NULL CHECK (litres > 0 AND litres <= 100000),
      brix double precision NOT NULL CHECK (brix BETWEEN 55 AND 75),
      transmittance_pct double precision CHECK (transmittance_pct IS NULL OR transmittance_pct BETWEEN 0 AND 100),
      grade_class text NOT NULL CHECK (grade_class IN ('golden', 'amber', 'dark', 'very-dark')),
      temperature_c double precision CHECK (temperature_c IS NULL OR temperature_c BETWEEN 60 AND 130),
      recorded_by_id uuid,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      FOREIGN KEY (run_id, cooperative_id) REFERENCES boil_runs (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (recorded_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (recorded_by_id),
      -- The colour class follows the grading standard's limits when transmittance was measured.
      CONSTRAINT syrup_draws_class_matches CHECK (
        transmittance_pct IS NULL OR grade_class = CASE
          WHEN transmittance_pct >= 75 THEN 'golden'
          WHEN transmittance_pct >= 50 THEN 'amber'
          WHEN transmittance_pct >= 25 THEN 'dark'
          ELSE 'very-dark' END)
    );
    CREATE INDEX syrup_draws_run ON syrup_draws (run_id);
    CREATE INDEX syrup_draws_coop_time ON syrup_draws (cooperative_id, drawn_at);

    CREATE TABLE fuel_uses (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      run_id uuid NOT NULL,
      kind fuel_kind NOT NULL,
      quantity double precision NOT NULL CHECK (quantity > 0 AND quantity <= 100000),
      unit fuel_unit NOT NULL,
      cost_cents integer NOT NULL CHECK (cost_cents >= 0),
      recorded_at timestamptz NOT NULL DEFAULT now(),
      recorded_by_id uuid,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      FOREIGN KEY (run_id, cooperative_id) REFERENCES boil_runs (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (recorded_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (recorded_by_id),
      -- Wood is measured in cords, liquid fuels in litres.
      CONSTRAINT fuel_uses_unit_fits_kind CHECK (
        (kind <> 'wood' OR unit = 'cord') AND (kind NOT IN ('oil', 'propane') OR unit = 'litre'))
    );
    CREATE INDEX fuel_uses_run ON fuel_uses (run_id);

    CREATE TABLE display_links (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 80),
      token_hash text NOT NULL CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      created_by_id uuid,
      revoked_at timestamptz,
      revoked_by_id uuid,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      CONSTRAINT display_links_token_unique UNIQUE (token_hash),
      FOREIGN KEY (created_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (created_by_id),
      FOREIGN KEY (revoked_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (revoked_by_id)
    );

    ALTER TABLE sap_deliveries
      ADD COLUMN litres_boiled double precision NOT NULL DEFAULT 0,
      ADD CONSTRAINT sap_deliveries_not_overdrawn CHECK (litres_boiled >= 0 AND litres_boiled <= volume_l),
      ADD CONSTRAINT sap_deliveries_boiled_only_accepted CHECK (litres_boiled = 0 OR status = 'accepted');
    -- The Boil queue reads only lots with sap left to boil.
    CREATE INDEX sap_deliveries_waiting ON sap_deliveries (cooperative_id) WHERE status = 'accepted' AND litres_boiled < volume_l;

    -- Keeps litres_boiled the sum of the lot's run inputs. The UPDATE takes the lot's row lock, so two
    -- concurrent inputs are applied one after the other and the check above sees the second's total.
    -- A sum that overshoots the volume by floating-point noise only (under a microlitre) is the whole lot.
    CREATE FUNCTION run_inputs_track_boiled() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN
        UPDATE sap_deliveries
           SET litres_boiled = CASE WHEN litres_boiled - OLD.litres < 0 AND litres_boiled - OLD.litres > -1e-6 THEN 0
                                    ELSE litres_boiled - OLD.litres END
         WHERE id = OLD.delivery_id;
      END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') THEN
        UPDATE sap_deliveries
           SET litres_boiled = CASE WHEN litres_boiled + NEW.litres > volume_l AND litres_boiled + NEW.litres <= volume_l + 1e-6 THEN volume_l
                                    ELSE litres_boiled + NEW.litres END
         WHERE id = NEW.delivery_id;
      END IF;
      RETURN NULL;
    END $$;
    CREATE TRIGGER run_inputs_track_boiled AFTER INSERT OR UPDATE OR DELETE ON run_inputs
      FOR EACH ROW EXECUTE FUNCTION run_inputs_track_boiled();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TRIGGER IF EXISTS run_inputs_track_boiled ON run_inputs;
    DROP FUNCTION IF EXISTS run_inputs_track_boiled();
    DROP INDEX IF EXISTS sap_deliveries_waiting;
    ALTER TABLE sap_deliveries
      DROP CONSTRAINT IF EXISTS sap_deliveries_not_overdrawn,
      DROP CONSTRAINT IF EXISTS sap_deliveries_boiled_only_accepted,
      DROP COLUMN IF EXISTS litres_boiled;
    DROP TABLE IF EXISTS display_links, fuel_uses, syrup_draws, run_inputs, boil_runs;
    ALTER TABLE boil_slots DROP CONSTRAINT IF EXISTS boil_slots_id_coop;
    DROP TYPE IF EXISTS fuel_unit, boil_run_status;
  `);
};
