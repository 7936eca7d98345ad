#!/usr/bin/env bash
# Exports the web app to dist/ (or $WEB_DIST_DIR) when its sources changed since the last build.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
OUT="${WEB_DIST_DIR:-$ROOT/dist}"
hash="$(find app components shared assets public -type f -print0 2>/dev/null | sort -z | xargs -0 sha256sum | \
  cat - app.json babel.config.js metro.config.js tsconfig.json package-lock.json server/cli/compress-web.ts server/cli/service-worker.ts server/lib/service-worker.ts 2>/dev/null | sha256sum | cut -c1-16)"
if [ -f "$OUT/.build-hash" ] && [ "$(cat "$OUT/.build-hash")" = "$hash" ]; then
  echo "Web build is up to date ($OUT)."
  exit 0
fi
# The log stays in this clone's own git-ignored .logs/, so two clones never write over each other's.
LOG="$ROOT/.logs/web-build.log"
mkdir -p "$ROOT/.logs"
echo "Building the web app (first build takes about a minute; log in .logs/web-build.log)…"
rm -rf "$OUT"
EXPO_NO_TELEMETRY=1 EXPO_OFFLINE=1 CI=1 node_modules/.bin/expo export --platform web --output-dir "$OUT" >"$LOG" 2>&1 || {
  echo "ERROR: web build failed; log ($LOG):" >&2; tail -n 40 "$LOG" >&2; exit 1; }
# The offline app shell's service worker, before compression so sw.js and its precache list are compressed with the rest.
node_modules/.bin/tsx server/cli/service-worker.ts "$OUT" >>"$LOG" 2>&1 || {
  echo "ERROR: service worker build failed; log ($LOG):" >&2; tail -n 20 "$LOG" >&2; exit 1; }
# Brotli and gzip copies of every text file, made once here and sent as they are by server/web.ts.
node_modules/.bin/tsx server/cli/compress-web.ts "$OUT" >>"$LOG" 2>&1
echo "$hash" > "$OUT/.build-hash"
echo "Web app built into $OUT."
