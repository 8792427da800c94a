#!/usr/bin/env bash
# npm start: everything the demo needs on a bare machine, then the server in the foreground.
source "$(dirname "$0")/lib.sh"

export LOADLINE_DB_PORT=${LOADLINE_DB_PORT:-54329}
export LOADLINE_DB_CLUSTER=${LOADLINE_DB_CLUSTER:-demo}
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$LOADLINE_DB_PORT/loadline}
export PORT=${PORT:-8080}
# The payment stand-in (standins/payments) answers the stripe SDK here and sends its events to the app's webhook.
export STRIPE_API_PORT=${STRIPE_API_PORT:-8470}
export PAYMENTS_WEBHOOK_URL=${PAYMENTS_WEBHOOK_URL:-http://127.0.0.1:$PORT/api/payments/webhook}
# The mail stand-in's ports, and the app pointed at them.
export MAIL_STANDIN_SMTP_PORT=${MAIL_STANDIN_SMTP_PORT:-2525}
export MAIL_STANDIN_HTTP_PORT=${MAIL_STANDIN_HTTP_PORT:-2526}
export SMTP_HOST=${SMTP_HOST:-127.0.0.1}
export SMTP_PORT=${SMTP_PORT:-$MAIL_STANDIN_SMTP_PORT}
export MAIL_CAPTURE_URL=${MAIL_CAPTURE_URL:-http://127.0.0.1:$MAIL_STANDIN_HTTP_PORT}

ensure_node_modules

started_db=0
if ! bash docker-free-db/db.sh status >/dev/null 2>&1; then
  bash docker-free-db/db.sh start
  started_db=1
fi
# Stops only what this run started; a database that was already up stays up.
cleanup() {
  set +e
  if [ -n "${server_pid:-}" ]; then kill -TERM "$server_pid" 2>/dev/null; wait "$server_pid" 2>/dev/null; fi
  bash scripts/standins.sh stop
  if [ "$started_db" = 1 ]; then bash docker-free-db/db.sh stop; fi
}
trap cleanup EXIT
trap 'exit 130' INT TERM

bash docker-free-db/db.sh ensure-db "${DATABASE_URL##*/}" >/dev/null
tsx_server server/db/migrate.ts
# The stand-ins first: the demo orders are paid on the payment stand-in, so staff can refund them.
bash scripts/standins.sh start
tsx_server seeds/seed.ts --if-empty
ensure_client_build

cat <<MSG

  Loadline is starting on http://127.0.0.1:$PORT
  Demo sign-ins (password: loadline-demo):
    rider@demo.test   staff@demo.test   warehouse@demo.test   admin@demo.test
  Press Ctrl-C to stop.

MSG
tsx_server server/index.ts &
server_pid=$!
wait "$server_pid"
