#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL and the local mail catcher, migrate, seed the demo once, build, serve.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

PORT="${PORT:-3000}"
DEV=0; [ "${1:-}" = "--dev" ] && DEV=1
install_cleanup

ensure_node_modules
if [ -z "${DATABASE_URL:-}" ]; then
  ensure_postgres_binaries
  pg_up "$PWD/.data/pg" 54329
  ensure_database 54329 bandgate
  ensure_roles 54329 bandgate
  # A local demo may send webhooks to receivers on this machine (loopback only); a deployment with its own database
  # names its own networks, if any.
  export WEBHOOK_ALLOW_NETWORKS="${WEBHOOK_ALLOW_NETWORKS-127.0.0.0/8,::1/128}"
fi
ensure_auth_secret
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:$PORT}"
export APP_URL="${APP_URL:-$NEXTAUTH_URL}"

npx tsx db/migrate.ts
node_modules/.bin/tsx --conditions=react-server db/seed.ts

if [ -z "${SMTP_HOST:-}" ]; then
  export SMTP_HOST=127.0.0.1 SMTP_PORT="${FAKE_SMTP_PORT:-2525}"
  start_child node_modules/.bin/tsx mail/fake-smtp-main.ts
  wait_for_port "$SMTP_PORT" 30 || { log "the local mail catcher did not start"; exit 1; }
fi

log "starting the background worker (webhook deliveries, registry e-mail)"
start_child node_modules/.bin/tsx --conditions=react-server lib/jobs/worker-main.ts

if [ "$DEV" -eq 1 ]; then
  start_child node_modules/.bin/next dev -p "$PORT"
else
  build_if_needed
  log "serving on http://localhost:$PORT (Ctrl-C stops everything this command started)"
  start_child node_modules/.bin/next start -p "$PORT" -H "${HOST:-127.0.0.1}"
fi
wait "${CHILDREN[-1]}"
