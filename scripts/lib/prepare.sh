# Shared set-up for `npm start` and `npm test`: node modules, PostgreSQL binaries, Chromium.
# Sourced by start.sh and test.sh; everything else is done in TypeScript (scripts/*.ts).

PG_BIN_DIR="${PG_BIN_DIR:-/usr/lib/postgresql/15/bin}"
export PG_BIN_DIR

is_root() { [ "$(id -u)" = "0" ]; }

ensure_node_modules() {
  # Install from the lock when modules are missing or older than the lock.
  if [ ! -d node_modules ] || [ ! -x node_modules/.bin/tsx ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "› installing node modules from package-lock.json"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

apt_install() {
  # Debian's packages only. apt-get update once per set-up when a package is missing.
  if is_root; then
    echo "› installing $* from Debian's packages"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
  else
    echo "✗ $* is not installed. Run this once, then try again:" >&2
    echo "    sudo apt-get install -y $*" >&2
    exit 1
  fi
}

ensure_postgres() {
  if [ ! -x "$PG_BIN_DIR/initdb" ]; then
    apt_install postgresql
    # Debian's package starts a cluster of its own on 5432; Broodcast never uses it.
  fi
  if [ ! -x "$PG_BIN_DIR/initdb" ]; then
    echo "✗ PostgreSQL binaries not found in $PG_BIN_DIR (set PG_BIN_DIR)" >&2
    exit 1
  fi
}

ensure_chromium() {
  if [ -z "${CHROMIUM_PATH:-}" ]; then
    if [ ! -x /usr/bin/chromium ]; then apt_install chromium; fi
    export CHROMIUM_PATH=/usr/bin/chromium
  fi
}
