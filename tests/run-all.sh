#!/usr/bin/env bash
# The one test command: installs what the tests need (Debian packages when missing), builds the
# client for the browser tests, then runs every vitest project (unit, acceptance, e2e).
set -euo pipefail
cd "$(dirname "$0")/.."
bash server/scripts/ensure-debian.sh \
  /usr/sbin/mariadbd:mariadb-server mariadb-admin:mariadb-client redis-server:redis-server \
  chromium:chromium proj:proj-bin geod:proj-bin /usr/include/proj.h:libproj-dev pdftotext:poppler-utils \
  gcc:gcc pkg-config:pkg-config
start=$(date +%s)
if [ -f src/main.tsx ]; then npx vite build --logLevel warn; fi
npx vitest run "$@"
echo "warpmeter: all tests finished in $(( $(date +%s) - start )) s"
