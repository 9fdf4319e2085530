#!/usr/bin/env bash
# npm run restore -- FILE: restores a backup made by npm run backup into an EMPTY database
# (MIGRATION_DATABASE_URL, else DATABASE_URL, else the project's own cluster). Refuses a file whose
# SHA-256 differs from FILE.sha256 beside it, and a database that already holds tables. Ownership
# and grants are not restored from the file: the restoring role owns the tables and the app role is
# granted its DML rights again, as migrations grant them.
source "$(dirname "$0")/common.sh"

FILE="${1:-}"
[ -n "$FILE" ] && [ -f "$FILE" ] || die "usage: npm run restore -- FILE.dump (the file was not found)"
PGPORT="${PGPORT:-55432}"
DB_NAME="${DB_NAME:-synledger}"
URL="${MIGRATION_DATABASE_URL:-${DATABASE_URL:-}}"
[ -n "$URL" ] || URL="$(owner_url "$PGPORT" "$DB_NAME")"
bin="$(pg_bin)" || die "PostgreSQL client programs not found (apt-get install postgresql)"

if [ -f "$FILE.sha256" ]; then
  (cd "$(dirname "$FILE")" && sha256sum --check --quiet "$(basename "$FILE").sha256") || die "$FILE does not match its SHA-256 ($FILE.sha256): not restored"
  log "SHA-256 checked"
else
  log "no $FILE.sha256 beside the file: its integrity is not checked"
fi
tables="$("$bin/psql" "$URL" -At -c "select count(*) from information_schema.tables where table_schema = 'public'")" || die "cannot connect to the target database"
[ "$tables" = "0" ] || die "the target database already holds $tables tables; restore into an empty database"
"$bin/pg_restore" --no-owner --no-privileges --exit-on-error --single-transaction --dbname="$URL" "$FILE" || die "pg_restore failed; nothing was restored"
# The grants the app role needs (migrations apply none: they are recorded as done in the restored data).
(cd "$ROOT" && MIGRATION_DATABASE_URL="$URL" node_modules/.bin/tsx db/migrate.ts) || die "granting the app role its rights failed"
log "restored $FILE"
