#!/usr/bin/env bash
# npm run dev: the API (restarting on change) behind Vite's dev server with hot reload. Takes the data
# folder like `npm start` does, so the two (or two of either) never share one folder or its MariaDB.
set -euo pipefail
umask 077
cd "$(dirname "$0")/.."
source scripts/lib.sh
use_data_dir
take_data_dir "http://127.0.0.1:5173"
ensure_node_modules
ensure_apt mariadbd mariadb-server

api=
# The API first, then MariaDB, whatever is pressed meanwhile (as in start.sh).
stop() {
  trap '' INT TERM HUP
  if [ -n "$api" ]; then
    kill -TERM "$api" 2>/dev/null || true
    wait "$api" 2>/dev/null || true
  fi
  setsid -w scripts/db.sh down dev 9>&- || true
}
trap stop EXIT
DATABASE_URL=$(setsid -w scripts/db.sh up dev "${DB_PORT:-3406}" crestline DB_PORT 9>&-)
export DATABASE_URL SEED_DEMO=1 SERVE_CLIENT=0
node_modules/.bin/tsx watch server/index.ts 9>&- &
api=$!
npx vite
