#!/usr/bin/env bash
# npm start: install, database, migrations, demo data, mail server, build, serve.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

ensure_node_modules
bash scripts/db.sh start

export NODE_ENV=production
export PORT
export DATABASE_URL=${DATABASE_URL:-$(database_url brixhouse_dev)}
export SMTP_PORT
export APP_URL=${APP_URL:-http://127.0.0.1:$PORT}
export NEXTAUTH_URL=$APP_URL
if [ -z "${NEXTAUTH_SECRET:-}" ]; then
  export NEXTAUTH_SECRET=$(secret_file "$DATA_DIR/nextauth-secret")
fi
require_free_port PORT "$PORT"

log "Starting maildev (SMTP 127.0.0.1:$SMTP_PORT, inbox http://127.0.0.1:$MAIL_WEB_PORT)"
bash scripts/mail.sh start maildev "$SMTP_PORT" "$MAIL_WEB_PORT"

S3_PORT=${S3_PORT:-9200}
if [ -z "${S3_ENDPOINT:-}" ]; then
  log "Starting the local object store (http://127.0.0.1:$S3_PORT)"
  bash scripts/s3.sh start s3 "$S3_PORT" "$S3_BUCKET"
  export S3_ENDPOINT=http://127.0.0.1:$S3_PORT
fi
payment_env "${PAY_PORT:-9400}"
log "Starting the local payment service stand-in (127.0.0.1:$PAY_PORT)"
bash scripts/pay.sh start pay-fake "$PAY_PORT"

log "Migrating the database"
npm run --silent db:migrate -- --quiet
npm run --silent db:seed

if [ "${SKIP_BUILD:-}" != "1" ]; then
  log "Building (next build)"
  npx next build > "$DATA_DIR/build.log" 2>&1 || { tail -n 60 "$DATA_DIR/build.log"; exit 1; }
fi

cat <<BANNER

  Brixhouse is starting on  $APP_URL
  Mail inbox (maildev):     http://127.0.0.1:$MAIL_WEB_PORT

  Demo sign-ins (password: syrup-season)
    coordinator   coordinator@larkspur.example
    sugarmakers   sugarmaker@larkspur.example, sugarmaker2@larkspur.example
    members       okafor@, lindqvist@, tremblay-haddad@, nakamura@,
                  brennan@, szabo@, ferreira@larkspur.example

  Stop everything with: npm run stop

BANNER
echo $$ > "$DATA_DIR/server.pid"
# shellcheck disable=SC2086 # the flags are words
exec node $SERVER_NODE_ARGS --import tsx server.ts
