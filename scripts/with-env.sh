#!/usr/bin/env bash
# Runs a command with this clone's ports and, unless DATABASE_URL is set, its development
# database (npm run db:migrate / db:rollback / db:seed).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
export DATABASE_URL=${DATABASE_URL:-$(database_url brixhouse_dev)}
exec "$@"
