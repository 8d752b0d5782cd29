#!/usr/bin/env bash
# npm run dev: the same services as npm start, with Next in development mode.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"
ensure_node_modules
bash scripts/db.sh start
export NODE_ENV=development PORT
export DATABASE_URL=${DATABASE_URL:-$(database_url brixhouse_dev)}
export SMTP_PORT
export APP_URL=${APP_URL:-http://127.0.0.1:$PORT} NEXTAUTH_URL=${APP_URL:-http://127.0.0.1:$PORT}
require_free_port PORT "$PORT"
bash scripts/mail.sh start maildev "$SMTP_PORT" "$MAIL_WEB_PORT"
if [ -z "${S3_ENDPOINT:-}" ]; then
  bash scripts/s3.sh start s3 "$S3_PORT" "$S3_BUCKET"
  export S3_ENDPOINT=http://127.0.0.1:$S3_PORT
fi
payment_env "${PAY_PORT:-9400}"
bash scripts/pay.sh start pay-fake "$PAY_PORT"
npm run --silent db:migrate -- --quiet
npm run --silent db:seed
exec node --import tsx server.ts
