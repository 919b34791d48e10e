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

mode="${1:?usage: run.sh start|test|seed-large|bench|bench-web}"
shift
# exec so that Ctrl-C and SIGTERM reach the bootstrap itself (toolchain pitfall 12).
exec node_modules/.bin/tsx "server/tools/${mode}.ts" "$@"
