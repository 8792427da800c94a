#!/usr/bin/env bash
# npm test: the same set-up as npm start on the tests' own cluster, then unit, API and end-to-end tests.
source "$(dirname "$0")/lib.sh"

export LOADLINE_DB_PORT=${LOADLINE_TEST_DB_PORT:-54339}
export LOADLINE_DB_CLUSTER=test
export LOADLINE_DB_FAST=1
export TEST_DATABASE_URL="postgres://postgres@127.0.0.1:$LOADLINE_DB_PORT/loadline_test"
export E2E_DATABASE_URL="postgres://postgres@127.0.0.1:$LOADLINE_DB_PORT/loadline_e2e"
export E2E_PORT=${E2E_PORT:-8090}
# The tests' own payment stand-in, apart from npm start's; the end-to-end server takes its events.
export STRIPE_API_PORT=${TEST_STRIPE_API_PORT:-8471}
export PAYMENTS_WEBHOOK_URL="http://127.0.0.1:$E2E_PORT/api/payments/webhook"
export PAYMENTS_RETRY_BASE_MS=${PAYMENTS_RETRY_BASE_MS:-200}
# The tests' mail stand-in, on ports of its own so it can run beside npm start's.
export MAIL_STANDIN_SMTP_PORT=${MAIL_STANDIN_SMTP_PORT:-2535}
export MAIL_STANDIN_HTTP_PORT=${MAIL_STANDIN_HTTP_PORT:-2536}

apt_install chromium
ensure_node_modules

started_db=0
if ! bash docker-free-db/db.sh status >/dev/null 2>&1; then
  bash docker-free-db/db.sh start
  started_db=1
fi
export LOADLINE_RUN_DIR="$PWD/.run/test"
# Each run starts the stand-ins from empty state.
rm -f "$LOADLINE_RUN_DIR"/standins/*-state-*.json
trap 'bash scripts/standins.sh stop || true; if [ "$started_db" = 1 ]; then bash docker-free-db/db.sh stop >/dev/null || true; fi' EXIT
bash scripts/standins.sh start

rm -rf test-results && mkdir -p test-results
bash docker-free-db/db.sh ensure-db loadline_test >/dev/null
# The end-to-end database is rebuilt from the migrations and the demo seed on every run.
runuser -u postgres -- psql -q -h 127.0.0.1 -p "$LOADLINE_DB_PORT" -U postgres -c 'DROP DATABASE IF EXISTS loadline_e2e WITH (FORCE)' >/dev/null
bash docker-free-db/db.sh ensure-db loadline_e2e >/dev/null
DATABASE_URL=$E2E_DATABASE_URL tsx_server server/db/migrate.ts >/dev/null
DATABASE_URL=$E2E_DATABASE_URL tsx_server seeds/seed.ts
rm -rf .data/e2e-uploads

status=0
log "type-checking…"
npx vue-tsc --build || status=1
ensure_client_build

log "unit tests…"
npx vitest run --project unit --reporter=default --reporter=json --outputFile.json=test-results/unit.json || status=1
log "API tests against PostgreSQL…"
npx vitest run --project api --reporter=default --reporter=json --outputFile.json=test-results/api.json || status=1
log "end-to-end tests in Chromium…"
npx playwright test -c e2e/playwright.config.ts || status=1

node scripts/count-tests.mjs || status=1
exit $status
