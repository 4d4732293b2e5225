#!/usr/bin/env bash
# npm run reliability (or npm run bench -- reliability): the reliability figures of the README. Sets up its own
# PostgreSQL cluster and database (restarted during the run, so never the demo's or the tests'), migrates, builds when
# the sources changed, starts the mail catcher; bench/reliability then starts `next start` and the worker, measures
# load, faults and bad input, and prints a report. Exits non-zero only when the harness itself fails: goals that are
# not met are marked FAIL in the report.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

export RELIABILITY_PG_PORT="${RELIABILITY_PG_PORT:-54349}"
export RELIABILITY_WEB_PORT="${RELIABILITY_WEB_PORT:-3190}"
export RELIABILITY_SMTP_PORT="${RELIABILITY_SMTP_PORT:-2545}"
export RELIABILITY_PG_DATA="$PWD/.data/pg-reliability"
export RELIABILITY_RUN_DIR="$PWD/.data/reliability"

# The harness records the process groups it starts here; they are stopped on exit even if the harness itself died.
stop_recorded_groups() {
  local file pid
  for file in "$RELIABILITY_RUN_DIR"/pids/*.pid; do
    [ -e "$file" ] || continue
    pid="$(cat "$file")"
    # Only a group that is still this checkout's (a recycled pid of an unrelated process is left alone).
    if [ -n "$pid" ] && [ "$(readlink "/proc/$pid/cwd" 2>/dev/null)" = "$PWD" ]; then kill -KILL -- "-$pid" 2>/dev/null || true; fi
    rm -f "$file"
  done
}
reliability_cleanup() {
  stop_recorded_groups
  cleanup
}
trap reliability_cleanup EXIT
trap 'exit 130' INT TERM

mkdir -p "$RELIABILITY_RUN_DIR/pids"
stop_recorded_groups   # left over from an interrupted run

ensure_node_modules
ensure_postgres_binaries
export PGBIN
pg_up "$RELIABILITY_PG_DATA" "$RELIABILITY_PG_PORT"
recreate_database "$RELIABILITY_PG_PORT" bandgate_reliability
ensure_roles "$RELIABILITY_PG_PORT" bandgate_reliability   # the app and the worker connect as the app role
export NEXTAUTH_SECRET="reliability-secret-not-for-production-0123456789"
export NEXTAUTH_URL="http://127.0.0.1:$RELIABILITY_WEB_PORT" APP_URL="http://127.0.0.1:$RELIABILITY_WEB_PORT"
export SMTP_HOST=127.0.0.1 SMTP_PORT="$RELIABILITY_SMTP_PORT" MAIL_FROM="Bandgate reliability <bandgate@reliability.invalid>"
export BANDGATE_ENV=test
# The worker as npm test runs it: quick webhook retries, receivers on 127.0.0.1, one refit at a time (2-core machines).
export WEBHOOK_RETRY_DELAY_SECONDS=1 WEBHOOK_ALLOW_NETWORKS=127.0.0.0/8 FIT_CONCURRENCY=1

node_modules/.bin/tsx db/migrate.ts >/dev/null
start_child node_modules/.bin/tsx mail/fake-smtp-main.ts >"$RELIABILITY_RUN_DIR/mail.log" 2>&1
wait_for_port "$SMTP_PORT" 60 || { log "the local mail catcher did not start"; exit 1; }
build_if_needed

log "reliability figures (logs of the app and the worker: $RELIABILITY_RUN_DIR)"
node --conditions=react-server --import tsx bench/reliability/main.ts
