#!/usr/bin/env bash
# npm start: install what is missing, then run the database, the mail catcher and the app.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
export PATH="$PATH:/usr/sbin"
exec node --import tsx scripts/serve.ts
