#!/usr/bin/env bash
# Production start: no demo data, no local fakes, no project-local cluster. The environment names
# the real services (DATABASE_URL: the owner, for migrations; APP_DATABASE_URL: the role the app
# connects as, created and granted here, owning nothing; NEXTAUTH_SECRET, NEXTAUTH_URL, APP_ORIGIN, SMTP_URL, MAIL_FROM,
# S3_*). Applies migrations, refuses to run while demo accounts are enabled on a reachable
# address, builds (unless SKIP_BUILD=1) and serves on HOST:PORT (default 127.0.0.1:3000, behind a
# TLS reverse proxy). Create the first administrator once with `npm run admin:create`.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

APP_PORT="${PORT:-3000}"
export HOST="${HOST:-127.0.0.1}"
for var in DATABASE_URL APP_DATABASE_URL NEXTAUTH_SECRET NEXTAUTH_URL; do
  [ -n "${!var:-}" ] || die "$var is not set. The production start needs it (see README.md, \"Production\")."
done
[ "${#NEXTAUTH_SECRET}" -ge 32 ] || die "NEXTAUTH_SECRET is shorter than 32 characters. Generate one with: head -c 32 /dev/urandom | base64"
ensure_node_modules
cd "$ROOT"
log "Applying migrations"
npx tsx scripts/migrate.mts || die "Migrations failed: see the output above."
npx tsx scripts/app-role.mts || die "Setting up the app's database role failed: see the output above."
npx tsx scripts/check-demo-accounts.mts || die "Demo accounts are enabled: not serving on $HOST."
if [ "${SKIP_BUILD:-0}" != "1" ]; then
  log "Building (next build + service worker)"
  npm run --silent build || die "The build failed: see the output above."
fi
log "Serving on $HOST:$APP_PORT"
DATABASE_URL="$APP_DATABASE_URL" exec node node_modules/next/dist/bin/next start -H "$HOST" -p "$APP_PORT"
