#!/usr/bin/env bash
# npm test: set up what is missing (Chromium included), then run every suite once.
set -euo pipefail
cd "$(dirname "$0")/.."
bash ops/bootstrap.sh --browser
exec node --import tsx ops/test.ts "$@"
