#!/usr/bin/env bash
# npm run bench:load: the load benchmark on a database of its own (see bench/load.ts).
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
export PATH="$PATH:/usr/sbin"
exec node --import tsx bench/load.ts
