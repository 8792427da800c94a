#!/usr/bin/env bash
# npm run dev: the API with reload on change, Vite's dev server with hot reload and the API proxied.
source "$(dirname "$0")/lib.sh"
export LOADLINE_DB_PORT=${LOADLINE_DB_PORT:-54329}
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$LOADLINE_DB_PORT/loadline}
export PORT=${PORT:-8080}
ensure_node_modules
bash docker-free-db/db.sh start
bash docker-free-db/db.sh ensure-db "${DATABASE_URL##*/}" >/dev/null
tsx_server server/db/migrate.ts
tsx_server seeds/seed.ts --if-empty
echo "loadline: open http://127.0.0.1:5173 (API on :$PORT)"
npx tsx watch --tsconfig tsconfig.server.json server/index.ts &
api=$!
trap 'kill $api 2>/dev/null' EXIT
npx vite
