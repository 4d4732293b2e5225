#!/usr/bin/env bash
# npm test: the same set-up as npm start on its own cluster, port and database (never the demo data),
# then unit, integration (real PostgreSQL) and browser end-to-end tests. Exits non-zero on any failure.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

# Ports can be moved (e.g. to run two checkouts side by side on one machine).
TEST_PG_PORT="${TEST_PG_PORT:-54339}"
install_cleanup

ensure_node_modules
ensure_chromium
ensure_postgres_binaries
pg_up "$PWD/.data/pg-test" "$TEST_PG_PORT"
recreate_database "$TEST_PG_PORT" bandgate_test
ensure_roles "$TEST_PG_PORT" bandgate_test   # the app, the worker and the tests connect as the app role
export NEXTAUTH_SECRET="test-secret-not-for-production-use-0123456789"
export E2E_PORT="${E2E_PORT:-3100}"
export NEXTAUTH_URL="http://127.0.0.1:$E2E_PORT" APP_URL="http://127.0.0.1:$E2E_PORT"
export SMTP_HOST=127.0.0.1 SMTP_PORT="${TEST_SMTP_PORT:-2535}" MAIL_FROM="Bandgate test <bandgate@test.invalid>"
export BANDGATE_ENV=test

npx tsx db/migrate.ts
start_child node_modules/.bin/tsx mail/fake-smtp-main.ts
wait_for_port "$SMTP_PORT" 30 || { log "the local mail catcher did not start"; exit 1; }
build_if_needed
# Deliveries retry after about 1–2 s here (15 s and doubling in production), so the retry test stays short.
export WEBHOOK_RETRY_DELAY_SECONDS=1
# The one non-public address webhooks may reach in tests: receivers that should get deliveries listen on 127.0.0.2;
# 127.0.0.1 (and every other address) stands for the internal network no webhook may reach.
export WEBHOOK_ALLOW_NETWORKS=127.0.0.2/32

status=0
# The fault tests start, kill and stop worker processes of their own, so they run before the shared worker starts.
log "worker fault tests (SIGKILL and SIGTERM during a refit)"; npx vitest run --project faults || status=1
start_child node_modules/.bin/tsx --conditions=react-server lib/jobs/worker-main.ts
log "lint (eslint)"; npx eslint . || status=1
log "type check (tsc)"; npx tsc --noEmit -p tsconfig.json || status=1
log "unit tests"; npx vitest run --project unit || status=1
log "integration tests (PostgreSQL on 127.0.0.1:$TEST_PG_PORT)"; npx vitest run --project integration || status=1
log "browser end-to-end tests (Debian Chromium)"; CI=1 npx playwright test || status=1
if [ "$status" -eq 0 ]; then log "all suites passed"; else log "some suites failed"; fi
exit "$status"
