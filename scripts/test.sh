#!/usr/bin/env bash
# `npm test`: set up a separate test cluster and mail catcher, build the client, run every test.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh
ensure_node_modules
ensure_postgres
ensure_chromium
exec node_modules/.bin/tsx scripts/test.ts "$@"
