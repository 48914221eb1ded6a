#!/usr/bin/env bash
# Runs every test: starts PostgreSQL with a fresh test database, the mail and search fakes and a
# production build of the app on 127.0.0.1:3100, then vitest (unit, integration and browser tests).
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

ensure_node_modules
if [ ! -x /usr/bin/chromium ]; then
  echo "Installing Debian's chromium for the browser tests…"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq && apt-get install -y -qq chromium >/dev/null
fi

scripts/db.sh start
scripts/db.sh drop kettlefork_test >/dev/null
scripts/db.sh create kettlefork_test

export NODE_ENV=test
export DATABASE_URL=$(scripts/db.sh url kettlefork_test)
export NEXTAUTH_URL=http://127.0.0.1:3100
export NEXTAUTH_SECRET=test-secret-0123456789abcdef0123456789abcdef
export SMTP_URL=smtp://127.0.0.1:2526
export MAIL_OUTBOX_URL=http://127.0.0.1:2581
export MEILI_HOST=http://127.0.0.1:7702
export TRUST_PROXY=1
export KF_BASE_URL=$NEXTAUTH_URL

cleanup() { stop_bg test-app; stop_bg test-mail-fake; stop_bg test-search-fake; }
trap cleanup EXIT INT TERM

MAIL_FAKE_SMTP_PORT=2526 MAIL_FAKE_HTTP_PORT=2581 start_bg test-mail-fake node --import tsx scripts/mail-fake.ts
MEILI_FAKE_PORT=7702 start_bg test-search-fake node --import tsx scripts/search-fake.ts
tsx_server db/migrate.ts

# The app under test is a production build, as brewers get it.
NODE_ENV=production npx next build > .data/logs/test-build.log 2>&1 || { tail -n 60 .data/logs/test-build.log; exit 1; }
NODE_ENV=production start_bg test-app node node_modules/next/dist/bin/next start -H 127.0.0.1 -p 3100
wait_port 2526 test-mail-fake
wait_port 7702 test-search-fake
wait_http http://127.0.0.1:3100/api/health test-app 90

npx vitest run "$@"
