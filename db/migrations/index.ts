import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';
import * as base from './20261201-0001-base';
import * as boilSlots from './20261201-0002-boil-slots';
import * as realtime from './20261201-0003-realtime';
import * as sessionVersion from './20261202-0001-session-version';
import * as deliveries from './20261202-0010-deliveries';
import * as runs from './20261202-0020-runs';
import * as ledger from './20261202-0030-ledger';
import * as slotRevision from './20261202-0002-slot-revision';
import * as runNumbers from './20261202-0040-run-numbers';
import * as changeAtCommit from './20261202-0050-change-at-commit';
import * as accountSecurity from './20261202-0003-account-security';

interface MigrationModule {
  up: MigrationFn<QueryInterface>;
  down: MigrationFn<QueryInterface>;
}

/** Every migration, oldest first. A new one is a new timestamped file added at the end. */
export const migrations: { name: string; module: MigrationModule }[] = [
  { name: '20261201-0001-base', module: base },
  { name: '20261201-0002-boil-slots', module: boilSlots },
  { name: '20261201-0003-realtime', module: realtime },
  { name: '20261202-0001-session-version', module: sessionVersion },
  { name: '20261202-0003-account-security', module: accountSecurity },
  { name: '20261202-0010-deliveries', module: deliveries },
  { name: '20261202-0020-runs', module: runs },
  { name: '20261202-0030-ledger', module: ledger },
  { name: '20261202-0002-slot-revision', module: slotRevision },
  { name: '20261202-0040-run-numbers', module: runNumbers },
  { name: '20261202-0050-change-at-commit', module: changeAtCommit },
];
