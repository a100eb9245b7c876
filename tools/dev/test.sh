#!/usr/bin/env bash
# The whole test suite: unit + integration (real MariaDB) + end-to-end (real Chromium).
# Installs what it needs on a fresh Debian machine (as root), as the README says.
set -euo pipefail
cd "$(dirname "$0")/../.."

bash tools/dev/db.sh start
bash tools/dev/ensure-chromium.sh

echo "== type check and lint =="
npm run --silent typecheck
npm run --silent lint

echo "== unit and integration tests (Vitest) =="
npx vitest run

echo "== end-to-end tests (Playwright, Debian Chromium) =="
npx vite build --logLevel warn
# The end-to-end run gets its own database, recreated each run (the grant on
# dwellform_test% covers it); `start.ts` migrates and seeds it.
e2e_db="${E2E_DB_NAME:-dwellform_test_e2e}"
mariadb --no-defaults --protocol=socket --socket=.data/mariadb.sock -uroot \
  -e "DROP DATABASE IF EXISTS \`$e2e_db\`; CREATE DATABASE \`$e2e_db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
export E2E_DB_NAME="$e2e_db"
npx playwright test
