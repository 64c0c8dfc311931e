#!/usr/bin/env bash
# `npm test`: install what is missing (Chromium and poppler-utils too), start a throw-away
# PostgreSQL cluster on its own port, then static checks (types, lint, formatting), unit,
# integration and end-to-end tests. The cluster is removed afterwards.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh --test

export PGPORT="${TEST_PGPORT:-54339}"
export PGBASE="$(mktemp -d /tmp/tributary-test-pg.XXXXXX)"
chmod 755 "$PGBASE"
cleanup() { PGBASE="$PGBASE" bash scripts/pg.sh destroy >/dev/null 2>&1 || true; }
trap cleanup EXIT
# fsync off: a throw-away cluster needs no durability, and it halves the run time.
PGEXTRA="-c fsync=off -c synchronous_commit=off" bash scripts/pg.sh start
bash scripts/pg.sh ensure-db tributary_test
bash scripts/pg.sh ensure-db tributary_e2e

export NODE_ENV=test
export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/tributary_test"
DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/tributary_e2e" node --import tsx scripts/migrate.ts
DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/tributary_e2e" node --import tsx scripts/seed.ts --if-empty
node --import tsx scripts/migrate.ts

echo "== static checks (types, ESLint, Prettier)"
npm run -s typecheck
npm run -s lint
echo "== unit tests"
node_modules/.bin/vitest run --project unit
echo "== integration tests (PostgreSQL on 127.0.0.1:$PGPORT)"
node_modules/.bin/vitest run --project integration
echo "== end-to-end tests (Chromium)"
node_modules/.bin/vite build --logLevel warn
E2E_DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/tributary_e2e" node_modules/.bin/playwright test
