#!/usr/bin/env bash
# npm run bench [-- --only api,scaleout --rounds 3 --duration 10 --scale 1 --skip-build]:
# the production build on loopback, with a database of its own, then bench/run.ts.
# Ports: BENCH_PORT (server), +1 (a second server process), +2 (the bare baseline).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

SKIP_BUILD=${BENCH_SKIP_BUILD:-0}
ARGS=()
for a in "$@"; do
  if [ "$a" = "--skip-build" ]; then SKIP_BUILD=1; else ARGS+=("$a"); fi
done

ensure_node_modules
bash scripts/db.sh start
export NODE_ENV=production
export BENCH_PORT=${BENCH_PORT:-3400}
export PORT=$BENCH_PORT
export DATABASE_URL=$(database_url brixhouse_bench)
export SMTP_PORT=${SMTP_PORT:-1025}
MAIL_WEB_PORT=${MAIL_WEB_PORT:-1080}
export APP_URL=http://127.0.0.1:$BENCH_PORT NEXTAUTH_URL=http://127.0.0.1:$BENCH_PORT
export NEXTAUTH_SECRET=brixhouse-bench-secret-not-for-production
export NEXT_DIST_DIR=.next-bench
export BENCH_ROUTES=1

for p in "$BENCH_PORT" $((BENCH_PORT + 1)) $((BENCH_PORT + 2)); do
  if node -e "require('net').connect($p,'127.0.0.1').on('connect',()=>process.exit(0)).on('error',()=>process.exit(1))"; then
    echo "Port $p is in use; set BENCH_PORT to a free port (the bench uses it and the next two)." >&2
    exit 1
  fi
done

log "A fresh benchmark database (brixhouse_bench)"
bash scripts/db.sh reset brixhouse_bench --force
bash scripts/db.sh explain brixhouse_bench
npm run --silent db:migrate -- --quiet
npm run --silent db:seed

# maildev: reuse one already listening on these ports (npm start's), else start one.
STARTED_MAIL=0
if ! node -e "fetch('http://127.0.0.1:$MAIL_WEB_PORT/api/email').then(r=>process.exit(r.ok?0:1)).catch(()=>process.exit(1))"; then
  bash scripts/mail.sh start maildev-bench "$SMTP_PORT" "$MAIL_WEB_PORT"
  STARTED_MAIL=1
fi
cleanup() { [ "$STARTED_MAIL" = 1 ] && stop_bg maildev-bench; return 0; }
trap cleanup EXIT

if [ "$SKIP_BUILD" != 1 ] || [ ! -d "$NEXT_DIST_DIR" ]; then
  log "Building for production (into $NEXT_DIST_DIR)"
  npx next build > "$DATA_DIR/build-bench.log" 2>&1 || { tail -n 60 "$DATA_DIR/build-bench.log"; exit 1; }
fi

log "Benchmarks (server on 127.0.0.1:$BENCH_PORT)"
node --import tsx bench/run.ts "${ARGS[@]}"
