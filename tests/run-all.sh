#!/usr/bin/env bash
# Every test of Gatefold: unit, API, collaboration, simulation and analysis tests in Vitest, then the
# browser tests in Playwright against the built app. Makes sure its outside tools are installed first.
set -euo pipefail
cd "$(dirname "$0")/.."

need() { # need <command path> <debian package>
  if [ -x "$1" ]; then return 0; fi
  if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
    echo "installing Debian package $2 (needed by the tests)"
    if [ -z "${GATEFOLD_APT_UPDATED:-}" ]; then apt-get update -qq >/dev/null; export GATEFOLD_APT_UPDATED=1; fi
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$2" >/dev/null
  else
    echo "error: the tests need $1: install the Debian package '$2' (apt-get install $2)" >&2
    exit 1
  fi
}
need /usr/bin/chromium chromium
need /usr/bin/iverilog iverilog
# several servers: the API suite on PostgreSQL and tests/multi-server start these on private ports
need /usr/lib/postgresql/15/bin/initdb postgresql
need /usr/bin/redis-server redis-server

node_modules/.bin/vitest run
node_modules/.bin/vite build --logLevel warn
node_modules/.bin/playwright test
