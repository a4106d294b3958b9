#!/usr/bin/env bash
# `npm start`: set everything up on this machine and run Broodcast with the demo region.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/prepare.sh
ensure_node_modules
ensure_postgres
exec node_modules/.bin/tsx scripts/start.ts "$@"
