#!/usr/bin/env bash
# npm test: the same set-up as npm start from nothing, on the tests' own ports and database,
# then every suite; ends with one line "N passed, N failed" over all of them.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
set -e

ensure_node_modules
if [ ! -x /usr/bin/chromium ]; then
  log "Installing Debian's chromium for the end-to-end tests"
  as_root_apt chromium
fi

log "Lint (ESLint with the framework's rules and react-hooks)"
rm -f "$TMPDIR/lint.status"
if npx eslint --max-warnings 0 .; then echo passed > "$TMPDIR/lint.status"; else echo failed > "$TMPDIR/lint.status"; fi

PG_WAS_RUNNING=0
bash scripts/db.sh status > /dev/null 2>&1 && PG_WAS_RUNNING=1
bash scripts/db.sh start
log "Resetting the test database"
bash scripts/db.sh reset brixhouse_test
source scripts/test-env.sh

cleanup() {
  stop_bg test-server
  stop_bg maildev-test
  stop_bg s3-test
  stop_bg pay-fake-test
  [ "$PG_WAS_RUNNING" = 1 ] || bash scripts/db.sh stop > /dev/null 2>&1 || true
}
trap cleanup EXIT

log "Starting maildev for the tests (SMTP $SMTP_PORT, inbox $MAIL_WEB_PORT)"
stop_bg maildev-test
bash scripts/mail.sh start maildev-test "$SMTP_PORT" "$MAIL_WEB_PORT"
log "Starting the object store for the tests (http://127.0.0.1:$S3_PORT)"
stop_bg s3-test
rm -rf "$DATA_DIR/s3-test"
bash scripts/s3.sh start s3-test "$S3_PORT" "$S3_BUCKET"
log "Starting the payment service stand-in for the tests (127.0.0.1:$PAY_PORT)"
stop_bg pay-fake-test
bash scripts/pay.sh start pay-fake-test "$PAY_PORT"
npm run --silent db:migrate -- --quiet
npm run --silent db:seed

log "Building for production (into $NEXT_DIST_DIR)"
if ! npx next build > "$DATA_DIR/build-test.log" 2>&1; then
  tail -n 80 "$DATA_DIR/build-test.log"
  echo "0 passed, 1 failed"
  exit 1
fi

log "Starting the server on $APP_URL"
stop_bg test-server
require_free_port E2E_PORT "$E2E_PORT" || { echo "0 passed, 1 failed"; exit 1; }
# shellcheck disable=SC2086 # the flags are words
start_bg test-server node $SERVER_NODE_ARGS --import tsx server.ts
wait_for_url "$APP_URL/api/health" 200 || { tail -n 40 "$DATA_DIR/test-server.log"; echo "0 passed, 1 failed"; exit 1; }
set +e

rm -f "$TMPDIR/vitest.json" "$TMPDIR/playwright.json"
log "Unit and integration tests (vitest)"
npx vitest run --reporter=default --reporter=json --outputFile.json="$TMPDIR/vitest.json"
log "End-to-end tests (Playwright in chromium)"
PLAYWRIGHT_JSON_OUTPUT_NAME="$TMPDIR/playwright.json" npx playwright test --reporter=list,json

node scripts/test-summary.mjs "$TMPDIR/vitest.json" "$TMPDIR/playwright.json" "$TMPDIR/lint.status"
