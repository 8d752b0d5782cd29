#!/usr/bin/env bash
# The production server on the tests' own ports and database (used by Playwright when run alone).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
source "$ROOT/scripts/test-env.sh"
cd "$ROOT"
bash scripts/db.sh start > /dev/null
bash scripts/mail.sh start maildev-test "$SMTP_PORT" "$MAIL_WEB_PORT"
bash scripts/s3.sh start s3-test "$S3_PORT" "$S3_BUCKET"
bash scripts/pay.sh start pay-fake-test "$PAY_PORT"
npm run --silent db:migrate -- --quiet > /dev/null
[ -d "$NEXT_DIST_DIR" ] || npx next build > "$DATA_DIR/build-test.log" 2>&1
require_free_port E2E_PORT "$E2E_PORT"
# shellcheck disable=SC2086 # the flags are words
exec node $SERVER_NODE_ARGS --import tsx server.ts
