#!/usr/bin/env bash
# npm run backup:check: the backup and restore of docs/deploy.md, tried on the local
# test cluster (127.0.0.1:$TONEWRIGHT_TEST_DB_PORT, made by `npm test`). A scratch copy
# of the test database (TW_BACKUP_SOURCE_DB, default tonewright_test) is verified, dumped
# with pg_dump, dropped, restored with pg_restore and verified again: a certificate
# (TW_BACKUP_CERT_CODE, default the newest) must still verify with the same hash, and
# every table must hold as many rows as before. The scratch database is dropped at the end.
source "$(dirname "$0")/lib.sh"

DB_PORT="${TONEWRIGHT_TEST_DB_PORT:-54339}"
SOURCE_DB="${TW_BACKUP_SOURCE_DB:-tonewright_test}"
CHECK_DB=tonewright_restore_check

require_node
ensure_postgres
PG_DIR=$(pg_datadir test-pg)
[ -s "$PG_DIR/PG_VERSION" ] || die "There is no test cluster yet; run npm test once first."
DB_PASSWORD=$(secret_file test-db-password)
APP_DB_PASSWORD=$(secret_file test-db-app-password)
WORK=$(mktemp -d)
STARTED_PG=0
cleanup() {
  local code=$?
  trap - INT TERM EXIT
  psql_as "$DB_PORT" "$DB_PASSWORD" postgres "drop database if exists $CHECK_DB with (force)" 2>/dev/null || true
  rm -rf "$WORK"
  if [ "$STARTED_PG" = 1 ]; then pg_stop "$PG_DIR"; fi
  exit "$code"
}
trap cleanup INT TERM EXIT
if ! pg_ready "$DB_PORT"; then pg_start "$PG_DIR" "$DB_PORT"; STARTED_PG=1; fi

# The app role owns the database and everything in it, so it dumps and restores it.
as_app() { PGPASSWORD="$APP_DB_PASSWORD" "$@" -h 127.0.0.1 -p "$DB_PORT" -U "$APP_ROLE"; }
app_sql() { PGOPTIONS="-c client_min_messages=warning" as_app "$PG_BIN/psql" -X -q -v ON_ERROR_STOP=1 -d "$1" -tAc "$2"; }
CHECK_URL=$(app_database_url "$DB_PORT" "$APP_DB_PASSWORD" "$CHECK_DB")
# Rows per table of the public and pgboss schemas, one "table count" line each.
row_counts() {
  app_sql "$CHECK_DB" "select format('%s.%s %s', schemaname, relname, (xpath('/row/n/text()', query_to_xml(format('select count(*) as n from %I.%I', schemaname, relname), false, true, '')))[1]::text)
    from pg_stat_user_tables where schemaname in ('public', 'pgboss', 'drizzle') order by 1"
}

[ -n "$(psql_as "$DB_PORT" "$DB_PASSWORD" postgres "select 1 from pg_database where datname = '$SOURCE_DB'")" ] \
  || die "The database $SOURCE_DB does not exist on 127.0.0.1:$DB_PORT; run npm test first."
log "Copying $SOURCE_DB into the scratch database $CHECK_DB…"
psql_as "$DB_PORT" "$DB_PASSWORD" postgres "drop database if exists $CHECK_DB with (force)"
ensure_database "$DB_PORT" "$DB_PASSWORD" "$CHECK_DB"
as_app "$PG_BIN/pg_dump" -Fc -d "$SOURCE_DB" -f "$WORK/source.dump"
as_app "$PG_BIN/pg_restore" --no-owner --exit-on-error -d "$CHECK_DB" "$WORK/source.dump"

CODE="${TW_BACKUP_CERT_CODE:-$(app_sql "$CHECK_DB" "select code from certificates order by signed_at desc limit 1")}"
[ -n "$CODE" ] || die "There is no certificate in $SOURCE_DB to check; sign one first (the integration tests do)."
BEFORE=$(cd "$ROOT" && NUXT_DATABASE_URL="$CHECK_URL" npx tsx scripts/certificate-check.ts "$CODE") \
  || die "The certificate $CODE does not verify before the backup: $BEFORE"
row_counts >"$WORK/before.txt"

log "Backing up: pg_dump -Fc $CHECK_DB…"
started=$(date +%s%N)
as_app "$PG_BIN/pg_dump" -Fc -d "$CHECK_DB" -f "$WORK/backup.dump"
dumped=$(date +%s%N)
log "Dropping $CHECK_DB…"
psql_as "$DB_PORT" "$DB_PASSWORD" postgres "drop database $CHECK_DB with (force)"
log "Restoring: pg_restore --no-owner into a new, empty $CHECK_DB…"
ensure_database "$DB_PORT" "$DB_PASSWORD" "$CHECK_DB"
restore_started=$(date +%s%N)
as_app "$PG_BIN/pg_restore" --no-owner --exit-on-error -d "$CHECK_DB" "$WORK/backup.dump"
restored=$(date +%s%N)

AFTER=$(cd "$ROOT" && NUXT_DATABASE_URL="$CHECK_URL" npx tsx scripts/certificate-check.ts "$CODE") \
  || die "The certificate $CODE does not verify after the restore: $AFTER"
[ "$BEFORE" = "$AFTER" ] || die "The certificate $CODE reads differently after the restore: $BEFORE then $AFTER"
row_counts >"$WORK/after.txt"
diff -u "$WORK/before.txt" "$WORK/after.txt" >&2 || die "Row counts differ after the restore (above)."

printf 'backup-restore-check: %s verifies after dump, drop and restore: %s\n' "$CODE" "$AFTER"
printf 'backup-restore-check: %s tables, %s rows restored alike; dump %s kB in %s ms, restore in %s ms\n' \
  "$(wc -l <"$WORK/after.txt")" "$(awk '{ s += $2 } END { print s }' "$WORK/after.txt")" \
  "$(( $(stat -c %s "$WORK/backup.dump") / 1024 ))" "$(( (dumped - started) / 1000000 ))" "$(( (restored - restore_started) / 1000000 ))"
