#!/usr/bin/env bash
# npm run stop: stops what npm start started (server, maildev, PostgreSQL).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
stop_bg server
stop_bg maildev
stop_bg s3
stop_bg pay-fake
bash "$ROOT/scripts/db.sh" stop
