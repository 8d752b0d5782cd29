import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * The season ledger: per-run allocations by sugar and their history, per-household season
 * fees, the settlement (one statement per season × household, sent once), payments and the
 * payment service's webhook events.
 *
 * - An allocation belongs to its run's season (composite key over run, season and co-op).
 * - Syrup is whole millilitres per colour class; the total is a generated column.
 * - A settlement row is unique per season × household: it is the key that makes each
 *   statement go out exactly once, whatever is pressed twice or restarted.
 * - A payment never takes a statement past what it owes (checked under the statement's row
 *   lock); a webhook event id is recorded once, so a replay pays nothing.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TYPE payment_method AS ENUM ('card', 'cheque', 'cash');
    CREATE TYPE allocation_event AS ENUM ('finished', 'reopened', 'refinished');

    ALTER TABLE boil_runs ADD CONSTRAINT boil_runs_id_season_coop UNIQUE (id, season_id, cooperative_id);

    CREATE TABLE season_fees (
      season_id uuid NOT NULL,
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      household_id uuid NOT NULL,
      fee_cents integer NOT NULL CONSTRAINT season_fees_amount CHECK (fee_cents >= 0 AND fee_cents <= 100000000),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (season_id, household_id),
      FOREIGN KEY (season_id, cooperative_id) REFERENCES seasons (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (household_id, cooperative_id) REFERENCES households (id, cooperative_id) ON DELETE CASCADE
    );

    CREATE TABLE allocations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      season_id uuid NOT NULL,
      run_id uuid NOT NULL,
      household_id uuid NOT NULL,
      sap_l double precision NOT NULL CHECK (sap_l >= 0),
      sugar_kg double precision NOT NULL CHECK (sugar_kg >= 0),
      share double precision NOT NULL CHECK (share >= 0 AND share <= 1),
      syrup_golden_ml integer NOT NULL DEFAULT 0 CHECK (syrup_golden_ml >= 0),
      syrup_amber_ml integer NOT NULL DEFAULT 0 CHECK (syrup_amber_ml >= 0),
      syrup_dark_ml integer NOT NULL DEFAULT 0 CHECK (syrup_dark_ml >= 0),
      syrup_very_dark_ml integer NOT NULL DEFAULT 0 CHECK (syrup_very_dark_ml >= 0),
      syrup_ml integer GENERATED ALWAYS AS (syrup_golden_ml + syrup_amber_ml + syrup_dark_ml + syrup_very_dark_ml) STORED,
      fuel_cents integer NOT NULL CHECK (fuel_cents >= 0),
      computed_at timestamptz NOT NULL DEFAULT now(),
      computed_by_id uuid,
      UNIQUE (id, cooperative_id),
      CONSTRAINT allocations_one_per_run_household UNIQUE (run_id, household_id),
      FOREIGN KEY (run_id, season_id, cooperative_id) REFERENCES boil_runs (id, season_id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (household_id, cooperative_id) REFERENCES households (id, cooperative_id) ON DELETE RESTRICT,
      FOREIGN KEY (computed_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (computed_by_id)
    );
    CREATE INDEX allocations_season_household ON allocations (season_id, household_id);

    -- Who changed a run's allocation, when, and the rows before and after.
    CREATE TABLE allocation_revisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      run_id uuid NOT NULL,
      event allocation_event NOT NULL,
      changed_by_id uuid,
      changed_at timestamptz NOT NULL DEFAULT now(),
      reason text CHECK (reason IS NULL OR length(btrim(reason)) BETWEEN 1 AND 500),
      before jsonb NOT NULL CHECK (jsonb_typeof(before) = 'array'),
      after jsonb NOT NULL CHECK (jsonb_typeof(after) = 'array'),
      FOREIGN KEY (run_id, cooperative_id) REFERENCES boil_runs (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (changed_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (changed_by_id),
      CONSTRAINT allocation_revisions_reopen_reason CHECK (event <> 'reopened' OR reason IS NOT NULL)
    );
    CREATE INDEX allocation_revisions_run ON allocation_revisions (run_id, changed_at);

    -- The settlement of one household for one season: its statement, figures frozen when settled.
    CREATE TABLE settlements (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      season_id uuid NOT NULL,
      household_id uuid NOT NULL,
      sap_l double precision NOT NULL CHECK (sap_l >= 0),
      mean_brix double precision CHECK (mean_brix IS NULL OR mean_brix BETWEEN 0 AND 85),
      sugar_kg double precision NOT NULL CHECK (sugar_kg >= 0),
      share double precision NOT NULL CHECK (share >= 0 AND share <= 1),
      syrup_golden_ml integer NOT NULL CHECK (syrup_golden_ml >= 0),
      syrup_amber_ml integer NOT NULL CHECK (syrup_amber_ml >= 0),
      syrup_dark_ml integer NOT NULL CHECK (syrup_dark_ml >= 0),
      syrup_very_dark_ml integer NOT NULL CHECK (syrup_very_dark_ml >= 0),
      syrup_ml integer GENERATED ALWAYS AS (syrup_golden_ml + syrup_amber_ml + syrup_dark_ml + syrup_very_dark_ml) STORED,
      fuel_cents integer NOT NULL CHECK (fuel_cents >= 0),
      fee_cents integer NOT NULL CHECK (fee_cents >= 0),
      due_cents integer NOT NULL,
      settled_at timestamptz NOT NULL DEFAULT now(),
      settled_by_id uuid,
      queued_at timestamptz,
      sent_at timestamptz,
      UNIQUE (id, cooperative_id),
      UNIQUE (id, household_id, cooperative_id),
      CONSTRAINT settlements_one_per_season_household UNIQUE (season_id, household_id),
      FOREIGN KEY (season_id, cooperative_id) REFERENCES seasons (id, cooperative_id) ON DELETE CASCADE,
      FOREIGN KEY (household_id, cooperative_id) REFERENCES households (id, cooperative_id) ON DELETE RESTRICT,
      FOREIGN KEY (settled_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (settled_by_id),
      CONSTRAINT settlements_due CHECK (due_cents = fuel_cents + fee_cents),
      CONSTRAINT settlements_sent_after_queued CHECK (sent_at IS NULL OR queued_at IS NOT NULL)
    );

    CREATE TABLE payments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      cooperative_id uuid NOT NULL REFERENCES cooperatives(id) ON DELETE CASCADE,
      settlement_id uuid NOT NULL,
      household_id uuid NOT NULL,
      amount_cents integer NOT NULL CONSTRAINT payments_amount CHECK (amount_cents > 0),
      method payment_method NOT NULL,
      reference text CHECK (reference IS NULL OR length(btrim(reference)) BETWEEN 1 AND 120),
      checkout_session_id text CONSTRAINT payments_checkout_session_unique UNIQUE,
      paid_at timestamptz NOT NULL DEFAULT now(),
      recorded_by_id uuid,
      created_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (settlement_id, household_id, cooperative_id) REFERENCES settlements (id, household_id, cooperative_id) ON DELETE RESTRICT,
      FOREIGN KEY (recorded_by_id, cooperative_id) REFERENCES users (id, cooperative_id) ON DELETE SET NULL (recorded_by_id),
      CONSTRAINT payments_card_has_session CHECK ((method = 'card') = (checkout_session_id IS NOT NULL))
    );
    CREATE INDEX payments_settlement ON payments (settlement_id);

    -- A statement is never paid past what it owes: the statement's row lock orders two payments.
    CREATE FUNCTION payments_not_over_due() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      due integer;
      paid bigint;
    BEGIN
      SELECT due_cents INTO due FROM settlements WHERE id = NEW.settlement_id FOR UPDATE;
      SELECT COALESCE(sum(amount_cents), 0) INTO paid FROM payments WHERE settlement_id = NEW.settlement_id;
      IF paid + NEW.amount_cents > due THEN
        RAISE EXCEPTION 'payment of % cents is more than the % cents still owed', NEW.amount_cents, due - paid
          USING ERRCODE = 'check_violation', CONSTRAINT = 'payments_not_over_due', TABLE = 'payments';
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER payments_not_over_due BEFORE INSERT ON payments FOR EACH ROW EXECUTE FUNCTION payments_not_over_due();

    -- Webhook events of the payment service, recorded once by their id.
    CREATE TABLE payment_events (
      event_id text PRIMARY KEY CHECK (length(event_id) BETWEEN 1 AND 255),
      type text NOT NULL,
      settlement_id uuid REFERENCES settlements(id) ON DELETE SET NULL,
      received_at timestamptz NOT NULL DEFAULT now()
    );
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS payment_events;
    DROP TRIGGER IF EXISTS payments_not_over_due ON payments;
    DROP FUNCTION IF EXISTS payments_not_over_due();
    DROP TABLE IF EXISTS payments, settlements, allocation_revisions, allocations, season_fees;
    ALTER TABLE boil_runs DROP CONSTRAINT IF EXISTS boil_runs_id_season_coop;
    DROP TYPE IF EXISTS allocation_event, payment_method;
  `);
};
