#!/usr/bin/env bash
# The local stand-in for the hosted payment service, on loopback. Usage: pay.sh start|stop NAME PORT
# It is started only when the app is pointed at loopback (real test keys and host need none).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
action=$1; name=${2:-pay-fake}; port=${3:-9400}
case "$action" in
  start)
    if [ "${STRIPE_API_HOST:-127.0.0.1}" != "127.0.0.1" ]; then exit 0; fi
    export PAY_PORT=$port
    if ! { [ -f "$DATA_DIR/$name.pid" ] && kill -0 "$(cat "$DATA_DIR/$name.pid")" 2>/dev/null; }; then
      require_free_port "port of $name" "$port"
    fi
    start_bg "$name" node --import tsx "$ROOT/scripts/pay-fake.ts"
    wait_for_url "http://127.0.0.1:$port/health"
    ;;
  stop) stop_bg "$name" ;;
esac
