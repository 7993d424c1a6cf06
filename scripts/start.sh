#!/usr/bin/env bash
# Starts Placewright with demo data on http://localhost:3000.
# Installs what is missing, starts a project-local PostgreSQL (durable defaults) and the local
# mail/S3 fakes, migrates, seeds the demo scenario (idempotent), builds and serves the app.
# Ctrl-C stops the app, the fakes and the cluster.
# The demo accounts share a published password, so this serves on 127.0.0.1 only (HOST=… to
# change it; a non-loopback HOST is refused while demo accounts exist). Production: README.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

APP_PORT="${PORT:-3000}"
APP_HOST="${HOST:-127.0.0.1}"
is_loopback "$APP_HOST" || die "Refusing to serve the demo accounts (published password) on $APP_HOST. The demo start serves on 127.0.0.1 only; for a reachable server use the production start in README.md."
PG_PORT="${PG_PORT:-54329}"
export SMTP_PORT="${SMTP_PORT:-2525}" MAILBOX_PORT="${MAILBOX_PORT:-2580}" S3_PORT="${S3_PORT:-4569}"
RUN_DIR="$DATA_DIR/run"

cleanup() {
  local rc=$?
  trap - EXIT INT TERM
  log "Stopping the app, the fakes and PostgreSQL"
  stop_pidfile "$RUN_DIR/app.pid"
  stop_pidfile "$RUN_DIR/fakes.pid"
  pg_down pg
  exit "$rc"
}

if [ "${PAIR:-0}" = "1" ]; then
  for p in $((APP_PORT + 1)) $((APP_PORT + 2)); do
    port_busy "$p" && die "Port $p is busy (needed by an app instance of the pair). Stop what listens there or run with PORT=<another port>."
  done
fi
port_busy "$APP_PORT" && die "Port $APP_PORT is busy. Stop the program that uses it (ss -ltnp 'sport = :$APP_PORT') or run with PORT=<another port>."

ensure_debian_packages postgresql
ensure_node_modules
mkdir -p "$RUN_DIR"
trap cleanup EXIT INT TERM

pg_up pg "$PG_PORT" yes
pg_ensure_db "$PG_PORT" placewright

export DATABASE_URL="postgres://placewright@127.0.0.1:$PG_PORT/placewright"
export NEXTAUTH_URL="http://localhost:$APP_PORT"
SECRET_FILE="$DATA_DIR/nextauth-secret"
[ -f "$SECRET_FILE" ] || (umask 077; head -c 32 /dev/urandom | base64 >"$SECRET_FILE")
export NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(cat "$SECRET_FILE")}"
export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
export MAILBOX_URL="http://127.0.0.1:$MAILBOX_PORT"
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT" S3_REGION=us-east-1 S3_BUCKET=placewright-photos
export S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER S3_FORCE_PATH_STYLE=true
export APP_ORIGIN="http://localhost:$APP_PORT"

start_fakes "$RUN_DIR"

log "Applying migrations"
(cd "$ROOT" && npx tsx scripts/migrate.mts) || die "Migrations failed: see the output above."
log "Seeding the demo scenario"
(cd "$ROOT" && npx tsx scripts/seed.mts) || die "Seeding failed: see the output above."
# The app connects as a role that owns nothing (cannot disable triggers or drop tables); the
# migrations and the seed above ran as the owner.
export APP_DATABASE_URL="${APP_DATABASE_URL:-postgres://placewright_app@127.0.0.1:$PG_PORT/placewright}"
(cd "$ROOT" && npx tsx scripts/app-role.mts) || die "Setting up the app's database role failed: see the output above."

if [ "${SKIP_BUILD:-0}" != "1" ]; then
  log "Building (next build + service worker)"
  (cd "$ROOT" && npm run --silent build) || die "The build failed: see the output above."
fi

cat <<MSG

  Placewright is starting on http://localhost:$APP_PORT (bound to $APP_HOST only)
  DEMO MODE: demo accounts with a published password are present. Never expose this server.
  Demo sign-ins (password for all: placewright-demo):
    sam.super@example.test    superintendent
    ines.inspect@example.test inspector
    olu.office@example.test   office
    oona.owner@example.test   owner
    ada.admin@example.test    admin
  Local mailbox (sign-in links, invitations, digests): http://127.0.0.1:$MAILBOX_PORT
  Press Ctrl-C to stop everything.

MSG

cd "$ROOT"
export DATABASE_URL="$APP_DATABASE_URL"
# PAIR=1 (`npm run start:pair`): two instances on the next two ports behind a round-robin proxy on
# APP_PORT, both on this database, bucket and mailbox (scripts/serve-pair.mjs).
if [ "${PAIR:-0}" = "1" ]; then
  node scripts/serve-pair.mjs -H "$APP_HOST" -p "$APP_PORT" --ports "$((APP_PORT + 1)),$((APP_PORT + 2))" &
else
  node scripts/serve.mjs -H "$APP_HOST" -p "$APP_PORT" &
fi
echo $! >"$RUN_DIR/app.pid"
wait "$(cat "$RUN_DIR/app.pid")"
