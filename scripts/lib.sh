# Shared set-up steps for scripts/start.sh and scripts/test.sh. Every step is idempotent.

log() { printf '\033[38;5;173m[bandgate]\033[0m %s\n' "$*"; }

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    log "need root to run: $* (install it by hand, then re-run)"; return 1; fi
}

APT_UPDATED=0
apt_install() {
  if [ "$APT_UPDATED" -eq 0 ]; then as_root apt-get update -qq; APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive as_root apt-get install -y -qq "$@" >/dev/null
}

# npm packages: install when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

pg_bin_dir() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1; }

ensure_postgres_binaries() {
  if [ -z "$(pg_bin_dir)" ] || [ ! -x "$(pg_bin_dir)/initdb" ]; then
    log "installing PostgreSQL from Debian's packages"
    apt_install postgresql
  fi
  PGBIN="$(pg_bin_dir)"
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    log "installing Chromium from Debian's packages"
    apt_install chromium
  fi
}

# pg_up DIR PORT: a project-local cluster on 127.0.0.1 only (TCP, no socket). Sets PG_STARTED_HERE=1 when this call started it.
pg_up() {
  local dir="$1" port="$2"
  PG_STARTED_HERE=0
  mkdir -p "$(dirname "$dir")"
  local pgctl=("$PGBIN/pg_ctl" -D "$dir")
  if [ "$(id -u)" -eq 0 ]; then
    install -d -o postgres -g postgres -m 700 "$dir"
    pgctl=(runuser -u postgres -- "${pgctl[@]}")
    local initdb=(runuser -u postgres -- "$PGBIN/initdb")
  else
    install -d -m 700 "$dir"
    local initdb=("$PGBIN/initdb")
  fi
  if [ ! -f "$dir/PG_VERSION" ]; then
    log "creating PostgreSQL cluster in $dir"
    (cd / && "${initdb[@]}" -D "$dir" -U postgres --auth=trust -E UTF8 --no-locale >/dev/null)
  fi
  if ! (cd / && "${pgctl[@]}" status >/dev/null 2>&1); then
    log "starting PostgreSQL on 127.0.0.1:$port"
    (cd / && "${pgctl[@]}" -l "$dir/server.log" -w -t 30 \
      -o "-p $port -c listen_addresses=127.0.0.1 -c unix_socket_directories='' -c fsync=off" start >/dev/null)
    PG_STARTED_HERE=1
  fi
  PG_CTL_CMD=("${pgctl[@]}")
}

pg_down() {
  if [ "${PG_STARTED_HERE:-0}" -eq 1 ]; then
    log "stopping PostgreSQL"
    (cd / && "${PG_CTL_CMD[@]}" -m fast -w stop >/dev/null 2>&1) || true
    PG_STARTED_HERE=0
  fi
}

# ensure_database PORT NAME: create it unless it exists.
ensure_database() {
  local port="$1" name="$2"
  if ! "$PGBIN/psql" -h 127.0.0.1 -p "$port" -U postgres -tAc "select 1 from pg_database where datname='$name'" postgres | grep -q 1; then
    "$PGBIN/createdb" -h 127.0.0.1 -p "$port" -U postgres "$name"
  fi
}

# ensure_roles PORT NAME: the owner and app roles (db/roles.sql), made as the local superuser; sets DATABASE_URL (the
# app role, for the web app and the worker) and MIGRATION_DATABASE_URL (the owner, for migrations).
ensure_roles() {
  local port="$1" name="$2"
  "$PGBIN/psql" -q -X -h 127.0.0.1 -p "$port" -U postgres -d postgres \
    -v owner=bandgate_owner -v app=bandgate_app -v db="$name" -f db/roles.sql >/dev/null
  export DATABASE_URL="postgres://bandgate_app@127.0.0.1:$port/$name"
  export MIGRATION_DATABASE_URL="postgres://bandgate_owner@127.0.0.1:$port/$name"
}

recreate_database() {
  local port="$1" name="$2"
  "$PGBIN/dropdb" -h 127.0.0.1 -p "$port" -U postgres --if-exists --force "$name"
  "$PGBIN/createdb" -h 127.0.0.1 -p "$port" -U postgres "$name"
}

# A secret kept in .data so sessions survive restarts; never committed.
ensure_auth_secret() {
  if [ -z "${NEXTAUTH_SECRET:-}" ]; then
    mkdir -p .data
    [ -s .data/auth-secret ] || node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))' > .data/auth-secret
    NEXTAUTH_SECRET="$(cat .data/auth-secret)"
    export NEXTAUTH_SECRET
  fi
}

# Build only when the sources that go into the build changed since the last build.
build_if_needed() {
  local stamp=.next/bandgate-source-hash
  local hash
  hash=$( { git ls-files -co --exclude-standard -- app board db lib mail public proxy.ts instrumentation.ts next.config.ts \
      postcss.config.mjs tsconfig.json tsconfig.build.json package-lock.json 2>/dev/null | sort | xargs -r sha1sum; } | sha1sum | cut -c1-40)
  if [ -f .next/BUILD_ID ] && [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$hash" ]; then
    log "build is up to date"
  else
    log "building the app (next build)"
    npx next build
    echo "$hash" > "$stamp"
  fi
}

# wait_for_port PORT SECONDS
wait_for_port() {
  local port="$1" limit="$2" i=0
  until node -e "require('net').connect($port,'127.0.0.1').on('connect',()=>process.exit(0)).on('error',()=>process.exit(1))"; do
    i=$((i + 1)); [ "$i" -ge $((limit * 5)) ] && return 1; sleep 0.2
  done
}

# kill_tree PID: stop a process and everything it started (npx/tsx/next spawn children).
kill_tree() {
  local pid="$1" child
  for child in $(pgrep -P "$pid" 2>/dev/null); do kill_tree "$child"; done
  kill "$pid" 2>/dev/null || true
}

# Children started with `start_child`, stopped (with PostgreSQL if this run started it) on exit or Ctrl-C.
CHILDREN=()
start_child() { "$@" & CHILDREN+=($!); }
cleanup() {
  trap - EXIT INT TERM
  for pid in "${CHILDREN[@]}"; do kill_tree "$pid"; done
  for pid in "${CHILDREN[@]}"; do wait "$pid" 2>/dev/null || true; done
  pg_down
}
install_cleanup() {
  trap cleanup EXIT
  trap 'exit 130' INT TERM
}
