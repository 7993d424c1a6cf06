#!/usr/bin/env bash
# npm run chaos:sync: crash safety of sync, shown end to end (not part of the test run).
# A throwaway PostgreSQL cluster (.data/chaos-pg, durable defaults, so a crash is a real crash),
# migrations and the demo scenario, then scripts/chaos-sync.mts runs the built app, three simulated
# devices and the kills. Needs a build (npm run build). Ports: CHAOS_PG_PORT, CHAOS_APP_PORT.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

export CHAOS_PG_PORT="${CHAOS_PG_PORT:-54359}" CHAOS_APP_PORT="${CHAOS_APP_PORT:-3199}"
[ -f "$ROOT/.next/BUILD_ID" ] || die "No build found: run npm run build first."
ensure_debian_packages postgresql
trap 'pg_down chaos-pg' EXIT INT TERM
pg_down chaos-pg
rm -rf "$(pg_cluster_dir chaos-pg)"
pg_up chaos-pg "$CHAOS_PG_PORT" yes
pg_ensure_db "$CHAOS_PG_PORT" placewright_chaos
export DATABASE_URL="postgres://placewright@127.0.0.1:$CHAOS_PG_PORT/placewright_chaos"
export CHAOS_PG_DIR="$PG_DIR" CHAOS_PG_BIN="$(pg_bin)"
export NEXTAUTH_SECRET="chaos-secret-not-for-production-0123456789" NEXTAUTH_URL="http://localhost:$CHAOS_APP_PORT"
cd "$ROOT"
npx tsx scripts/migrate.mts >/dev/null
npx tsx scripts/seed.mts >/dev/null
npx tsx scripts/chaos-sync.mts
