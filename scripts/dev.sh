#!/usr/bin/env bash
# `npm run dev`: the same server (API + socket.io) plus Vite with hot reload on :5173, which
# proxies /api and /socket.io to it.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
VITE_PID=""
cleanup() { if [ -n "$VITE_PID" ]; then kill "$VITE_PID" 2>/dev/null || true; fi; }
trap cleanup EXIT
node_modules/.bin/vite >/dev/null 2>&1 &
VITE_PID=$!
echo "Vite dev server with hot reload: http://127.0.0.1:5173"
SKIP_BUILD=1 bash scripts/start.sh
