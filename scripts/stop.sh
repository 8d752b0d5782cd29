#!/usr/bin/env bash
# npm run stop: stops what npm start started (server, maildev, PostgreSQL).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
stop_bg server
stop_bg maildev
stop_bg s3
bash "$ROOT/scripts/db.sh" stop
