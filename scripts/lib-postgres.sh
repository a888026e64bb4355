#!/usr/bin/env bash
# Sourced by scripts/lib.sh: the project-local PostgreSQL cluster (run as an
# unprivileged user), its administrator and the app role, and their databases.

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

# cluster_secrets PREFIX ("" for npm start, test-, bench-): sets PG_DIR (the cluster's folder),
# DB_PASSWORD (its superuser's) and APP_DB_PASSWORD (the app role's).
cluster_secrets() {
  PG_DIR=$(pg_datadir "${1}pg")
  DB_PASSWORD=$(secret_file "${1}db-password")
  APP_DB_PASSWORD=$(secret_file "${1}db-app-password")
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

# pg_running_in DIR: true when the cluster in DIR has a live postmaster.
pg_running_in() {
  local pid
  [ -f "$1/postmaster.pid" ] || return 1
  pid=$(head -n 1 "$1/postmaster.pid" 2>/dev/null || true)
  [ -n "$pid" ] && grep -qs postgres "/proc/$pid/comm"
}
