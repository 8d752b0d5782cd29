import { execFileSync } from 'node:child_process';
import { TEST_DATABASE_URL } from '../test-env';

/** Every e2e run starts from the demo data, loaded afresh into the test database. */
export default function globalSetup() {
  execFileSync('node', ['--import', 'tsx', 'db/cli.ts', 'seed', '--reset'], {
    stdio: 'inherit',
    env: { ...process.env, DATABASE_URL: TEST_DATABASE_URL },
  });
}
