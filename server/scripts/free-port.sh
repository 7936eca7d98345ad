#!/usr/bin/env bash
# Prints a TCP port on 127.0.0.1 that nothing listens on.
for _ in $(seq 1 50); do
  p=$(( 20000 + RANDOM % 30000 ))
  (exec 3<>/dev/tcp/127.0.0.1/$p) 2>/dev/null || { echo "$p"; exit 0; }
done
echo "no free port found" >&2; exit 1
