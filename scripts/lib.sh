#!/usr/bin/env bash
# Shared set-up for scripts/start.sh and scripts/test.sh: Debian packages, node
# modules, a project-local PostgreSQL cluster run as an unprivileged user.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA="$ROOT/.data"
mkdir -p "$DATA"

log() { printf '\033[1;33mtonewright\033[0m %s\n' "$*"; }
die() { printf '\033[1;31mtonewright\033[0m %s\n' "$*" >&2; exit 1; }

is_root() { [ "$(id -u)" = 0 ]; }

APT_UPDATED=0
apt_install() {
  is_root || die "Missing Debian packages ($*). Install them with: sudo apt-get install -y $*"
  if [ "$APT_UPDATED" = 0 ]; then
    log "Updating Debian's package lists…"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    APT_UPDATED=1
  fi
  log "Installing $* from Debian's packages…"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

require_node() {
  command -v node >/dev/null || die "Node.js 20 or newer is needed (node was not found)."
  local major; major=$(node -p 'process.versions.node.split(".")[0]')
  [ "$major" -ge 20 ] || die "Node.js 20 or newer is needed (found $(node -v))."
}

# npm ci when node_modules is missing or was installed from another lock file.
ensure_node_modules() {
  local want have=""
  want=$(sha256sum "$ROOT/package-lock.json" | cut -c1-64)
  [ -f "$ROOT/node_modules/.tonewright-lock" ] && have=$(cat "$ROOT/node_modules/.tonewright-lock")
  if [ ! -d "$ROOT/node_modules" ] || [ "$want" != "$have" ]; then
    log "Installing node modules (npm ci)…"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
    echo "$want" > "$ROOT/node_modules/.tonewright-lock"
  fi
}

pg_bindir() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

ensure_postgres() {
  local bin; bin=$(pg_bindir)
  if [ -z "$bin" ] || [ ! -x "$bin/postgres" ] || [ ! -x "$bin/initdb" ]; then
    apt_install postgresql
    bin=$(pg_bindir)
  fi
  [ -n "$bin" ] || die "PostgreSQL's server programs were not found after installing them."
  PG_BIN="$bin"
  if is_root; then
    id postgres >/dev/null 2>&1 || useradd --system --user-group --home-dir /var/lib/postgresql --shell /usr/sbin/nologin postgres
    PG_USER=postgres
  else
    PG_USER=$(id -un)
  fi
  export PG_BIN PG_USER
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then apt_install chromium fonts-liberation; fi
}

ensure_poppler() {
  command -v pdftoppm >/dev/null || apt_install poppler-utils
}

# What the engine's accuracy tests render their real-strike fixtures with (at test time,
# into .data/fixtures): timidity + freepats (GPL patches), sox, sonic-pi-samples (CC0).
ensure_fixture_packages() {
  local missing=()
  command -v timidity >/dev/null || missing+=(timidity)
  [ -f /etc/timidity/freepats.cfg ] || missing+=(freepats)
  command -v sox >/dev/null || missing+=(sox libsox-fmt-base)
  [ -d /usr/share/sonic-pi/samples ] || missing+=(sonic-pi-samples)
  if [ "${#missing[@]}" -gt 0 ]; then apt_install "${missing[@]}"; fi
}

# Run a command as the PostgreSQL system user (PostgreSQL refuses to run as root).
as_pg() {
  # From /, which the PostgreSQL user can always enter (the checkout may be private).
  if is_root; then (cd / && runuser -u "$PG_USER" -- "$@"); else "$@"; fi
}

# Where a cluster named NAME lives: .data/NAME when the PostgreSQL user can reach
# it; otherwise (a checkout under /root or a private mktemp folder) a folder under
# /var/lib/tonewright that it can reach, linked from .data/NAME.
pg_datadir() {
  local name="$1" dir="$DATA/$1"
  if [ -L "$dir" ]; then readlink -f "$dir"; return; fi
  if ! is_root || as_pg test -x "$DATA" 2>/dev/null; then echo "$dir"; return; fi
  local key; key=$(printf '%s' "$ROOT" | sha256sum | cut -c1-12)
  local real="/var/lib/tonewright/$key/$name"
  mkdir -p "$real"
  chmod 755 /var/lib/tonewright "/var/lib/tonewright/$key"
  ln -sfn "$real" "$dir"
  echo "$real"
}

# pg_init DIR PORT PASSWORD [extra postgresql.conf lines…]
pg_init() {
  local dir="$1" port="$2" password="$3"; shift 3
  if [ -s "$dir/PG_VERSION" ]; then return; fi
  log "Creating a PostgreSQL cluster in $dir…"
  mkdir -p "$dir"
  is_root && chown "$PG_USER" "$dir"
  chmod 700 "$dir"
  local pwfile; pwfile=$(mktemp)
  printf '%s\n' "$password" > "$pwfile"
  is_root && chown "$PG_USER" "$pwfile"
  as_pg "$PG_BIN/initdb" -D "$dir" -U tonewright --pwfile="$pwfile" --auth-host=scram-sha-256 --auth-local=scram-sha-256 \
    -E UTF8 --no-locale >/dev/null
  rm -f "$pwfile"
  {
    echo "# Tonewright: loopback only, TCP only."
    echo "listen_addresses = '127.0.0.1'"
    echo "port = $port"
    echo "unix_socket_directories = ''"
    echo "max_connections = 100"
    for line in "$@"; do echo "$line"; done
  } | as_pg tee -a "$dir/postgresql.conf" >/dev/null
}

pg_ready() { "$PG_BIN/pg_isready" -q -h 127.0.0.1 -p "$1" >/dev/null 2>&1; }

# pg_start DIR PORT: start unless already answering. Clears a lock file left by a
# killed server (after kill -9 the pid may belong to another process by now).
pg_start() {
  local dir="$1" port="$2"
  if pg_ready "$port"; then return 0; fi
  if [ -f "$dir/postmaster.pid" ]; then
    local pid; pid=$(head -n 1 "$dir/postmaster.pid" 2>/dev/null || true)
    if [ -z "$pid" ] || ! grep -qs postgres "/proc/$pid/comm"; then
      log "Removing a stale PostgreSQL lock file."
      rm -f "$dir/postmaster.pid"
    fi
  fi
  as_pg "$PG_BIN/pg_ctl" -D "$dir" -l "$dir/server.log" -w -t 60 start >/dev/null 9>&- \
    || { tail -n 20 "$dir/server.log" >&2 || true; die "PostgreSQL did not start (log above)."; }
  local i
  for i in $(seq 1 60); do pg_ready "$port" && return 0; sleep 0.5; done
  die "PostgreSQL started but does not answer on 127.0.0.1:$port."
}

pg_stop() {
  local dir="$1"
  [ -f "$dir/postmaster.pid" ] || return 0
  as_pg "$PG_BIN/pg_ctl" -D "$dir" -m fast -w -t 60 stop >/dev/null 2>&1 || true
}

# A password kept beside the clusters, made once.
secret_file() {
  local file="$DATA/$1"
  if [ ! -s "$file" ]; then
    (umask 077; node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))' > "$file")
  fi
  cat "$file"
}

# psql_as PORT PASSWORD DB SQL
psql_as() {
  PGOPTIONS="-c client_min_messages=warning" PGPASSWORD="$2" "$PG_BIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$1" -U tonewright -d "$3" -tAc "$4"
}

# The role the app (and its migrations and seed) connects as: it owns the database
# and everything in it but is not a superuser. The initdb role `tonewright` stays
# the administrator and is used only to create this role and the databases.
APP_ROLE=tonewright_app
APP_SCHEMAS="'public', 'drizzle', 'pgboss'"

# ensure_app_role PORT ADMIN_PASSWORD APP_PASSWORD: creates the role when missing
# (clusters made by earlier versions have only the administrator) and keeps it
# unprivileged, with the password kept in .data.
ensure_app_role() {
  local port="$1" admin="$2" password="$3"
  psql_as "$port" "$admin" postgres "do \$\$ begin
    if not exists (select 1 from pg_roles where rolname = '$APP_ROLE') then create role $APP_ROLE login; end if;
  end \$\$"
  psql_as "$port" "$admin" postgres "alter role $APP_ROLE with login nosuperuser nocreatedb nocreaterole noreplication nobypassrls password '$password'"
}

# ensure_database PORT ADMIN_PASSWORD DB: the database, owned by the app role. A
# database made by an earlier version (owned by the administrator) is handed over
# with every schema, table, sequence, type and function the app uses.
ensure_database() {
  local port="$1" password="$2" db="$3"
  if [ -z "$(psql_as "$port" "$password" postgres "select 1 from pg_database where datname = '$db'")" ]; then
    psql_as "$port" "$password" postgres "create database \"$db\" owner $APP_ROLE"
    return
  fi
  psql_as "$port" "$password" postgres "alter database \"$db\" owner to $APP_ROLE"
  psql_as "$port" "$password" "$db" "do \$\$ declare r record; begin
    for r in select nspname from pg_namespace where nspname in ($APP_SCHEMAS) and nspowner <> '$APP_ROLE'::regrole loop
      execute format('alter schema %I owner to $APP_ROLE', r.nspname);
    end loop;
    for r in select c.oid::regclass as name from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname in ($APP_SCHEMAS) and c.relkind in ('r', 'p', 'v', 'm', 'f') and c.relowner <> '$APP_ROLE'::regrole loop
      execute format('alter table %s owner to $APP_ROLE', r.name);
    end loop;
    for r in select c.oid::regclass as name from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname in ($APP_SCHEMAS) and c.relkind = 'S' and c.relowner <> '$APP_ROLE'::regrole loop
      execute format('alter sequence %s owner to $APP_ROLE', r.name);
    end loop;
    for r in select t.oid::regtype as name from pg_type t join pg_namespace n on n.oid = t.typnamespace
      where n.nspname in ($APP_SCHEMAS) and t.typtype in ('e', 'd', 'r') and t.typowner <> '$APP_ROLE'::regrole loop
      execute format('alter type %s owner to $APP_ROLE', r.name);
    end loop;
    for r in select p.oid::regprocedure as name from pg_proc p join pg_namespace n on n.oid = p.pronamespace
      where n.nspname in ($APP_SCHEMAS) and p.proowner <> '$APP_ROLE'::regrole loop
      execute format('alter routine %s owner to $APP_ROLE', r.name);
    end loop;
  end \$\$"
}

# app_database_url PORT PASSWORD DB: the URL the app, its migrations and its seed use.
app_database_url() { echo "postgres://$APP_ROLE:$2@127.0.0.1:$1/$3"; }

# build_if_stale [OUTPUT_DIR]: build when there is no build in OUTPUT_DIR (default
# .output) or a source file is newer than it. `npm test` builds into its own folder,
# so it never replaces the files a running `npm start` serves; the shared .nuxt
# folder is guarded by .data/build.lock, so two builds never run at once.
build_if_stale() {
  local out="${1:-$ROOT/.output}"
  local stamp="$out/nitro.json" log_file="$DATA/build-$(basename "$out").log"
  if [ -f "$stamp" ] && [ -z "$(cd "$ROOT" && find app server shared public modules nuxt.config.ts tailwind.config.ts package-lock.json scripts/build-analysis-worker.ts -newer "$stamp" -type f -print -quit 2>/dev/null)" ]; then
    return 0
  fi
  (
    exec 8>"$DATA/build.lock"
    if ! flock -n 8; then log "Another build in this checkout is running; waiting for it…"; flock -w 1800 8 || die "Waited 30 minutes for another build."; fi
    log "Building the app…"
    (cd "$ROOT" && TONEWRIGHT_OUTPUT_DIR="$out" NODE_ENV=production npx nuxt build >"$log_file" 2>&1) \
      || { tail -n 40 "$log_file" >&2; die "The build failed (full log: $log_file)."; }
  )
}

# ensure_cli_built: the precompiled command-line scripts (`npm run analyze`) in .data/cli,
# rebuilt only when a source changed; the CLI also does this by itself when needed.
ensure_cli_built() {
  (cd "$ROOT" && node scripts/run-built.mjs --build analyze) || die "The command-line build failed."
}

# take_lock FILE MESSAGE: an exclusive lock on FILE held on fd 9 until release_lock
# or the end of the script (the kernel drops it when the script dies, even by kill -9).
# Long-lived children are started with fd 9 closed so that they never hold it.
take_lock() {
  exec 9>"$1"
  if ! flock -n 9; then
    log "$2"
    flock -w 1800 9 || die "Waited 30 minutes for $1; giving up."
  fi
}
release_lock() { flock -u 9 2>/dev/null || true; exec 9>&-; }

# recorded_pid FILE PATTERN: prints the pid kept in FILE when that process is alive,
# runs in this checkout and its command line contains PATTERN (after a kill -9 the
# number may belong to another program by now, which must never be stopped).
recorded_pid() {
  local file="$1" pattern="$2" pid
  [ -s "$file" ] || return 1
  pid=$(cat "$file" 2>/dev/null || true)
  [[ "$pid" =~ ^[0-9]+$ ]] || return 1
  [ -r "/proc/$pid/cmdline" ] || return 1
  tr '\0' ' ' <"/proc/$pid/cmdline" | grep -qF -- "$pattern" || return 1
  [ "$(readlink "/proc/$pid/cwd" 2>/dev/null)" = "$ROOT" ] || return 1
  echo "$pid"
}

# stop_recorded FILE PATTERN: stops the process recorded in FILE (see recorded_pid),
# politely and then, after 10 s, by force; removes FILE either way.
stop_recorded() {
  local file="$1" pattern="$2" pid i
  if pid=$(recorded_pid "$file" "$pattern"); then
    kill "$pid" 2>/dev/null || true
    for i in $(seq 1 40); do kill -0 "$pid" 2>/dev/null || break; sleep 0.25; done
    if kill -0 "$pid" 2>/dev/null; then kill -9 "$pid" 2>/dev/null || true; fi
  fi
  rm -f "$file"
}

# pg_running_in DIR: true when the cluster in DIR has a live postmaster.
pg_running_in() {
  local pid
  [ -f "$1/postmaster.pid" ] || return 1
  pid=$(head -n 1 "$1/postmaster.pid" 2>/dev/null || true)
  [ -n "$pid" ] && grep -qs postgres "/proc/$pid/comm"
}

# app_start OUTPUT_DIR PORT PID_FILE [LOG]: the built server in the background, its
# pid recorded so that a later start can find it after this script was killed.
app_start() {
  local out="$1" port="$2" pid_file="$3" log_file="${4:-/dev/stdout}"
  (cd "$ROOT" && HOST=127.0.0.1 PORT="$port" NITRO_HOST=127.0.0.1 NITRO_PORT="$port" NODE_ENV=production \
    exec node "$out/server/index.mjs" >>"$log_file" 2>&1 9>&-) &
  APP_PID=$!
  echo "$APP_PID" >"$pid_file"
}

port_busy() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# wait_http URL SECONDS
wait_http() {
  local url="$1" limit="$2" i
  for i in $(seq 1 $((limit * 4))); do
    if node -e 'fetch(process.argv[1]).then(r=>process.exit(r.status<500?0:1),()=>process.exit(1))' "$url" 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  return 1
}

# mail_catcher_start PORT DIR: the local SMTP catcher (scripts/mail-catcher.ts) in the
# background; it writes DIR/catcher.pid. mail_catcher_stop DIR ends that process.
mail_catcher_start() {
  local port="$1" dir="$2"
  mkdir -p "$dir"
  (cd "$ROOT" && exec node --import tsx scripts/mail-catcher.ts --port "$port" --dir "$dir" >>"$dir/catcher.log" 2>&1 9>&-) &
  local i
  for i in $(seq 1 80); do port_busy "$port" && return 0; sleep 0.25; done
  tail -n 20 "$dir/catcher.log" >&2 || true
  die "The mail catcher did not start on 127.0.0.1:$port."
}

mail_catcher_stop() { stop_recorded "$1/catcher.pid" scripts/mail-catcher.ts; }
