import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * A co-op's change version grows when the writing transaction commits, not when the write asks
 * for it. `recordChange` inserts a mark (one per co-op and transaction); a deferred constraint
 * trigger turns the marks into the version bump as the transaction commits and removes them.
 *
 * Why: the bump takes the co-op row's lock until the commit. Taken mid-transaction, the lock was
 * held while the server went on with the rest of the write and sent COMMIT, which on a busy
 * server waited its turn on the event loop, and every other write of the co-op (a busy drop-off
 * desk) queued behind it. Taken at commit, it is held for the commit alone. Versions still follow
 * commit order, so a reader that sees version v sees every write up to v.
 *
 * The marks table is unlogged: its rows never outlive their transaction.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE UNLOGGED TABLE change_marks (
      txid bigint NOT NULL,
      cooperative_id uuid NOT NULL,
      PRIMARY KEY (txid, cooperative_id)
    );

    CREATE FUNCTION change_marks_bump() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      DELETE FROM change_marks WHERE txid = NEW.txid AND cooperative_id = NEW.cooperative_id;
      UPDATE cooperatives SET change_version = change_version + 1 WHERE id = NEW.cooperative_id;
      IF NOT FOUND THEN
        RAISE EXCEPTION 'no cooperative %', NEW.cooperative_id USING ERRCODE = 'foreign_key_violation';
      END IF;
      RETURN NULL;
    END $$;

    CREATE CONSTRAINT TRIGGER change_marks_bump AFTER INSERT ON change_marks
      DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION change_marks_bump();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS change_marks;
    DROP FUNCTION IF EXISTS change_marks_bump();
  `);
};
