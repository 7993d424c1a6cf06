#!/usr/bin/env bash
# Fails when db/schema has changes that no committed migration in drizzle/ contains:
# generates into a scratch copy of drizzle/ and checks that nothing new appears.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
scratch=".data/migration-check"
rm -rf "$scratch" && mkdir -p "$scratch" && cp -r drizzle/. "$scratch/"
before=$(ls "$scratch" | sort)
npx drizzle-kit check >/dev/null
out=$(npx drizzle-kit generate --dialect postgresql --schema ./db/schema/index.ts --out "./$scratch" --name unexpected 2>&1)
after=$(ls "$scratch" | sort)
if [ "$before" != "$after" ] || ! grep -q "No schema changes" <<<"$out"; then
  echo "The schema in db/schema differs from the committed migrations. Run: npx drizzle-kit generate --name <change>" >&2
  echo "$out" | tail -20 >&2
  exit 1
fi
echo "migrations match the schema"
