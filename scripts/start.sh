#!/usr/bin/env bash
# npm start: install what is missing, start the private MariaDB, build the client, migrate, seed the
# demo on first start, and serve on http://127.0.0.1:3000. Ctrl-C stops the server and MariaDB.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_node_modules
ensure_apt mariadbd mariadb-server

DB_PORT=${DB_PORT:-3406}
DATABASE_URL=$(scripts/db.sh up dev "$DB_PORT" crestline)
export DATABASE_URL SEED_DEMO=${SEED_DEMO:-1} NODE_ENV=production
stop_db() { scripts/db.sh down dev || true; }
trap stop_db EXIT

echo "Building the client..."
npx vite build --logLevel warn

# The server prints its address and the demo sign-in once it listens.
npx tsx server/index.ts &
server=$!
trap 'kill -INT $server 2>/dev/null || true' INT TERM
wait $server || true
