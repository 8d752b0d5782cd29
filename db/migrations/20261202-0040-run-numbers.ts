import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * Room for large co-ops: a season may hold up to 99,999 boil runs (lot codes "2027-014" up to
 * "2027-99999"). Three digits capped a season at 999 runs, which a co-op of a few hundred
 * households with many evaporators passes.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE boil_runs
      DROP CONSTRAINT IF EXISTS boil_runs_run_number_check,
      DROP CONSTRAINT IF EXISTS boil_runs_lot_code_check,
      ADD CONSTRAINT boil_runs_run_number_check CHECK (run_number BETWEEN 1 AND 99999),
      ADD CONSTRAINT boil_runs_lot_code_check CHECK (lot_code ~ '^[0-9]{4}-[0-9]{3,5}$');
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE boil_runs
      DROP CONSTRAINT IF EXISTS boil_runs_run_number_check,
      DROP CONSTRAINT IF EXISTS boil_runs_lot_code_check,
      ADD CONSTRAINT boil_runs_run_number_check CHECK (run_number BETWEEN 1 AND 999) NOT VALID,
      ADD CONSTRAINT boil_runs_lot_code_check CHECK (lot_code ~ '^[0-9]{4}-[0-9]{3}$') NOT VALID;
  `);
};
