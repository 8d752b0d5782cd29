// The test set-up's environment for the vitest and Playwright configurations and the tests.
// CommonJS, so that Playwright (which loads its config as CommonJS) and vitest's ESM config both load it.
const { execFileSync } = require('node:child_process');
const path = require('node:path');

const ROOT = path.resolve(__dirname, '..');
const CORE = ['NODE_ENV', 'PORT', 'E2E_PORT', 'PG_PORT', 'DATABASE_URL', 'APP_URL', 'NEXTAUTH_URL', 'NEXTAUTH_SECRET', 'NEXT_DIST_DIR', 'BRIXHOUSE_TEST_SERVER', 'SMTP_PORT', 'MAIL_WEB_PORT'];

/**
 * The environment of the test set-up exactly as scripts/test-env.sh makes it — this clone's test
 * ports (explicit port variables win), the brixhouse_test database whatever DATABASE_URL the
 * shell had, the test build folder and secret — put into this process and returned. So a suite
 * run alone reaches the tests' database, never the development one.
 * @returns {Record<string, string>}
 */
function loadTestEnv() {
  // Every variable the scripts set or change, read from a shell before and after sourcing them.
  const out = execFileSync('bash', ['-c', 'env -0; printf "\\0--\\0"; source scripts/lib.sh && source scripts/test-env.sh && env -0'], {
    cwd: ROOT,
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const [before, after] = out.split('\0--\0').map((part) => {
    /** @type {Map<string, string>} */
    const m = new Map();
    for (const entry of part.split('\0')) {
      const i = entry.indexOf('=');
      if (i > 0) m.set(entry.slice(0, i), entry.slice(i + 1));
    }
    return m;
  });
  /** @type {Record<string, string>} */
  const vars = {};
  for (const [k, v] of after) {
    if ((before.get(k) !== v && !k.startsWith('BASH') && k !== '_' && k !== 'SHLVL') || CORE.includes(k)) vars[k] = v;
  }
  if (!vars.DATABASE_URL?.endsWith('/brixhouse_test')) throw new Error(`The test set-up named ${vars.DATABASE_URL}, not the tests' database.`);
  Object.assign(process.env, vars);
  return vars;
}

module.exports = { loadTestEnv };
