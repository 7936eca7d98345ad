#!/usr/bin/env bash
# Exports the web app to dist/ (or $WEB_DIST_DIR) when its sources changed since the last build.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
OUT="${WEB_DIST_DIR:-$ROOT/dist}"
hash="$(find app components shared assets -type f -print0 2>/dev/null | sort -z | xargs -0 sha256sum | \
  cat - app.json babel.config.js metro.config.js tsconfig.json package-lock.json 2>/dev/null | sha256sum | cut -c1-16)"
if [ -f "$OUT/.build-hash" ] && [ "$(cat "$OUT/.build-hash")" = "$hash" ]; then
  echo "Web build is up to date ($OUT)."
  exit 0
fi
echo "Building the web app (first build takes about a minute)…"
rm -rf "$OUT"
EXPO_NO_TELEMETRY=1 EXPO_OFFLINE=1 CI=1 node_modules/.bin/expo export --platform web --output-dir "$OUT" >"${TMPDIR:-/tmp}/carbwright-web-build.log" 2>&1 || {
  echo "ERROR: web build failed; log:" >&2; tail -n 40 "${TMPDIR:-/tmp}/carbwright-web-build.log" >&2; exit 1; }
echo "$hash" > "$OUT/.build-hash"
echo "Web app built into $OUT."
