#!/usr/bin/env bash
# `npm start`: services up, client built, demo studio seeded, app serving on http://127.0.0.1:${PORT:-3000}.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
cd "$ROOT"
bash server/scripts/services.sh up
if [ ! -f dist/index.html ] || [ -n "$(find src index.html -newer dist/index.html -print -quit 2>/dev/null)" ]; then
  npx vite build --logLevel warn
fi
if [ -f server/seed/seed-main.ts ]; then npx tsx server/seed/seed-main.ts; fi
DATA="$ROOT/.data"
if [ -f "$DATA/run/app.pid" ] && kill -0 "$(cat "$DATA/run/app.pid")" 2>/dev/null; then
  echo "Warpmeter is already running on http://127.0.0.1:${PORT:-3000}"; exit 0
fi
# Audits run in the worker process started below, in the background for the CPU scheduler; the
# app serves requests only (set WARPMETER_NO_INPROCESS_WORKER=0 to have it run audits as well).
WARPMETER_NO_INPROCESS_WORKER=${WARPMETER_NO_INPROCESS_WORKER:-1} \
  setsid node --import tsx server/index.ts </dev/null >>"$DATA/logs/app.log" 2>&1 9>&- &
echo $! >"$DATA/run/app.pid"
if [ -f server/jobs/worker-main.ts ]; then
  setsid node --import tsx server/jobs/worker-main.ts </dev/null >>"$DATA/logs/worker.log" 2>&1 9>&- &
  echo $! >"$DATA/run/worker.pid"
fi
healthy() { node -e "fetch('http://127.0.0.1:${PORT:-3000}/api/health').then(r=>process.exit(r.ok?0:1),()=>process.exit(1))"; }
for _ in $(seq 1 100); do healthy && break; sleep 0.3; done
healthy || { echo "Warpmeter did not answer; see .data/logs/app.log" >&2; exit 1; }
echo "Warpmeter is running on http://127.0.0.1:${PORT:-3000}  (logs: .data/logs/, stop: npm run stop)"
echo "Caught mail: http://127.0.0.1:${WARPMETER_MAILBOX_PORT:-3026}/"
