import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Every boil slot carries a revision: 0 when booked, one more with every change of the row (a
 * move, a new crew or note, a cancellation). The e-mailed calendar file's SEQUENCE is this number,
 * so a calendar program keeps the latest copy even when the e-mails arrive out of order. A trigger
 * raises it, so no write can change a slot and leave its revision behind.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE boil_slots
      ADD COLUMN revision integer NOT NULL DEFAULT 0,
      ADD CONSTRAINT boil_slots_revision_check CHECK (revision >= 0);

    CREATE FUNCTION boil_slots_next_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      NEW.revision := OLD.revision + 1;
      RETURN NEW;
    END $$;

    CREATE TRIGGER boil_slots_revision
      BEFORE UPDATE ON boil_slots
      FOR EACH ROW WHEN (OLD.* IS DISTINCT FROM NEW.*)
      EXECUTE FUNCTION boil_slots_next_revision();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TRIGGER IF EXISTS boil_slots_revision ON boil_slots;
    DROP FUNCTION IF EXISTS boil_slots_next_revision();
    ALTER TABLE boil_slots DROP CONSTRAINT IF EXISTS boil_slots_revision_check, DROP COLUMN IF EXISTS revision;
  `);
};
