import { loadTestEnv } from '../scripts/test-env.cjs';

// Outside `npm test` (a suite run alone), load the tests' environment here too.
if (process.env.BRIXHOUSE_TEST_SERVER !== '1' || !process.env.DATABASE_URL?.endsWith('_test')) loadTestEnv();

/** Ports and addresses of the test set-up (scripts/test-env.sh). */
export const TEST_PORT = Number(process.env.E2E_PORT);
export const BASE_URL = `http://127.0.0.1:${TEST_PORT}`;
export const MAILDEV_URL = `http://127.0.0.1:${process.env.MAIL_WEB_PORT}`;
export const TEST_DATABASE_URL = process.env.DATABASE_URL!;
/** The development database on the same cluster (the tests only ever read it). */
export const DEV_DATABASE_URL = TEST_DATABASE_URL.replace(/\/[^/]+$/, '/brixhouse_dev');
export const DEMO_PASSWORD = 'syrup-season';
