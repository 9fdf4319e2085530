#!/usr/bin/env bash
# npm test: the same set-up as npm start against a throw-away PostgreSQL cluster, then typecheck,
# lint, unit and integration tests (vitest), a production build and the browser tests.
# Ends with one line "N passed, M failed" and a non-zero exit code when anything failed.
source "$(dirname "$0")/common.sh"

TEST_PGPORT="${TEST_PGPORT:-55433}"
TEST_PORT="${TEST_PORT:-3100}"
TEST_SMTP_PORT="${TEST_SMTP_PORT:-2526}"
TEST_MAIL_VIEW_PORT="${TEST_MAIL_VIEW_PORT:-8026}"
DB_NAME="synledger_test"
RESULTS="$ROOT/test-results"
TEST_DATA="$DATA_DIR/pg-test-$$"
TEST_RUN="$RUN_DIR/test-$$"
mkdir -p "$RESULTS" "$TEST_RUN"

cleanup() {
  stop_pidfile "$TEST_RUN/app.pid" "test app" || true
  stop_pidfile "$TEST_RUN/mail-sink.pid" "test mail sink" || true
  pg_stop "$TEST_DATA" || true
  rm -rf "$TEST_DATA" "$TEST_DATA.log" "$TEST_RUN"
}
trap cleanup EXIT

ensure_node_modules
ensure_postgres_installed
apt_install chromium poppler-utils

pg_start "$TEST_DATA" "$TEST_PGPORT"
pg_provision "$TEST_PGPORT" "$DB_NAME"
export MIGRATION_DATABASE_URL="$(owner_url "$TEST_PGPORT" "$DB_NAME")"
export DATABASE_URL="$(app_url "$TEST_PGPORT" "$DB_NAME")"
export AUTH_SECRET="test-secret-$(persistent_secret auth-secret)"
export AUTH_TRUST_HOST=true
export APP_URL="http://127.0.0.1:$TEST_PORT"
export SMTP_URL="smtp://127.0.0.1:$TEST_SMTP_PORT"
export MAIL_VIEW_URL="http://127.0.0.1:$TEST_MAIL_VIEW_PORT"
export MAIL_FROM="Synledger test <no-reply@synledger.invalid>"
export NEXT_TELEMETRY_DISABLED=1

node_modules/.bin/tsx db/migrate.ts || die "migrations failed"
node --import ./scripts/allow-server-modules.mjs --import tsx db/seed.ts || die "seeding failed"

start_detached "$TEST_RUN/mail-sink.pid" "$TEST_RUN/mail-sink.log" node_modules/.bin/tsx scripts/mail-sink.ts \
  --smtp-port "$TEST_SMTP_PORT" --http-port "$TEST_MAIL_VIEW_PORT" --dir "$TEST_RUN/mail"
wait_for_http "$MAIL_VIEW_URL/api/messages" || die "test mail sink did not start"

passed=0
failed=0
failures=()
check() { # check NAME COMMAND...: one pass/fail for a whole step
  local name="$1"; shift
  log "── $name"
  if "$@"; then passed=$((passed + 1)); else failed=$((failed + 1)); failures+=("$name"); fi
}

check "typecheck" node_modules/.bin/tsc --noEmit
check "lint" node_modules/.bin/eslint . --max-warnings=0

log "── vitest (unit + integration)"
node_modules/.bin/vitest run --reporter=default --reporter=json --outputFile="$RESULTS/vitest.json" || true
if [ -f "$RESULTS/vitest.json" ]; then
  read -r vp vf < <(node -e 'const r=require(process.argv[1]);console.log(r.numPassedTests, r.numFailedTests + (r.numRuntimeErrors||0) + (r.success||r.numFailedTests>0?0:1))' "$RESULTS/vitest.json")
  passed=$((passed + vp)); failed=$((failed + vf))
  [ "$vf" -gt 0 ] && failures+=("vitest ($vf)")
else
  failed=$((failed + 1)); failures+=("vitest (no report)")
fi

log "── next build + browser tests"
export NEXT_DIST_DIR=".next-test"
if (NODE_ENV=production node node_modules/next/dist/bin/next build >"$RESULTS/build.log" 2>&1); then
  passed=$((passed + 1))
  # The browser tests play a proxy from 127.0.0.2 (tests/e2e/from-proxy.ts); 127.0.0.1 is an ordinary client.
  PORT="$TEST_PORT" HOST=127.0.0.1 TRUSTED_PROXY=127.0.0.2 NODE_ENV=production start_detached "$TEST_RUN/app.pid" "$RESULTS/app.log" \
    node --import tsx server.ts
  if wait_for_http "$APP_URL/sign-in" 150; then
    E2E_BASE_URL="$APP_URL" node_modules/.bin/tsx tests/e2e/run.ts 2>&1 | tee "$RESULTS/e2e.log"
    line=$(grep -E '^e2e: [0-9]+ passed, [0-9]+ failed' "$RESULTS/e2e.log" | tail -n 1 || true)
    if [ -n "$line" ]; then
      ep=$(echo "$line" | sed -E 's/^e2e: ([0-9]+) passed, ([0-9]+) failed.*/\1/')
      ef=$(echo "$line" | sed -E 's/^e2e: ([0-9]+) passed, ([0-9]+) failed.*/\2/')
      passed=$((passed + ep)); failed=$((failed + ef))
      [ "$ef" -gt 0 ] && failures+=("e2e ($ef)")
    else
      failed=$((failed + 1)); failures+=("e2e (no result line)")
    fi
  else
    tail -n 30 "$RESULTS/app.log" >&2
    failed=$((failed + 1)); failures+=("app start")
  fi
else
  tail -n 40 "$RESULTS/build.log" >&2
  failed=$((failed + 1)); failures+=("next build")
fi

[ ${#failures[@]} -gt 0 ] && log "failed: ${failures[*]}"
echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
