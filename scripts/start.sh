#!/usr/bin/env bash
# npm start: set everything up and run Tonewright with the demo workshop at
# http://127.0.0.1:3000. Safe to run again; Ctrl-C stops the app and PostgreSQL.
source "$(dirname "$0")/lib.sh"

APP_HOST=127.0.0.1
APP_PORT="${PORT:-3000}"
DB_PORT="${TONEWRIGHT_DB_PORT:-54329}"
SMTP_PORT="${TONEWRIGHT_SMTP_PORT:-2525}"
S3_PORT="${TONEWRIGHT_S3_PORT:-4570}"

require_node
RUN_DIR="$DATA/run"
MAIL_DIR="$DATA/mail"
mkdir -p "$RUN_DIR"
# One start at a time sets up, migrates, seeds and builds; a second waits here and
# then finds the first one running.
take_lock "$DATA/start.lock" "Another npm start in this checkout is setting up; waiting for it…"
if recorded_pid "$RUN_DIR/start.pid" scripts/start.sh >/dev/null; then
  log "Tonewright is running already (npm start, pid $(cat "$RUN_DIR/start.pid")) at http://$APP_HOST:$APP_PORT. Nothing was changed."
  exit 0
fi
# No live start script: an app left by one that was killed is stopped (it has nobody
# to stop it), and its PostgreSQL and mail catcher are taken over below.
if recorded_pid "$RUN_DIR/app.pid" /server/index.mjs >/dev/null; then log "Stopping the app left running by an earlier start that was killed…"; fi
stop_recorded "$RUN_DIR/app.pid" /server/index.mjs
if port_busy "$APP_PORT"; then
  log "Something already answers on http://$APP_HOST:$APP_PORT — Tonewright may be running already. Nothing was changed."
  exit 0
fi
echo $$ >"$RUN_DIR/start.pid"
ensure_postgres
ensure_node_modules

cluster_secrets ""
AUTH_SECRET=$(secret_file auth-secret)
pg_init "$PG_DIR" "$DB_PORT" "$DB_PASSWORD"

STARTED_PG=0
STARTED_MAIL=0
STARTED_S3=0
APP_PID=""
cleanup() {
  # A second Ctrl-C must not cut the clean-up short.
  trap "" INT TERM
  trap - EXIT
  if [ -n "$APP_PID" ] && kill -0 "$APP_PID" 2>/dev/null; then kill "$APP_PID" 2>/dev/null || true; wait "$APP_PID" 2>/dev/null || true; fi
  rm -f "$RUN_DIR/app.pid"
  if [ "$STARTED_MAIL" = 1 ]; then mail_catcher_stop "$MAIL_DIR"; fi
  if [ "$STARTED_S3" = 1 ]; then s3_fake_stop "$RUN_DIR/s3-fake.pid"; fi
  if [ "$STARTED_PG" = 1 ]; then log "Stopping PostgreSQL…"; pg_stop "$PG_DIR"; fi
  if [ "$(cat "$RUN_DIR/start.pid" 2>/dev/null)" = $$ ]; then rm -f "$RUN_DIR/start.pid"; fi
  log "Stopped."
}
trap "cleanup; exit 130" INT
trap "cleanup; exit 143" TERM
trap cleanup EXIT

if pg_running_in "$PG_DIR"; then
  log "Taking over the PostgreSQL left running by an earlier start."
  pg_start "$PG_DIR" "$DB_PORT"
  STARTED_PG=1
elif ! pg_ready "$DB_PORT"; then
  log "Starting PostgreSQL on 127.0.0.1:$DB_PORT…"
  pg_start "$PG_DIR" "$DB_PORT"
  STARTED_PG=1
fi
ensure_app_role "$DB_PORT" "$DB_PASSWORD" "$APP_DB_PASSWORD"
ensure_database "$DB_PORT" "$DB_PASSWORD" tonewright

export NUXT_DATABASE_URL="$(app_database_url "$DB_PORT" "$APP_DB_PASSWORD" tonewright)"
export NUXT_AUTH_SECRET="$AUTH_SECRET"
export NUXT_STORAGE_DIR="$DATA/storage"
export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT="$SMTP_PORT"
export NUXT_MAIL_CATCHER_DIR="$MAIL_DIR" NUXT_SITE_URL="${TONEWRIGHT_SITE_URL:-http://$APP_HOST:$APP_PORT}"

start_mail_catcher() {
  log "Starting the local mail catcher on 127.0.0.1:$SMTP_PORT (messages in .data/mail)…"
  mail_catcher_start "$SMTP_PORT" "$MAIL_DIR"
}
if own_helper "mail catcher" "$MAIL_DIR/catcher.pid" scripts/mail-catcher.ts "$SMTP_PORT" start_mail_catcher; then STARTED_MAIL=1; fi

# NUXT_STORAGE_DRIVER=s3 without an endpoint of its own: the local S3 fake (objects in .data/s3).
if [ "${NUXT_STORAGE_DRIVER:-fs}" = s3 ] && [ -z "${NUXT_STORAGE_ENDPOINT:-}" ]; then
  export NUXT_STORAGE_ENDPOINT="http://127.0.0.1:$S3_PORT" NUXT_STORAGE_FORCE_PATH_STYLE=true
  export NUXT_STORAGE_BUCKET="${NUXT_STORAGE_BUCKET:-tonewright}"
  export NUXT_STORAGE_ACCESS_KEY_ID="$S3_FAKE_KEY" NUXT_STORAGE_SECRET_ACCESS_KEY="$S3_FAKE_KEY"
  start_s3_fake() {
    log "Starting the local S3 fake on 127.0.0.1:$S3_PORT (objects in .data/s3)…"
    s3_fake_start "$S3_PORT" "$DATA/s3" "$NUXT_STORAGE_BUCKET" "$RUN_DIR/s3-fake.pid"
  }
  own_helper "S3 fake" "$RUN_DIR/s3-fake.pid" scripts/s3-fake.ts "$S3_PORT" start_s3_fake \
    || die "Something else answers on 127.0.0.1:$S3_PORT; set TONEWRIGHT_S3_PORT to a free port for the S3 fake."
  STARTED_S3=1
fi

log "Applying database migrations…"
(cd "$ROOT" && npx tsx scripts/migrate.ts)
if [ "${NODE_ENV:-}" != "production" ] || [ "${TONEWRIGHT_SEED_DEMO:-}" = 1 ]; then
  (cd "$ROOT" && npx tsx scripts/seed.ts)
fi
build_if_stale
ensure_cli_built

cat <<MSG

  Tonewright is starting at http://$APP_HOST:$APP_PORT

  Demo sign-ins (password: tonewright-demo)
    owner@tonewright.test       owner
    supervisor@tonewright.test  supervisor
    bench@tonewright.test       benchmaker
    office@tonewright.test      office

  Mail goes to the local catcher on 127.0.0.1:$SMTP_PORT; read it in a second terminal
  with \`npm run mailbox\` (list), \`npm run mailbox -- show 1\` (newest message) and
  \`npm run mailbox -- save 1 DIR\` (its attachments).

  Press Ctrl-C to stop.

MSG

cd "$ROOT"
app_start "$ROOT/.output" "$APP_PORT" "$RUN_DIR/app.pid"
# The lock is held until the app answers, so a second start finds it running.
wait_http "http://$APP_HOST:$APP_PORT/api/health" 60 || true
release_lock
wait "$APP_PID" || true
