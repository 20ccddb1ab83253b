#!/usr/bin/env bash
# npm test: everything on a clean machine. Installs what is missing, starts a private test MariaDB with
# an empty database, then runs lint, type-check, build, and every test (unit, API, browser), cheapest first.
set -euo pipefail
umask 077
cd "$(dirname "$0")/.."
source scripts/lib.sh
ensure_node_modules
ensure_apt mariadbd mariadb-server
ensure_apt chromium chromium
ensure_apt pdftotext poppler-utils

TEST_DB_PORT=${TEST_DB_PORT:-3407}
TEST_DATABASE_URL=$(scripts/db.sh up test "$TEST_DB_PORT" crestline_test TEST_DB_PORT)
scripts/db.sh sql test 'DROP DATABASE crestline_test; CREATE DATABASE crestline_test CHARACTER SET utf8mb4;'
export TEST_DATABASE_URL
trap 'scripts/db.sh down test || true' EXIT

echo "== lint";        npx eslint .
echo "== types";       npx vue-tsc --noEmit -p tsconfig.json
echo "== build";       npx vite build --logLevel warn
echo "== tests"
mkdir -p test-results
status=0
npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json || status=$?
node -e '
  const r = require("./test-results/vitest.json");
  console.log(`tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed`);
' || true
exit $status
