#!/usr/bin/env bash
# `npm start`: install what is missing, start the private PostgreSQL, migrate, seed the demo (only
# into an empty database), build the client and serve app + API. Ctrl-C stops both cleanly.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh

export PGPORT="${PGPORT:-54329}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/tributary}"
export PORT="${PORT:-3000}"

SERVER_PID=""
shutdown() {
  trap - INT TERM EXIT
  if [ -n "$SERVER_PID" ] && kill -0 "$SERVER_PID" 2>/dev/null; then
    kill -TERM "$SERVER_PID" 2>/dev/null || true
    wait "$SERVER_PID" 2>/dev/null || true
  fi
  bash scripts/pg.sh stop || true
}
trap shutdown INT TERM EXIT

bash scripts/pg.sh start
bash scripts/pg.sh ensure-db tributary
node --import tsx scripts/migrate.ts
node --import tsx scripts/seed.ts --if-empty
if [ "${SKIP_BUILD:-0}" != 1 ]; then node_modules/.bin/vite build --logLevel warn; fi

node --import tsx server/index.ts &
SERVER_PID=$!
wait "$SERVER_PID"
