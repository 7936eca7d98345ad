#!/usr/bin/env bash
# npm test: dependencies, a throwaway PostgreSQL on a free port, the web build, then every test
# (unit + API, web components, browser end-to-end). Always stops its database. Extra arguments go to jest
# (e.g. `npm test -- tests/server/auth` runs matching files in every project).
# TEST_PROJECTS="node" (or any of node web e2e) limits the run; the web build happens only for e2e.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
bash server/scripts/ensure-deps.sh
bash server/scripts/ensure-chromium.sh

TMP="$(mktemp -d /tmp/carbwright-test.XXXXXX)"
chmod 755 "$TMP"
export PG_DATA_DIR="$TMP/pg" PG_DB=carbwright_test PGPORT="$(bash server/scripts/free-port.sh)"
cleanup() {
  bash server/scripts/pg.sh stop || true
  rm -rf "$TMP"
}
trap cleanup EXIT
trap 'exit 130' INT TERM
export DATABASE_URL="$(PG_FSYNC=off PG_SYNC_COMMIT=off bash server/scripts/pg.sh start)"
export NODE_ENV=test CI="${CI:-}" TEST_OUTPUT_DIR="${TEST_OUTPUT_DIR:-$ROOT/test-output}"
mkdir -p "$TEST_OUTPUT_DIR"

PROJECTS="${TEST_PROJECTS:-node web e2e}"
case " $PROJECTS " in *" e2e "*) bash server/scripts/build-web.sh ;; esac

JEST=node_modules/.bin/jest
status=0
results=()
run() { # name, then jest args
  local name=$1; shift
  local out="$TMP/$name.json"
  echo "── $name tests ──"
  if "$@" --ci --json --outputFile="$out" "${EXTRA[@]}"; then :; else status=1; fi
  [ -f "$out" ] && results+=("$out")
}
EXTRA=("$@")
for project in $PROJECTS; do
  case "$project" in
    node) NODE_OPTIONS="--experimental-vm-modules ${NODE_OPTIONS:-}" run node "$JEST" --selectProjects node --maxWorkers=2 --passWithNoTests ;;
    web) run web "$JEST" --selectProjects web --maxWorkers=2 --passWithNoTests ;;
    e2e) run e2e "$JEST" --selectProjects e2e --runInBand --passWithNoTests ;;
  esac
done

node -e '
  let p = 0, f = 0, s = 0;
  for (const file of process.argv.slice(1)) {
    const r = require(file);
    p += r.numPassedTests; f += r.numFailedTests; s += r.numPendingTests + (r.numTodoTests || 0);
  }
  console.log(`\nTotal: ${p} passed, ${f} failed, ${s} skipped`);
' "${results[@]}"
exit $status
