#!/usr/bin/env bash
# Installs what a fresh Debian machine with only Node.js and npm is missing: the npm packages
# (npm ci), Debian's mariadb-server and, with --browser, Debian's chromium for end-to-end tests.
set -euo pipefail
cd "$(dirname "$0")/.."

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "[setup] installing npm packages (npm ci)…"
  npm ci --no-audit --no-fund
fi

need=()
command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ] || need+=(mariadb-server)
if [ "${1:-}" = "--browser" ]; then
  command -v chromium >/dev/null 2>&1 || need+=(chromium)
fi
if [ ${#need[@]} -gt 0 ]; then
  echo "[setup] installing Debian packages: ${need[*]}"
  SUDO=""
  [ "$(id -u)" -eq 0 ] || SUDO="sudo"
  $SUDO apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${need[@]}"
fi
export PATH="$PATH:/usr/sbin"
