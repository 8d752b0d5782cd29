#!/usr/bin/env bash
# The local object store (s3rver) on loopback. Usage: s3.sh start|stop NAME PORT [BUCKET]
set -euo pipefail
source "$(dirname "$0")/lib.sh"
action=$1; name=${2:-s3}; port=${3:-9200}; bucket=${4:-${S3_BUCKET:-brixhouse}}
case "$action" in
  start)
    if ! { [ -f "$DATA_DIR/$name.pid" ] && kill -0 "$(cat "$DATA_DIR/$name.pid")" 2>/dev/null; }; then
      require_free_port "port of $name" "$port"
    fi
    start_bg "$name" node "$ROOT/scripts/s3-server.mjs" "$port" "$DATA_DIR/$name" "$bucket"
    wait_for_url "http://127.0.0.1:$port/"
    ;;
  stop) stop_bg "$name" ;;
esac
