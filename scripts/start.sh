#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB, migrate, seed the demo once, build and serve.
# `npm run dev` (--dev) serves with hot reload instead of a production build.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$BENCHFOLD_ROOT"

MODE="${1:-}"
started=$(date +%s)
ensure_debian_packages mariadbd:mariadb-server curl:curl
ensure_node_modules
load_env
if uses_external_database; then
  log "using the database at $DB_HOST:$DB_PORT (not starting one here)"
else
  bash scripts/db.sh start
fi
# Files: the configured bucket, or the local fake S3 store (before migrating: a migration moves files to it).
FAKE_S3_PID=""
start_fake_s3
run_tsx scripts/migrate.ts
run_tsx scripts/seed.ts
ensure_shared_secret

# Mail: a real relay when SMTP_HOST is configured, otherwise the local fake server and its mailbox page.
SERVER_PID=""; FAKE_SMTP_PID=""; OUTBOX_WORKER_PID=""
stop_children() {
  local pid
  for pid in "$SERVER_PID" "$OUTBOX_WORKER_PID" "$FAKE_SMTP_PID" "$FAKE_S3_PID"; do [ -n "$pid" ] && kill "$pid" 2>/dev/null; done
  true
}
trap stop_children EXIT
trap 'exit 130' INT TERM
if [ -z "${SMTP_HOST:-}" ]; then
  start_fake_smtp
  warn_mail_not_delivered
fi
# Review and release notices go out through the outbox worker, a process of its own beside the server.
start_outbox_worker

if [ "$MODE" = "--dev" ]; then
  check_outbox_worker || die "notices would not be mailed; see above"
  log "ready in $(( $(date +%s) - started )) s of set-up; dev server on http://localhost:$PORT"
  node scripts/server.mjs --dev
else
  log "building"
  node node_modules/next/dist/bin/next build >"$BENCHFOLD_DATA_DIR/logs/next-build.log" 2>&1 \
    || { tail -40 "$BENCHFOLD_DATA_DIR/logs/next-build.log"; die "next build failed (full log: $BENCHFOLD_DATA_DIR/logs/next-build.log)"; }
  node scripts/server.mjs &
  SERVER_PID=$!
  for _ in $(seq 1 150); do curl -fsS "http://127.0.0.1:$PORT/api/auth/csrf" >/dev/null 2>&1 && break; sleep 0.2; done
  check_outbox_worker || die "notices would not be mailed; see above"
  # The demo's measurement sets go in through the real bench upload path, once per database.
  BENCHFOLD_APP_URL="http://127.0.0.1:$PORT" run_tsx scripts/seed-demo-measurements.ts || log "demo measurements were not loaded (see above)"
  log "set-up took $(( $(date +%s) - started )) s; serving http://localhost:$PORT (demo password: bench-demo-2026)"
  [ "${BENCHFOLD_FAKE_SMTP:-}" = 1 ] && warn_mail_not_delivered
  wait "$SERVER_PID"
fi
