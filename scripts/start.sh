#!/usr/bin/env bash
# Starts the whole product on http://127.0.0.1:3000: installs what is missing, starts PostgreSQL and
# the local mail and search fakes, migrates, seeds the demo world, builds and serves.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

ensure_node_modules

if [ -z "${DATABASE_URL:-}" ]; then
  scripts/db.sh start
  scripts/db.sh create kettlefork
  export DATABASE_URL=$(scripts/db.sh url kettlefork)
fi

mkdir -p .data
if [ -z "${NEXTAUTH_SECRET:-}" ]; then
  [ -f .data/nextauth-secret ] || node -e "console.log(require('crypto').randomBytes(32).toString('hex'))" > .data/nextauth-secret
  export NEXTAUTH_SECRET=$(cat .data/nextauth-secret)
fi
export NEXTAUTH_URL=${NEXTAUTH_URL:-http://127.0.0.1:3000}
PORT=${PORT:-3000}

cleanup() { stop_bg mail-fake; stop_bg search-fake; stop_bg s3-fake; }
trap cleanup EXIT INT TERM

if [ -z "${SMTP_URL:-}" ]; then
  start_bg mail-fake node --import tsx scripts/mail-fake.ts
  wait_port 2525 mail-fake
fi
if [ -z "${MEILI_HOST:-}" ]; then
  start_bg search-fake node --import tsx scripts/search-fake.ts
  wait_port 7701 search-fake
fi
if [ -z "${S3_ENDPOINT:-}" ]; then
  start_bg s3-fake node --import tsx scripts/s3-fake.ts
  wait_port "${S3_FAKE_PORT:-4569}" s3-fake
fi

tsx_server db/migrate.ts
tsx_server db/seed.ts
npx next build
echo "Kettlefork is starting on http://127.0.0.1:$PORT (Ctrl-C stops it and its services)"
node scripts/serve.mjs -H 127.0.0.1 -p "$PORT"
