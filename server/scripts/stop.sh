#!/usr/bin/env bash
# `npm run stop`: stops the app, the worker and every service `npm start` launched.
set -euo pipefail
bash "$(dirname "$0")/services.sh" down
echo "Warpmeter and its services are stopped."
