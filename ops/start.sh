#!/usr/bin/env bash
# npm start: set up what is missing, then run every service under one supervisor.
set -euo pipefail
cd "$(dirname "$0")/.."
bash ops/bootstrap.sh
exec node --import tsx ops/start.ts "$@"
