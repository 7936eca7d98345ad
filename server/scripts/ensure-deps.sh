#!/usr/bin/env bash
# Installs npm dependencies when node_modules is missing or older than the lock file.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$ROOT"
stamp=node_modules/.carbwright-deps
want="$(sha256sum package.json package-lock.json 2>/dev/null | sha256sum | cut -c1-16)"
if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
  echo "Installing npm dependencies…"
  # A fresh clone gets exactly the lock file; an existing tree is brought up to date in place.
  if [ -f package-lock.json ] && [ ! -d node_modules ]; then
    npm ci --no-audit --no-fund --loglevel=error
  else
    npm install --no-audit --no-fund --loglevel=error
  fi
  sha256sum package.json package-lock.json | sha256sum | cut -c1-16 > "$stamp"
fi
