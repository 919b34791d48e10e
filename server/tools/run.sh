#!/usr/bin/env bash
# Entry of `npm start` and `npm test` on a fresh clone: make sure the npm dependencies are
# there (nothing else can run before them), then hand over to the TypeScript bootstrap.
set -euo pipefail
cd "$(dirname "$0")/../.."

major=$(node -p 'process.versions.node.split(".")[0]')
if [ "$major" -lt 20 ]; then
  echo "Kerfbook needs Node.js 20.19 or newer; this is $(node -v)." >&2
  exit 1
fi

# Reinstall when node_modules is missing or older than the lock file.
if [ ! -x node_modules/.bin/tsx ] || [ ! -x node_modules/.bin/ng ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "[setup] installing npm dependencies (npm ci)…"
  npm ci --no-audit --no-fund
fi

usage="usage: run.sh start|test|seed-large|bench|bench-web|soak|backup|restore"
mode="${1:?$usage}"
shift
case "$mode" in
  start) entry=server/tools/start.ts ;;
  test) entry=server/tools/test.ts ;;
  backup) entry=server/cli/backup.ts ;;
  restore) entry=server/cli/restore.ts ;;
  seed-large) entry=test/perf/large-data/run.ts ;;
  bench) entry=test/perf/load/run.ts ;;
  bench-web) entry=test/perf/web/run.ts ;;
  soak) entry=test/soak/run.ts ;;
  *) echo "$usage" >&2; exit 2 ;;
esac
# exec so that Ctrl-C and SIGTERM reach the TypeScript process itself: npm and a shell in
# between would not pass them on, and the databases it started would stay behind.
exec node_modules/.bin/tsx "$entry" "$@"
