#!/usr/bin/env bash
# npm test: the same set-up as npm start against a separate database (benchfold_test, reset
# each run), then every test: types, unit, integration (HTTP against the built app and the
# real MariaDB) and browser tests (Debian's chromium). One build, one DB, one server per run.
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$BENCHFOLD_ROOT"

started=$(date +%s)
ensure_debian_packages mariadbd:mariadb-server curl:curl /usr/bin/chromium:chromium pdftoppm:poppler-utils \
  /usr/lib/python3/dist-packages/skrf:python3-scikit-rf
ensure_node_modules

export DB_NAME="${TEST_DB_NAME:-benchfold_test}"
export PORT="${TEST_PORT:-3100}"
export SMTP_PORT="${TEST_SMTP_PORT:-2526}"
export BENCHFOLD_MAILBOX_PORT="${TEST_MAILBOX_PORT:-2581}"
# The run's files go to an empty local fake S3 store of its own (a bucket configured in S3_BUCKET is never used by tests).
unset S3_ENDPOINT S3_PREFIX
export BENCHFOLD_FAKE_S3=1 S3_BUCKET=benchfold-test
export BENCHFOLD_FAKE_S3_PORT="${TEST_S3_PORT:-4567}"
export BENCHFOLD_FAKE_S3_DIR="${BENCHFOLD_DATA_DIR:-$BENCHFOLD_ROOT/.data}/s3-test-$BENCHFOLD_FAKE_S3_PORT"
export NEXTAUTH_URL="http://localhost:$PORT"
export BENCHFOLD_TEST_URL="http://localhost:$PORT"
# Tests give each client its own address through X-Forwarded-For: the test server treats loopback
# as its trusted proxy, so a test client on this machine counts as the right-most hop it sends.
export BENCHFOLD_TRUSTED_PROXIES="127.0.0.1,::1"
# bcrypt at cost 11 takes about a second here and the suite signs in hundreds of times: the test
# server hashes at 5 (lib/server/accounts/hash-password.ts). Factory users are stored at 4, so
# every first sign-in of one also takes the rehash path (auth.test.ts checks it).
export BENCHFOLD_PASSWORD_HASH_COST=5
unset SMTP_HOST NEXTAUTH_SECRET
load_env

RESULTS="$BENCHFOLD_DATA_DIR/test-results"
rm -rf "$RESULTS"; mkdir -p "$RESULTS" "$BENCHFOLD_DATA_DIR/logs"

bash scripts/db.sh start || die "MariaDB did not start"
bash scripts/db.sh reset "$DB_NAME" || die "could not reset $DB_NAME"
FAKE_S3_PID=""
start_fake_s3 --empty
run_tsx scripts/migrate.ts || die "migrations failed"
run_tsx scripts/seed.ts || die "seeding failed"
# The secret is made in the (fresh) database, as npm start's is: a second instance reads the same one.
ensure_shared_secret
start_fake_smtp
SERVER_PID=""
OUTBOX_WORKER_PID=""
cleanup() {
  [ -n "$SERVER_PID" ] && kill "$SERVER_PID" 2>/dev/null
  [ -n "$OUTBOX_WORKER_PID" ] && kill "$OUTBOX_WORKER_PID" 2>/dev/null
  [ -n "${FAKE_SMTP_PID:-}" ] && kill "$FAKE_SMTP_PID" 2>/dev/null
  # The read-replica test stops its replica; this one only if the test was cut short.
  [ -S "$BENCHFOLD_DATA_DIR/run/replica.sock" ] && bash scripts/replica.sh stop >/dev/null 2>&1
  [ -n "${FAKE_S3_PID:-}" ] && kill "$FAKE_S3_PID" 2>/dev/null
  true
}
trap cleanup EXIT

status=0
step() { local name="$1"; shift; log "── $name"; "$@" || { log "✗ $name failed"; status=1; }; }

# A part of the run while working on a change (never in CI): TEST_SKIP_UNIT=1 skips types and unit
# tests; TEST_INTEGRATION_FILES / TEST_E2E_FILES name the files to run ("-" runs none of them);
# TEST_REUSE_BUILD=1 serves the build already in .next instead of building again.
if [ -n "${CI:-}" ]; then unset TEST_SKIP_UNIT TEST_INTEGRATION_FILES TEST_E2E_FILES TEST_REUSE_BUILD; fi
PARTIAL=""
[ -n "${TEST_SKIP_UNIT:-}${TEST_INTEGRATION_FILES:-}${TEST_E2E_FILES:-}${TEST_REUSE_BUILD:-}" ] && PARTIAL="--partial"
read -r -a INTEGRATION_FILES <<< "${TEST_INTEGRATION_FILES:-}"
read -r -a E2E_FILES <<< "${TEST_E2E_FILES:-}"
if [ "${TEST_SKIP_UNIT:-0}" != 1 ]; then
  step "type check" node node_modules/typescript/bin/tsc --noEmit
  step "unit tests" node node_modules/vitest/vitest.mjs run --project unit \
    --reporter=default --reporter=json --outputFile.json="$RESULTS/unit.json"
fi

# A server left on the test port would answer instead of the one built here: refuse, do not test it.
if curl -fsS -o /dev/null "$BENCHFOLD_TEST_URL/api/auth/csrf" 2>/dev/null; then
  die "something already answers on port $PORT; stop it (or set TEST_PORT) so the tests reach this build"
fi

build_for_tests() {
  if [ "${TEST_REUSE_BUILD:-0}" = 1 ] && [ -f .next/BUILD_ID ]; then log "── build: reusing .next"; return 0; fi
  log "── build"
  # This build also offers the test-only device classes (lib/domain/device-classes.ts); npm start's never does.
  BENCHFOLD_TEST_DEVICE_CLASSES=1 node node_modules/next/dist/bin/next build >"$BENCHFOLD_DATA_DIR/logs/next-build-test.log" 2>&1
}
if build_for_tests; then
  node scripts/server.mjs >"$BENCHFOLD_DATA_DIR/logs/next-test-server.log" 2>&1 &
  SERVER_PID=$!
  # The run's outbox worker drains lane "mail" into the test fake SMTP server, as npm start's does;
  # tests/integration/outbox-*.test.ts use lanes of their own and workers of their own.
  rm -f "$BENCHFOLD_DATA_DIR/logs/outbox-worker-test.log"
  start_outbox_worker outbox-worker-test
  for _ in $(seq 1 150); do curl -fsS "$BENCHFOLD_TEST_URL/api/auth/csrf" >/dev/null 2>&1 && break; sleep 0.2; done
  if curl -fsS "$BENCHFOLD_TEST_URL/api/auth/csrf" >/dev/null 2>&1; then
    step "outbox worker" check_outbox_worker
    step "demo measurements through the bench API" env BENCHFOLD_APP_URL="$BENCHFOLD_TEST_URL" \
      node node_modules/tsx/dist/cli.mjs scripts/seed-demo-measurements.ts
    if [ "${INTEGRATION_FILES[*]:-}" != "-" ]; then
      step "integration tests" node node_modules/vitest/vitest.mjs run --project integration \
        --reporter=default --reporter=json --outputFile.json="$RESULTS/integration.json" "${INTEGRATION_FILES[@]}"
    fi
    if [ "${E2E_FILES[*]:-}" != "-" ]; then
      step "browser tests" env PLAYWRIGHT_JSON_OUTPUT_NAME="$RESULTS/e2e.json" \
        node node_modules/@playwright/test/cli.js test --reporter=list,json "${E2E_FILES[@]}"
    fi
    # The worker must outlive every fault the tests cause (a killed database, a stopped relay).
    if ! kill -0 "$OUTBOX_WORKER_PID" 2>/dev/null; then
      tail -20 "$BENCHFOLD_DATA_DIR/logs/outbox-worker-test.log"; log "✗ the outbox worker stopped during the tests"; status=1
    fi
  else
    tail -20 "$BENCHFOLD_DATA_DIR/logs/next-test-server.log"; log "✗ the app server did not start"; status=1
  fi
else
  tail -40 "$BENCHFOLD_DATA_DIR/logs/next-build-test.log"; log "✗ build failed"; status=1
fi

node scripts/summarize-tests.mjs "$RESULTS" $PARTIAL || status=1
[ -n "$PARTIAL" ] && log "a partial run (TEST_* variables set): not a result for a commit"
log "npm test took $(( $(date +%s) - started )) s"
exit $status
