#!/usr/bin/env bash
# npm run bench: speed and memory figures, each beside a reference, on a private benchmark database.
set -euo pipefail
umask 077
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_node_modules
ensure_apt mariadbd mariadb-server
# The engine and reader figures first, before MariaDB starts: its start-up work would share the CPU.
npx tsx scripts/bench.ts --part=engine "$@"
BENCH_DATABASE_URL=$(scripts/db.sh up bench "${BENCH_DB_PORT:-3409}" crestline_bench BENCH_DB_PORT)
scripts/db.sh sql bench 'DROP DATABASE crestline_bench; CREATE DATABASE crestline_bench CHARACTER SET utf8mb4;'
export BENCH_DATABASE_URL
trap 'scripts/db.sh down bench || true' EXIT
npx tsx scripts/bench.ts --part=ingest "$@"
