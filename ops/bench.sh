#!/usr/bin/env bash
# npm run bench: measures speed and memory targets and prints one table with ratios.
set -euo pipefail
cd "$(dirname "$0")/.."
bash ops/bootstrap.sh
exec node --import tsx ops/bench/run.ts "$@"
