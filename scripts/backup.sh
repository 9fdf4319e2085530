#!/usr/bin/env bash
# npm run backup [-- DIR]: a pg_dump custom-format file of the database and its SHA-256, written to
# DIR (default backups/) as synledger-YYYYMMDDTHHMMSSZ.dump and .dump.sha256 (sha256sum's format).
# Reads MIGRATION_DATABASE_URL (the owner: every table, triggers included), else DATABASE_URL, else
# the project's own cluster that npm start runs. Prints the file and its hash.
source "$(dirname "$0")/common.sh"

PGPORT="${PGPORT:-55432}"
DB_NAME="${DB_NAME:-synledger}"
URL="${MIGRATION_DATABASE_URL:-${DATABASE_URL:-}}"
[ -n "$URL" ] || URL="$(owner_url "$PGPORT" "$DB_NAME")"
OUT_DIR="${1:-$ROOT/backups}"
mkdir -p "$OUT_DIR"
bin="$(pg_bin)" || die "PostgreSQL client programs not found (apt-get install postgresql)"
file="$OUT_DIR/synledger-$(date -u +%Y%m%dT%H%M%SZ).dump"
# Custom format: compressed, restorable table by table; --no-owner/--no-privileges are applied at restore.
"$bin/pg_dump" --format=custom --compress=6 --file="$file.partial" --dbname="$URL" || { rm -f "$file.partial"; die "pg_dump failed"; }
mv "$file.partial" "$file"
(cd "$(dirname "$file")" && sha256sum "$(basename "$file")" > "$(basename "$file").sha256")
log "backup written: $file"
echo "$file"
cat "$file.sha256"
