#!/usr/bin/env bash
# npm test: install what is missing (with Chromium), then every check against a throwaway database.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh --browser
export PATH="$PATH:/usr/sbin"
exec node --import tsx scripts/run-tests.ts "$@"
