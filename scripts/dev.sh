#!/usr/bin/env bash
# npm run dev: the API with reload on change, Vite's dev server with hot reload and the API proxied.
source "$(dirname "$0")/lib.sh"
export LOADLINE_DB_PORT=${LOADLINE_DB_PORT:-54329}
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$LOADLINE_DB_PORT/loadline}
export PORT=${PORT:-8080}
# Same mail stand-in ports as npm start (the two are not meant to run at once).
export MAIL_STANDIN_SMTP_PORT=${MAIL_STANDIN_SMTP_PORT:-2525}
export MAIL_STANDIN_HTTP_PORT=${MAIL_STANDIN_HTTP_PORT:-2526}
export SMTP_PORT=${SMTP_PORT:-$MAIL_STANDIN_SMTP_PORT}
export MAIL_CAPTURE_URL=${MAIL_CAPTURE_URL:-http://127.0.0.1:$MAIL_STANDIN_HTTP_PORT}
# Same payment stand-in port as npm start; its events go to the API process.
export STRIPE_API_PORT=${STRIPE_API_PORT:-8470}
export PAYMENTS_WEBHOOK_URL=${PAYMENTS_WEBHOOK_URL:-http://127.0.0.1:$PORT/api/payments/webhook}
ensure_node_modules
bash docker-free-db/db.sh start
bash docker-free-db/db.sh ensure-db "${DATABASE_URL##*/}" >/dev/null
tsx_server server/db/migrate.ts
tsx_server seeds/seed.ts --if-empty
bash scripts/standins.sh start
echo "loadline: open http://127.0.0.1:5173 (API on :$PORT)"
npx tsx watch --tsconfig tsconfig.server.json server/index.ts &
api=$!
trap 'kill $api 2>/dev/null; bash scripts/standins.sh stop' EXIT
npx vite
