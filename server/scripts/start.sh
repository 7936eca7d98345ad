#!/usr/bin/env bash
# npm start: dependencies, PostgreSQL on loopback, the web build, then one server process that migrates, imports the default data, seeds the demo and listens.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
bash server/scripts/ensure-deps.sh
# Assigned before export so that a database that cannot start stops npm start here (set -e).
DATABASE_URL="${DATABASE_URL:-$(bash server/scripts/pg.sh start)}"
export DATABASE_URL
stop_all() {
  trap - INT TERM EXIT
  [ -n "${SERVER_PID:-}" ] && kill "$SERVER_PID" 2>/dev/null && wait "$SERVER_PID" 2>/dev/null || true
  [ -z "${KEEP_DB_RUNNING:-}" ] && bash server/scripts/pg.sh stop && echo "Database stopped."
}
trap stop_all INT TERM EXIT
bash server/scripts/build-web.sh
node_modules/.bin/tsx server/cli/start.ts &
SERVER_PID=$!
wait "$SERVER_PID"
