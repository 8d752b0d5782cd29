import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';
import { loadTestEnv } from './scripts/test-env.cjs';

const root = fileURLToPath(new URL('.', import.meta.url));

// The tests' own database, ports and secret (scripts/test-env.sh), also when vitest runs alone:
// a test run never reaches the development database, whatever DATABASE_URL the shell had.
const testEnv = loadTestEnv();

export default defineConfig({
  resolve: { alias: { '@': root } },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts', 'lib/**/*.test.ts'],
          benchmark: { include: ['bench/**/*.bench.ts'] },
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/integration/global-setup.ts'],
          env: testEnv,
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
