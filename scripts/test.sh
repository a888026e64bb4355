#!/usr/bin/env bash
# npm test: the start command's set-up on a throw-away test database, then
# type-check, lint, unit, integration (HTTP against the built server and a real
# PostgreSQL) and browser tests (headless Chromium). Non-zero on any failure;
# stops everything it started.
#
# While working on one part: TW_SUITES picks the steps (default all of
# "typecheck lint unit integration browser") and arguments after `npm test --`
# are passed to vitest as file filters, e.g.
#   TW_SUITES="unit integration" npm test -- tests/integration/security
source "$(dirname "$0")/lib.sh"
SUITES="${TW_SUITES:-typecheck lint unit integration browser}"
has_suite() { case " $SUITES " in *" $1 "*) return 0 ;; *) return 1 ;; esac; }

DB_PORT="${TONEWRIGHT_TEST_DB_PORT:-54339}"
APP_PORT="${TONEWRIGHT_TEST_PORT:-3100}"
SMTP_PORT="${TONEWRIGHT_TEST_SMTP_PORT:-2626}"
S3_PORT="${TONEWRIGHT_TEST_S3_PORT:-4571}"
DB_NAME=tonewright_test

require_node
ensure_postgres
ensure_chromium
ensure_poppler
ensure_fixture_packages
ensure_node_modules

cluster_secrets test-
# The test server is built into its own folder: a running `npm start` keeps its .output.
OUT_DIR="$DATA/test-output"
# Durability does not matter for a throw-away database; speed does.
pg_init "$PG_DIR" "$DB_PORT" "$DB_PASSWORD" "fsync = off" "synchronous_commit = off" "full_page_writes = off"

MAIL_DIR="$DATA/test-mail"
S3_DIR="$DATA/test-s3"
S3_PID="$DATA/run/test-s3-fake.pid"
mkdir -p "$DATA/run"
APP_PID=""
take_lock "$DATA/test.lock" "Another npm test in this checkout is running; waiting for it…"
# A test server left by a killed run would hold the port.
stop_recorded "$DATA/test-app.pid" /server/index.mjs
cleanup() {
  local code=$?
  trap - INT TERM EXIT
  if [ -n "$APP_PID" ] && kill -0 "$APP_PID" 2>/dev/null; then kill "$APP_PID" 2>/dev/null || true; wait "$APP_PID" 2>/dev/null || true; fi
  mail_catcher_stop "$MAIL_DIR"
  s3_fake_stop "$S3_PID"
  pg_stop "$PG_DIR"
  exit "$code"
}
trap cleanup INT TERM EXIT

pg_start "$PG_DIR" "$DB_PORT"
ensure_app_role "$DB_PORT" "$DB_PASSWORD" "$APP_DB_PASSWORD"
psql_as "$DB_PORT" "$DB_PASSWORD" postgres "drop database if exists $DB_NAME with (force)"
ensure_database "$DB_PORT" "$DB_PASSWORD" "$DB_NAME"

# The app, its migrations, its seed and the tests connect as the unprivileged app role.
export NUXT_DATABASE_URL="$(app_database_url "$DB_PORT" "$APP_DB_PASSWORD" "$DB_NAME")"
export NUXT_AUTH_SECRET="test-secret-$(secret_file test-auth-secret)"
export NUXT_STORAGE_DIR="$DATA/test-storage"
export NUXT_SMTP_HOST=127.0.0.1 NUXT_SMTP_PORT="$SMTP_PORT"
# Every test request comes from 127.0.0.1: the per-address limit is tested against the database directly.
export NUXT_SIGN_IN_MAX_PER_ADDRESS=1000
# The test server sits "behind" a local proxy, so tests can speak for other client addresses with
# X-Forwarded-For (tests/integration/security/accounts-parallel-limits.test.ts); production trusts none by default.
export NUXT_TRUSTED_PROXIES=127.0.0.1
export NUXT_MAIL_CATCHER_DIR="$MAIL_DIR" NUXT_SITE_URL="http://127.0.0.1:$APP_PORT"
# A short mail lease, so that the fault test sees a dead worker's claim expire quickly.
export NUXT_MAIL_LEASE_S=20
rm -rf "$NUXT_STORAGE_DIR"
mail_catcher_stop "$MAIL_DIR"
rm -rf "$MAIL_DIR"
s3_fake_stop "$S3_PID"
rm -rf "$S3_DIR"
# The S3 fake: the contract suite and the two-instance test use it whatever the test server's
# driver; with NUXT_STORAGE_DRIVER=s3 the test server keeps its objects there too.
export TW_S3_ENDPOINT="http://127.0.0.1:$S3_PORT" TW_S3_KEY="$S3_FAKE_KEY"
if [ "${NUXT_STORAGE_DRIVER:-fs}" = s3 ]; then
  export NUXT_STORAGE_ENDPOINT="$TW_S3_ENDPOINT" NUXT_STORAGE_FORCE_PATH_STYLE=true NUXT_STORAGE_BUCKET=tonewright-test
  export NUXT_STORAGE_ACCESS_KEY_ID="$S3_FAKE_KEY" NUXT_STORAGE_SECRET_ACCESS_KEY="$S3_FAKE_KEY"
fi
log "Starting the S3 fake on 127.0.0.1:$S3_PORT…"
s3_fake_start "$S3_PORT" "$S3_DIR" tonewright-test "$S3_PID"

log "Migrating and seeding the test database…"
(cd "$ROOT" && npx tsx scripts/migrate.ts && npx tsx scripts/seed.ts)
if has_suite integration; then
  # The two-instance test's own database in the same cluster: only its two servers run jobs on it.
  PAIR_DB=tonewright_test_pair
  psql_as "$DB_PORT" "$DB_PASSWORD" postgres "drop database if exists $PAIR_DB with (force)"
  ensure_database "$DB_PORT" "$DB_PASSWORD" "$PAIR_DB"
  export TW_PAIR_DATABASE_URL="$(app_database_url "$DB_PORT" "$APP_DB_PASSWORD" "$PAIR_DB")"
  (cd "$ROOT" && NUXT_DATABASE_URL="$TW_PAIR_DATABASE_URL" npx tsx scripts/migrate.ts)
fi

build_if_stale "$OUT_DIR"
ensure_cli_built

cd "$ROOT"
if has_suite typecheck; then log "Type-checking…"; npx nuxt typecheck; fi
if has_suite lint; then log "Linting…"; npx eslint .; fi
mkdir -p "$ROOT/test-results" && rm -f "$ROOT"/test-results/*.json
if has_suite unit; then
  log "Unit tests…"
  npx vitest run --project unit --passWithNoTests --reporter=default --reporter=json --outputFile.json=test-results/unit.json "$@"
fi

log "Starting the mail catcher on 127.0.0.1:$SMTP_PORT…"
mail_catcher_start "$SMTP_PORT" "$MAIL_DIR"

log "Starting the built server on 127.0.0.1:$APP_PORT…"
: >"$ROOT/test-results/server.log"
app_start "$OUT_DIR" "$APP_PORT" "$DATA/test-app.pid" "$ROOT/test-results/server.log"
wait_http "http://127.0.0.1:$APP_PORT/api/health" 60 || { tail -n 30 "$ROOT/test-results/server.log" >&2; die "The test server did not start."; }

export TW_BASE_URL="http://127.0.0.1:$APP_PORT" TW_OUTPUT_DIR="$OUT_DIR"
export TW_PG_DIR="$PG_DIR" TW_PG_PORT="$DB_PORT"
export TW_MAIL_DIR="$MAIL_DIR" TW_SMTP_PORT="$SMTP_PORT"
if has_suite integration; then
  log "Integration tests…"
  npx vitest run --project integration --passWithNoTests --reporter=default --reporter=json --outputFile.json=test-results/integration.json "$@"
fi
if has_suite browser; then
  log "Browser tests…"
  npx vitest run --project browser --passWithNoTests --reporter=default --reporter=json --outputFile.json=test-results/browser.json "$@"
fi
# One plain closing line over the three suites.
node -e 'let p = 0, f = 0, s = 0
for (const n of ["unit", "integration", "browser"]) {
  if (!require("fs").existsSync(`./test-results/${n}.json`)) continue
  const r = require(`./test-results/${n}.json`)
  p += r.numPassedTests; f += r.numFailedTests; s += r.numPendingTests + (r.numTodoTests ?? 0)
}
console.log(`${p} passed, ${f} failed, ${s} skipped`)'
log "All checks passed."
