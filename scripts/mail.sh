#!/usr/bin/env bash
# maildev on loopback: SMTP and its web inbox. Usage: mail.sh start|stop NAME SMTP_PORT WEB_PORT
set -euo pipefail
source "$(dirname "$0")/lib.sh"
action=$1; name=${2:-maildev}; smtp=${3:-1025}; web=${4:-1080}
case "$action" in
  start)
    if ! { [ -f "$DATA_DIR/$name.pid" ] && kill -0 "$(cat "$DATA_DIR/$name.pid")" 2>/dev/null; }; then
      require_free_port "SMTP port of $name" "$smtp"
      require_free_port "inbox port of $name" "$web"
    fi
    start_bg "$name" "$ROOT/node_modules/.bin/maildev" --ip 127.0.0.1 --web-ip 127.0.0.1 \
      --smtp "$smtp" --web "$web" --silent
    wait_for_url "http://127.0.0.1:$web/api/email"
    ;;
  stop) stop_bg "$name" ;;
esac
