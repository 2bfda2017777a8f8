#!/usr/bin/env bash
# Self-setup shared by `npm start`, `npm test` and `npm run bench`:
# installs node modules when missing or older than the lock, PostgreSQL from Debian when its
# binaries are missing, and (with --browser) Debian's Chromium for the end-to-end tests.
set -euo pipefail
cd "$(dirname "$0")/.."

want_browser=0
for arg in "$@"; do
  [ "$arg" = "--browser" ] && want_browser=1
done

log() { printf '[setup] %s\n' "$*"; }

apt_install() {
  if [ "$(id -u)" -ne 0 ]; then
    echo "[setup] '$*' is missing and this is not root: install it with apt-get install -y $*" >&2
    exit 1
  fi
  if [ ! -f /tmp/.shadowloop-apt-updated ]; then
    log "apt-get update"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    touch /tmp/.shadowloop-apt-updated
  fi
  log "apt-get install -y $*"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  log "installing node modules (npm ci)"
  npm ci --no-audit --no-fund --loglevel=error
fi

pg_bin=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
if [ -z "$pg_bin" ] || [ ! -x "$pg_bin/initdb" ]; then
  apt_install postgresql
fi

if [ "$want_browser" -eq 1 ] && ! command -v chromium >/dev/null 2>&1; then
  apt_install chromium
fi
