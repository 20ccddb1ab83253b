#!/usr/bin/env bash
# npm start: install what is missing, start the private MariaDB, build the client when its sources
# changed, migrate, seed the demo on first start, and serve on http://127.0.0.1:3000. One Crestline per
# data folder (DATA_DIR, default .data). Ctrl-C or SIGTERM stops the server first, then MariaDB; the
# script exits with the server's status.
set -euo pipefail
# Everything made from here on (the data folder, MariaDB's files, uploads) is for this user only.
umask 077
cd "$(dirname "$0")/.."
source scripts/lib.sh

PORT=${PORT:-3000}
HOST=${HOST:-127.0.0.1}
DB_PORT=${DB_PORT:-3406}
export PORT HOST
use_data_dir
# Before anything else: a second start must leave the first one, and its database, alone.
take_data_dir "http://$HOST:$PORT"
refuse_taken_port "$PORT" PORT
ensure_node_modules
ensure_apt mariadbd mariadb-server

# Until the server runs, a signal ends the script (the EXIT trap stops MariaDB); once it runs, the
# signal is passed on and the script waits for the server to finish stopping, however many arrive.
server=
on_signal() {
  if [ -n "$server" ]; then
    kill -s "$1" "$server" 2>/dev/null || true
  else
    [ "$1" = INT ] && exit 130 || exit 143
  fi
}
trap 'on_signal INT' INT
trap 'on_signal TERM' TERM HUP

# db.sh runs in a session of its own, out of reach of the terminal's Ctrl-C: a start or stop of
# MariaDB cut in the middle would leave it half-initialised or running. It must not hold fd 9 either.
db() { setsid -w scripts/db.sh "$@" 9>&-; }
# With the folder's lock held no other Crestline uses this MariaDB, so stopping it is this start's
# job, even when it was left running by a start that was killed.
stop_db() {
  trap '' INT TERM HUP
  # Nothing may cut this short, not even an echo to a terminal that was closed.
  set +e
  [ -f "$DATA_DIR/dev/mariadb.pid" ] || return 0
  echo "Stopping MariaDB..."
  db down dev || echo "MariaDB did not stop; its pid is in $DATA_DIR/dev/mariadb.pid" >&2
}
trap stop_db EXIT
DATABASE_URL=$(db up dev "$DB_PORT" crestline DB_PORT)
export DATABASE_URL SEED_DEMO=${SEED_DEMO:-1} NODE_ENV=production

# The client is rebuilt only when a source is newer than the last build (SKIP_BUILD=1: never, for the
# start/stop tests, which need no client).
client_is_current() {
  [ -f dist/client/index.html ] &&
    [ -z "$(find src shared public index.html vite.config.ts package-lock.json -newer dist/client/index.html -print -quit 2>/dev/null)" ]
}
if [ "${SKIP_BUILD:-0}" != 1 ] && ! client_is_current; then
  echo "Building the client..."
  npx vite build --logLevel warn 9>&-
fi

# node itself, not npx or the tsx wrapper, so that signals reach the server and its status comes back.
node --import tsx server/index.ts 9>&- &
server=$!
# A trapped signal ends `wait` early while the server is still stopping: wait again until it is gone,
# then collect its status (bash keeps it for a later `wait`).
while kill -0 "$server" 2>/dev/null; do wait "$server" || true; done
wait "$server" && status=0 || status=$?
exit "$status"
