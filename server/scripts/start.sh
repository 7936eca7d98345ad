#!/usr/bin/env bash
# npm start: dependencies, PostgreSQL on loopback, migrations, default data, demo, web build, server.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
bash server/scripts/ensure-deps.sh
export DATABASE_URL="${DATABASE_URL:-$(bash server/scripts/pg.sh start)}"
stop_all() {
  trap - INT TERM EXIT
  [ -n "${SERVER_PID:-}" ] && kill "$SERVER_PID" 2>/dev/null && wait "$SERVER_PID" 2>/dev/null || true
  [ -z "${KEEP_DB_RUNNING:-}" ] && bash server/scripts/pg.sh stop && echo "Database stopped."
}
trap stop_all INT TERM EXIT
node_modules/.bin/tsx server/cli/setup.ts
bash server/scripts/build-web.sh
node_modules/.bin/tsx server/index.ts &
SERVER_PID=$!
wait "$SERVER_PID"
