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

# KF_TEST_SLOT=N runs a second, independent suite beside the first (its own ports, database and build).
SLOT=${KF_TEST_SLOT:-0}
APP_PORT=$((3100 + SLOT * 10))
SMTP_PORT=$((2526 + SLOT * 10))
OUTBOX_PORT=$((2581 + SLOT * 10))
SEARCH_PORT=$((7702 + SLOT * 10))
S3_PORT=$((4570 + SLOT * 10))
DB_NAME=kettlefork_test$([ "$SLOT" = 0 ] || echo "_$SLOT")
SUFFIX=$([ "$SLOT" = 0 ] || echo "-$SLOT")

scripts/db.sh start
scripts/db.sh drop "$DB_NAME" >/dev/null
scripts/db.sh create "$DB_NAME"

export NODE_ENV=test
export DATABASE_URL=$(scripts/db.sh url "$DB_NAME")
export NEXTAUTH_URL=http://127.0.0.1:$APP_PORT
export NEXTAUTH_SECRET=test-secret-0123456789abcdef0123456789abcdef
export SMTP_URL=smtp://127.0.0.1:$SMTP_PORT
export MAIL_OUTBOX_URL=http://127.0.0.1:$OUTBOX_PORT
export MEILI_HOST=http://127.0.0.1:$SEARCH_PORT
export S3_ENDPOINT=http://127.0.0.1:$S3_PORT
export TRUST_PROXY=1
export KF_BASE_URL=$NEXTAUTH_URL
export KF_DIST_DIR=.next-test$SUFFIX

cleanup() { stop_bg "test-app$SUFFIX"; stop_bg "test-mail-fake$SUFFIX"; stop_bg "test-search-fake$SUFFIX"; stop_bg "test-s3-fake$SUFFIX"; }
trap cleanup EXIT INT TERM

MAIL_FAKE_SMTP_PORT=$SMTP_PORT MAIL_FAKE_HTTP_PORT=$OUTBOX_PORT start_bg "test-mail-fake$SUFFIX" node --import tsx scripts/mail-fake.ts
MEILI_FAKE_PORT=$SEARCH_PORT start_bg "test-search-fake$SUFFIX" node --import tsx scripts/search-fake.ts
rm -rf ".data/s3-test$SUFFIX"
S3_FAKE_PORT=$S3_PORT S3_FAKE_DIR=".data/s3-test$SUFFIX" start_bg "test-s3-fake$SUFFIX" node --import tsx scripts/s3-fake.ts
tsx_server db/migrate.ts

# The app under test is a production build, as brewers get it.
mkdir -p .data/logs
NODE_ENV=production npx next build > ".data/logs/test-build$SUFFIX.log" 2>&1 || { tail -n 60 ".data/logs/test-build$SUFFIX.log"; exit 1; }
NODE_ENV=production start_bg "test-app$SUFFIX" node scripts/serve.mjs -H 127.0.0.1 -p "$APP_PORT"
wait_port "$SMTP_PORT" "test-mail-fake$SUFFIX"
wait_port "$SEARCH_PORT" "test-search-fake$SUFFIX"
wait_port "$S3_PORT" "test-s3-fake$SUFFIX"
wait_http "http://127.0.0.1:$APP_PORT/api/health" "test-app$SUFFIX" 90

npx vitest run "$@"
