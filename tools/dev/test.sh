#!/usr/bin/env bash
# The whole test suite: unit + integration (real MariaDB) + end-to-end (real Chromium).
# Installs what it needs on a fresh Debian machine (as root), as the README says.
set -euo pipefail
cd "$(dirname "$0")/../.."

bash tools/dev/db.sh start
bash tools/dev/ensure-chromium.sh

echo "== unit and integration tests (Vitest) =="
npx vitest run

echo "== end-to-end tests (Playwright, Debian Chromium) =="
npx vite build --logLevel warn
bash tools/dev/db.sh reset-db "${E2E_DB_NAME:-dwellform_e2e}"
npx playwright test
