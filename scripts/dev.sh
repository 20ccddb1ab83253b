#!/usr/bin/env bash
# npm run dev: the API (restarting on change) behind Vite's dev server with hot reload.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_node_modules
ensure_apt mariadbd mariadb-server
DATABASE_URL=$(scripts/db.sh up dev "${DB_PORT:-3406}" crestline)
export DATABASE_URL SEED_DEMO=1 SERVE_CLIENT=0
trap 'kill 0; scripts/db.sh down dev' EXIT
npx tsx watch server/index.ts &
npx vite
