#!/usr/bin/env bash
# npm run bench: speed goals as ratios against references measured in the same run. The board benchmark uses a
# scratch database on the test cluster, which this script starts (and stops again if it started it); the API
# benchmark serves the production build, made here when the sources changed. Then the reliability figures
# (scripts/reliability.sh, on a cluster of their own); `npm run bench -- reliability` runs only those.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

case "${1:-}" in
  "") ;;
  reliability) exec bash scripts/reliability.sh ;;
  *) log "unknown benchmark \"$1\" (known: reliability; none: all of them)"; exit 2 ;;
esac
install_cleanup

ensure_node_modules
ensure_postgres_binaries
pg_up "$PWD/.data/pg-test" 54339
recreate_database 54339 bandgate_bench
ensure_roles 54339 bandgate_bench
node_modules/.bin/tsx db/migrate.ts >/dev/null
build_if_needed   # the API benchmark serves the built app
status=0
node_modules/.bin/tsx --conditions=react-server bench/index.ts || status=$?
echo ""
bash scripts/reliability.sh || status=$?
exit "$status"
