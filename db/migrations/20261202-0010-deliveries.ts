import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Sap drop-offs ("lots") logged at the sugarhouse, their correction history, and a per-co-op
 * change version that the live screens order their snapshots by.
 *
 * Types: `volume_l` is double precision litres (the service rounds to whole millilitres);
 * `brix` is numeric(3,1) so the database keeps exactly the refractometer's 0.1 °Bx reading
 * (node-postgres returns numeric as a string: cast `brix::float8` in raw queries).
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE cooperatives ADD COLUMN change_version bigint NOT NULL DEFAULT 0;

    CREATE TYPE sap_clarity AS ENUM ('clear', 'cloudy');
    CREATE TYPE sap_contamination AS ENUM ('none', 'insects', 'debris', 'off-odour', 'other');
    CREATE TYPE delivery_status AS ENUM ('accepted', 'rejected');
    CREATE TYPE delivery_decision AS ENUM ('accept', 'reject');

    CREATE TABLE sap_deliveries (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      season_id uuid NOT NULL,
      household_id uuid NOT NULL,
      received_at timestamptz NOT NULL DEFAULT now(),
      collected_on date NOT NULL,
      volume_l double precision NOT NULL,
      brix numeric(3,1) NOT NULL,
      sap_temp_c double precision NOT NULL,
      clarity sap_clarity NOT NULL,
      contamination sap_contamination NOT NULL,
      sugar_maple_pct smallint,
      red_maple_pct smallint,
      other_pct smallint,
      recommendation delivery_decision NOT NULL,
      status delivery_status NOT NULL,
      reason text,
      photo_key text,
      note text,
      logged_by uuid,
      idempotency_key text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (id, cooperative_id),
      CONSTRAINT sap_deliveries_idempotency UNIQUE (cooperative_id, idempotency_key),
      CONSTRAINT sap_deliveries_season_fk FOREIGN KEY (season_id, cooperative_id) REFERENCES seasons (id, cooperative_id) ON DELETE RESTRICT,
      CONSTRAINT sap_deliveries_household_fk FOREIGN KEY (household_id, cooperative_id) REFERENCES households (id, cooperative_id) ON DELETE RESTRICT,
      CONSTRAINT sap_deliveries_logged_by_fk FOREIGN KEY (logged_by, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (logged_by),
      CONSTRAINT sap_deliveries_volume CHECK (volume_l > 0 AND volume_l <= 100000),
      CONSTRAINT sap_deliveries_brix CHECK (brix >= 0 AND brix <= 85),
      CONSTRAINT sap_deliveries_sap_temp CHECK (sap_temp_c BETWEEN -10 AND 50),
      -- The latest calendar day anywhere (UTC+14) at the moment of receipt; the service checks
      -- the co-op's own local day exactly.
      CONSTRAINT sap_deliveries_collected_before_received CHECK (collected_on <= (received_at AT TIME ZONE 'Etc/GMT-14')::date),
      CONSTRAINT sap_deliveries_mix CHECK (
        (sugar_maple_pct IS NULL AND red_maple_pct IS NULL AND other_pct IS NULL)
        OR (sugar_maple_pct BETWEEN 0 AND 100 AND red_maple_pct BETWEEN 0 AND 100 AND other_pct BETWEEN 0 AND 100
            AND sugar_maple_pct + red_maple_pct + other_pct = 100)
      ),
      CONSTRAINT sap_deliveries_rejected_has_reason CHECK (status <> 'rejected' OR (reason IS NOT NULL AND length(btrim(reason)) > 0)),
      -- A decision against the rules' recommendation keeps its reason.
      CONSTRAINT sap_deliveries_override_has_reason CHECK (
        ((status = 'accepted') = (recommendation = 'accept')) OR (reason IS NOT NULL AND length(btrim(reason)) > 0)
      ),
      CONSTRAINT sap_deliveries_reason_length CHECK (reason IS NULL OR length(reason) <= 500),
      CONSTRAINT sap_deliveries_note_length CHECK (note IS NULL OR length(note) <= 1000),
      -- Photo keys live under the co-op's own prefix in the object store.
      CONSTRAINT sap_deliveries_photo_key CHECK (photo_key IS NULL OR (starts_with(photo_key, cooperative_id::text || '/') AND length(photo_key) <= 300)),
      CONSTRAINT sap_deliveries_idempotency_key CHECK (length(idempotency_key) BETWEEN 8 AND 100)
    );
    CREATE INDEX sap_deliveries_coop_received ON sap_deliveries (cooperative_id, received_at);
    CREATE INDEX sap_deliveries_coop_household_received ON sap_deliveries (cooperative_id, household_id, received_at);
    CREATE INDEX sap_deliveries_season_status ON sap_deliveries (season_id, status);

    CREATE TABLE delivery_revisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      delivery_id uuid NOT NULL,
      changed_by uuid,
      changed_at timestamptz NOT NULL DEFAULT now(),
      reason text NOT NULL,
      before jsonb NOT NULL,
      after jsonb NOT NULL,
      UNIQUE (id, cooperative_id),
      CONSTRAINT delivery_revisions_delivery_fk FOREIGN KEY (delivery_id, cooperative_id) REFERENCES sap_deliveries (id, cooperative_id) ON DELETE CASCADE,
      CONSTRAINT delivery_revisions_changed_by_fk FOREIGN KEY (changed_by, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (changed_by),
      CONSTRAINT delivery_revisions_reason CHECK (length(btrim(reason)) BETWEEN 1 AND 500),
      CONSTRAINT delivery_revisions_objects CHECK (jsonb_typeof(before) = 'object' AND jsonb_typeof(after) = 'object' AND before <> after)
    );
    CREATE INDEX delivery_revisions_delivery ON delivery_revisions (delivery_id, changed_at);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS delivery_revisions, sap_deliveries;
    DROP TYPE IF EXISTS delivery_decision, delivery_status, sap_contamination, sap_clarity;
    ALTER TABLE cooperatives DROP COLUMN IF EXISTS change_version;
  `);
};
