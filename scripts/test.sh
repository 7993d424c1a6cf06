#!/usr/bin/env bash
# Runs every check and test on a throwaway PostgreSQL cluster:
# typecheck, lint, Vitest (unit + integration against the real database), build, Playwright (e2e
# in Debian's Chromium). Ends with one line "N passed, N failed" summing every runner.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
set +e   # run every step; the summary decides the exit code

export PG_PORT="${TEST_PG_PORT:-54339}"
export APP_PORT="${TEST_APP_PORT:-3100}"
export SMTP_PORT="${TEST_SMTP_PORT:-2526}" MAILBOX_PORT="${TEST_MAILBOX_PORT:-2581}" S3_PORT="${TEST_S3_PORT:-4570}"
RUN_DIR="$DATA_DIR/test-run"

cleanup() {
  trap - EXIT INT TERM
  stop_pidfile "$RUN_DIR/fakes.pid"
  pg_down test-pg
}

(
  set -e
  ensure_debian_packages postgresql chromium
  ensure_node_modules
) || exit 1
trap cleanup EXIT INT TERM

pg_down test-pg
rm -rf "$RUN_DIR" "$(pg_cluster_dir test-pg)"
mkdir -p "$RUN_DIR"
( set -e; pg_up test-pg "$PG_PORT" no; pg_ensure_db "$PG_PORT" placewright_test ) || exit 1

export DATABASE_URL="postgres://placewright@127.0.0.1:$PG_PORT/placewright_test"
# The served app (Playwright's web server) connects as a role that owns nothing; tests and scripts use the owner.
export APP_DATABASE_URL="postgres://placewright_app@127.0.0.1:$PG_PORT/placewright_test"
export NEXTAUTH_URL="http://localhost:$APP_PORT" APP_ORIGIN="http://localhost:$APP_PORT"
export NEXTAUTH_SECRET="test-secret-not-for-production-0123456789"
export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT" MAILBOX_URL="http://127.0.0.1:$MAILBOX_PORT"
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT" S3_REGION=us-east-1 S3_BUCKET=placewright-photos
export S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER S3_FORCE_PATH_STYLE=true
export PLAYWRIGHT_BASE_URL="http://localhost:$APP_PORT"

( set -e; start_fakes "$RUN_DIR" ) || exit 1

cd "$ROOT"
checks_failed=()
step() {
  local name="$1"; shift
  log "$name"
  if ! "$@"; then checks_failed+=("$name"); return 1; fi
}

step "migrations match the schema" bash scripts/check-migrations.sh
step "migrate" npx tsx scripts/migrate.mts
step "seed" npx tsx scripts/seed.mts
step "app database role" npx tsx scripts/app-role.mts
step "typecheck" npx tsc --noEmit
step "lint" npx eslint . --max-warnings=0
log "unit and integration tests (Vitest)"
npx vitest run --reporter=default --reporter=json --outputFile.json="$RUN_DIR/vitest.json"
if step "build" npm run --silent build; then
  log "end-to-end tests (Playwright, Debian Chromium)"
  npx playwright test --reporter=list,json 2>&1 | tee "$RUN_DIR/playwright.log"
  log "end-to-end tests against two instances behind a round-robin proxy (same build)"
  PLAYWRIGHT_PAIR=1 PLAYWRIGHT_JSON_OUTPUT_NAME="$RUN_DIR/playwright-pair.json" \
    npx playwright test --reporter=list,json 2>&1 | tee "$RUN_DIR/playwright-pair.log"
else
  log "build failed: end-to-end tests not run"
fi
# Playwright's JSON reporter writes to PLAYWRIGHT_JSON_OUTPUT_NAME (set in playwright.config.ts).

node scripts/test-summary.mjs "$RUN_DIR" "${checks_failed[@]}"
