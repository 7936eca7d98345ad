#!/usr/bin/env bash
# Browser tests drive Debian's Chromium; install it when missing (as root), else say what to do.
set -euo pipefail
CHROME="${CHROME_PATH:-/usr/bin/chromium}"
[ -x "$CHROME" ] && exit 0
if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
  echo "Installing Debian's chromium for the browser tests…"
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  exit 0
fi
echo "ERROR: $CHROME not found. Install it as root: apt-get install -y chromium" >&2
exit 1
