import { defineConfig, devices } from '@playwright/test';
import { loadTestEnv } from './scripts/test-env.cjs';

// The tests' own ports and database (scripts/test-env.sh), also when Playwright runs alone.
const port = Number(loadTestEnv().E2E_PORT);
const baseURL = `http://127.0.0.1:${port}`;

export default defineConfig({
  testDir: 'tests/e2e',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env.CI ? [['list']] : [['list']],
  globalSetup: './tests/e2e/global-setup.ts',
  outputDir: '.tmp/test-results',
  use: {
    baseURL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
        '--disable-quic',
      ],
    },
  },
  projects: [
    { name: 'desktop', use: { ...devices['Desktop Chrome'], viewport: { width: 1280, height: 900 } } },
  ],
  webServer: {
    command: 'bash scripts/test-server.sh',
    url: `${baseURL}/api/health`,
    reuseExistingServer: true,
    timeout: 240_000,
  },
});
