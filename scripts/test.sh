#!/usr/bin/env bash
# `npm test`: set up a separate test cluster and mail catcher, build the client, run every test.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh
# One test run at a time per checkout: runs share the test cluster, the mail catcher's ports and
# node_modules (two `npm ci` at once would remove each other's files), so the lock comes first.
mkdir -p .local
exec 9>.local/test.lock
if ! flock -n 9; then
  echo "› another npm test is running in this checkout; waiting for it"
  flock 9
fi
ensure_node_modules
ensure_postgres
ensure_chromium
exec node_modules/.bin/tsx scripts/test.ts "$@"
