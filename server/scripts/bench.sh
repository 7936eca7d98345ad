#!/usr/bin/env bash
# npm run bench: a throwaway PostgreSQL, then server/bench/run.ts prints the figures.
# BENCH_SECONDS (default 5), BENCH_CONNECTIONS (default 10), BENCH_ONLY=<file part>[,<file part>…] to run some files.
# `npm run bench -- --only web` is BENCH_ONLY=web; the web part needs no generated volume, so it skips it.
set -euo pipefail
if [ "${1:-}" = "--only" ] && [ -n "${2:-}" ]; then
  export BENCH_ONLY="$2"
  [ "$2" = "web" ] && export BENCH_VOLUME="${BENCH_VOLUME:-0}"
fi
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
bash server/scripts/ensure-deps.sh
TMP="$(mktemp -d /tmp/carbwright-bench.XXXXXX)"
chmod 755 "$TMP"
export PG_DATA_DIR="$TMP/pg" PG_DB=carbwright_bench PGPORT="$(bash server/scripts/free-port.sh)"
trap 'bash server/scripts/pg.sh stop || true; rm -rf "$TMP"' EXIT
export DATABASE_URL="$(bash server/scripts/pg.sh start)"
export DATA_DIR="$TMP/data" UPLOADS_DIR="$TMP/uploads"
node_modules/.bin/tsx server/bench/run.ts
