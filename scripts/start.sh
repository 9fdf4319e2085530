#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL on loopback (unless DATABASE_URL is set),
# migrate, seed the demo organisation, start the local mail sink and serve the app.
# Running it twice is harmless: what is already running is left alone.
source "$(dirname "$0")/common.sh"

PORT="${PORT:-3000}"
PGPORT="${PGPORT:-55432}"
DB_NAME="${DB_NAME:-synledger}"
SMTP_PORT="${SMTP_PORT:-2525}"
MAIL_VIEW_PORT="${MAIL_VIEW_PORT:-8025}"

ensure_node_modules

if [ -z "${DATABASE_URL:-}" ]; then
  ensure_postgres_installed
  pg_start "$DATA_DIR/pg" "$PGPORT"
  pg_provision "$PGPORT" "$DB_NAME"
  export MIGRATION_DATABASE_URL="$(owner_url "$PGPORT" "$DB_NAME")"
  export DATABASE_URL="$(app_url "$PGPORT" "$DB_NAME")"
else
  log "DATABASE_URL is set: using that server, starting no PostgreSQL"
  export MIGRATION_DATABASE_URL="${MIGRATION_DATABASE_URL:-$DATABASE_URL}"
fi

export AUTH_SECRET="${AUTH_SECRET:-$(persistent_secret auth-secret)}"
export AUTH_TRUST_HOST="${AUTH_TRUST_HOST:-true}"
export APP_URL="${APP_URL:-http://localhost:$PORT}"
export SMTP_URL="${SMTP_URL:-smtp://127.0.0.1:$SMTP_PORT}"
export MAIL_FROM="${MAIL_FROM:-Synledger <no-reply@synledger.invalid>}"

(cd "$ROOT" && node_modules/.bin/tsx db/migrate.ts) || die "migrations failed"
if [ "${SEED_DEMO:-1}" = "1" ]; then
  (cd "$ROOT" && node --import ./scripts/allow-server-modules.mjs --import tsx db/seed.ts) || die "seeding the demo organisation failed"
fi

if pid_alive "$RUN_DIR/mail-sink.pid"; then
  log "mail sink already running"
else
  start_detached "$RUN_DIR/mail-sink.pid" "$RUN_DIR/mail-sink.log" node_modules/.bin/tsx scripts/mail-sink.ts \
    --smtp-port "$SMTP_PORT" --http-port "$MAIL_VIEW_PORT" --dir "$RUN_DIR/mail"
  wait_for_http "http://127.0.0.1:$MAIL_VIEW_PORT/api/messages" || die "mail sink did not start (see .run/mail-sink.log)"
  log "mail sink: SMTP 127.0.0.1:$SMTP_PORT, messages at http://127.0.0.1:$MAIL_VIEW_PORT"
fi

if pid_alive "$RUN_DIR/app.pid"; then
  log "app already running at $APP_URL"
  exit 0
fi
build_if_stale
# server.ts wraps Next so forwarding headers count only from the proxies TRUSTED_PROXY names.
PORT="$PORT" HOST="${HOST:-0.0.0.0}" NODE_ENV=production start_detached "$RUN_DIR/app.pid" "$RUN_DIR/app.log" \
  node --import tsx server.ts
wait_for_http "http://127.0.0.1:$PORT/sign-in" 150 || { tail -n 30 "$RUN_DIR/app.log" >&2; die "the app did not answer on port $PORT"; }
log "Synledger is running at $APP_URL  (demo accounts: README.md; 'npm run stop' stops everything)"
