#!/usr/bin/env bash
# Installs what is missing on a fresh machine: npm packages, and as root Debian's PostgreSQL
# server; with --test also what the tests need besides: Chromium for the end-to-end tests and
# poppler-utils, whose pdftotext and pdffonts read the PDF reports in the integration tests.
# Safe to run again: it only acts on gaps.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"

APT_UPDATED=0
apt_install() {
  if [ "$(id -u)" != 0 ]; then
    echo "Missing system package(s): $*. Install them (as root: apt-get install -y $*) and retry." >&2
    exit 1
  fi
  if [ "$APT_UPDATED" = 0 ]; then apt-get update -qq; APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

# npm packages: install when node_modules is absent or older than the lockfile.
if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages…"
  if [ -f package-lock.json ]; then npm ci --no-audit --no-fund; else npm install --no-audit --no-fund; fi
fi

# PostgreSQL server binaries (psql alone is not enough).
if ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
  echo "Installing PostgreSQL…"
  apt_install postgresql
fi

if [ "${1:-}" = "--test" ]; then
  if [ ! -x /usr/bin/chromium ]; then
    echo "Installing Chromium for the end-to-end tests…"
    apt_install chromium
  fi
  if [ ! -x /usr/bin/pdftotext ] || [ ! -x /usr/bin/pdffonts ]; then
    echo "Installing poppler-utils for the report tests…"
    apt_install poppler-utils
  fi
fi
