# Shared shell helpers for Benchfold's scripts. Source it; do not run it.
# Everything here is idempotent: it checks before it installs or starts.

BENCHFOLD_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export BENCHFOLD_ROOT

log() { printf '\033[2m[benchfold]\033[0m %s\n' "$*" >&2; }
die() { printf '[benchfold] error: %s\n' "$*" >&2; exit 1; }

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; elif command -v sudo >/dev/null 2>&1; then sudo "$@"; else
    die "need root (or sudo) to run: $*"
  fi
}

APT_UPDATED=0
# ensure_debian_packages <command-or-path>:<package> ... — installs a package when its command is missing.
ensure_debian_packages() {
  local missing=() spec cmd pkg
  for spec in "$@"; do
    cmd="${spec%%:*}"; pkg="${spec##*:}"
    if [[ "$cmd" == /* ]]; then [ -e "$cmd" ] || missing+=("$pkg")
    else command -v "$cmd" >/dev/null 2>&1 || missing+=("$pkg"); fi
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  command -v apt-get >/dev/null 2>&1 || die "missing ${missing[*]} and no apt-get to install them"
  if [ "$APT_UPDATED" -eq 0 ]; then
    log "apt-get update"
    as_root env DEBIAN_FRONTEND=noninteractive apt-get update -q >/dev/null || die "apt-get update failed"
    APT_UPDATED=1
  fi
  log "installing Debian packages: ${missing[*]}"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends "${missing[@]}" >/dev/null \
    || die "apt-get install ${missing[*]} failed"
}

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  local stamp="$BENCHFOLD_ROOT/node_modules/.package-lock.json"
  if [ ! -f "$stamp" ] || [ "$BENCHFOLD_ROOT/package-lock.json" -nt "$stamp" ]; then
    log "installing npm packages (npm ci)"
    (cd "$BENCHFOLD_ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed"
  fi
}

# Loads .env (if present) without overriding variables already set, then fills defaults.
load_env() {
  if [ -f "$BENCHFOLD_ROOT/.env" ]; then
    while IFS='=' read -r key value; do
      [[ -z "$key" || "$key" == \#* ]] && continue
      [ -z "${!key+x}" ] && export "$key=$value"
    done < "$BENCHFOLD_ROOT/.env"
  fi
  export DB_HOST="${DB_HOST:-127.0.0.1}"
  export DB_PORT="${DB_PORT:-3407}"
  export DB_NAME="${DB_NAME:-benchfold}"
  export DB_USER="${DB_USER:-benchfold}"
  export DB_PASSWORD="${DB_PASSWORD:-benchfold-local-only}"
  export BENCHFOLD_DATA_DIR="${BENCHFOLD_DATA_DIR:-$BENCHFOLD_ROOT/.data}"
  export PORT="${PORT:-3000}"
  export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:$PORT}"
  # @aws-sdk/client-s3 is pinned at a release that runs on Node 20 (TOOLCHAIN.md); its notice that later releases want Node 22 is known.
  export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED="${AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED:-true}"
}

# next-auth's signing secret: NEXTAUTH_SECRET when configured, else the one made once in the
# database (scripts/instance-secret.ts), so every instance on it honours the others' sessions.
# Call after the migrations (the table is theirs).
ensure_shared_secret() {
  [ -n "${NEXTAUTH_SECRET:-}" ] && return 0
  NEXTAUTH_SECRET="$(run_tsx "$BENCHFOLD_ROOT/scripts/instance-secret.ts")" || die "could not read the shared secret from the database"
  export NEXTAUTH_SECRET
}

# True when the database is not this machine's own (DB_HOST elsewhere, or BENCHFOLD_EXTERNAL_DB=1):
# the scripts then neither start nor initialise MariaDB, and use the one configured.
uses_external_database() {
  [ "${BENCHFOLD_EXTERNAL_DB:-}" = 1 ] && return 0
  case "$DB_HOST" in 127.0.0.1|localhost|::1) return 1 ;; *) return 0 ;; esac
}

# Starts the fake SMTP server (and its HTTP read-out) in the background unless one answers already.
# Sets FAKE_SMTP_PID when it started one.
start_fake_smtp() {
  export SMTP_HOST="${SMTP_HOST:-127.0.0.1}"
  export SMTP_PORT="${SMTP_PORT:-2525}"
  export BENCHFOLD_MAILBOX_PORT="${BENCHFOLD_MAILBOX_PORT:-2580}"
  export BENCHFOLD_MAILBOX_URL="http://127.0.0.1:$BENCHFOLD_MAILBOX_PORT"
  export BENCHFOLD_FAKE_SMTP=1
  FAKE_SMTP_PID=""
  if curl -fsS "$BENCHFOLD_MAILBOX_URL/health" >/dev/null 2>&1; then
    log "fake SMTP already answering on $SMTP_PORT"
    # A fault test may have left its SMTP port closed (DELETE /smtp): open it again.
    curl -fsS -X PUT "$BENCHFOLD_MAILBOX_URL/smtp" >/dev/null 2>&1 || true
    return 0
  fi
  mkdir -p "$BENCHFOLD_DATA_DIR/logs"
  node "$BENCHFOLD_ROOT/node_modules/tsx/dist/cli.mjs" "$BENCHFOLD_ROOT/scripts/fake-smtp.ts" \
    >"$BENCHFOLD_DATA_DIR/logs/fake-smtp-$SMTP_PORT.log" 2>&1 &
  FAKE_SMTP_PID=$!
  local i
  for i in $(seq 1 100); do
    curl -fsS "$BENCHFOLD_MAILBOX_URL/health" >/dev/null 2>&1 && { log "fake SMTP on 127.0.0.1:$SMTP_PORT"; return 0; }
    kill -0 "$FAKE_SMTP_PID" 2>/dev/null || die "fake SMTP did not start: $(tail -5 "$BENCHFOLD_DATA_DIR/logs/fake-smtp-$SMTP_PORT.log")"
    sleep 0.1
  done
  die "fake SMTP did not answer in 10 s"
}

# Files: a configured S3 bucket (S3_BUCKET, S3_ENDPOINT, ...) or, when none is, the local fake store
# (scripts/fake-s3.ts: s3rver on 127.0.0.1:$BENCHFOLD_FAKE_S3_PORT, objects in .data/s3-<port>/), with
# the settings exported so the app, the worker and the migrations use it through the same S3 driver.
# `start_fake_s3 --empty` starts an empty store (tests). Sets FAKE_S3_PID when it started one.
start_fake_s3() {
  FAKE_S3_PID=""
  if [ -n "${S3_BUCKET:-}" ] && [ "${BENCHFOLD_FAKE_S3:-}" != 1 ]; then log "files in bucket $S3_BUCKET${S3_ENDPOINT:+ at $S3_ENDPOINT}"; return 0; fi
  export BENCHFOLD_FAKE_S3=1
  export BENCHFOLD_FAKE_S3_PORT="${BENCHFOLD_FAKE_S3_PORT:-4566}"
  export BENCHFOLD_FAKE_S3_DIR="${BENCHFOLD_FAKE_S3_DIR:-$BENCHFOLD_DATA_DIR/s3-$BENCHFOLD_FAKE_S3_PORT}"
  export S3_BUCKET="${S3_BUCKET:-benchfold-local}"
  export S3_ENDPOINT="http://127.0.0.1:$BENCHFOLD_FAKE_S3_PORT"
  export S3_REGION="${S3_REGION:-us-east-1}"
  # The fake's fixed account (s3rver's documented default credentials).
  export S3_ACCESS_KEY_ID=S3RVER S3_SECRET_ACCESS_KEY=S3RVER
  local health="$S3_ENDPOINT/_fake/health"
  if curl -fsS "$health" >/dev/null 2>&1; then
    log "fake S3 already answering on $BENCHFOLD_FAKE_S3_PORT${1:+ (not emptied: another run may be using it)}"
    # A fault test may have left it refusing requests: back to normal.
    curl -fsS -X PUT -d '{}' "$S3_ENDPOINT/_fake/faults" >/dev/null 2>&1 || true
    return 0
  fi
  mkdir -p "$BENCHFOLD_DATA_DIR/logs"
  node "$BENCHFOLD_ROOT/node_modules/tsx/dist/cli.mjs" "$BENCHFOLD_ROOT/scripts/fake-s3.ts" "$@" \
    >"$BENCHFOLD_DATA_DIR/logs/fake-s3-$BENCHFOLD_FAKE_S3_PORT.log" 2>&1 &
  FAKE_S3_PID=$!
  local i
  for i in $(seq 1 150); do
    curl -fsS "$health" >/dev/null 2>&1 && { log "fake S3 store on $S3_ENDPOINT, bucket $S3_BUCKET (files in ${BENCHFOLD_FAKE_S3_DIR#"$BENCHFOLD_ROOT/"})"; return 0; }
    kill -0 "$FAKE_S3_PID" 2>/dev/null || die "fake S3 did not start: $(tail -5 "$BENCHFOLD_DATA_DIR/logs/fake-s3-$BENCHFOLD_FAKE_S3_PORT.log")"
    sleep 0.1
  done
  die "fake S3 did not answer in 15 s"
}

# Starts the outbox worker (scripts/outbox-worker.ts: mails the queued review and release notices)
# in the background, after the SMTP settings are exported, with its log in .data/logs/<name>.log.
# Sets OUTBOX_WORKER_PID. The caller stops it with SIGTERM (it finishes the mail in flight).
start_outbox_worker() {
  local name="${1:-outbox-worker}"
  mkdir -p "$BENCHFOLD_DATA_DIR/logs"
  # react-server: lib/server's `server-only` guard is the empty module it is in the app's server bundles.
  (cd "$BENCHFOLD_ROOT" && exec node --conditions=react-server --import tsx scripts/outbox-worker.ts) \
    >>"$BENCHFOLD_DATA_DIR/logs/$name.log" 2>&1 &
  OUTBOX_WORKER_PID=$!
  OUTBOX_WORKER_LOG="$BENCHFOLD_DATA_DIR/logs/$name.log"
}

# Waits (up to 60 s) for the worker started above to say it is draining; returns 1, with its log's
# tail, when it stopped instead. Called once the app server answers, so the two start side by side.
check_outbox_worker() {
  local i
  for i in $(seq 1 300); do
    if grep -qF "outbox-worker[$OUTBOX_WORKER_PID] draining lane" "$OUTBOX_WORKER_LOG" 2>/dev/null; then
      log "outbox worker running (pid $OUTBOX_WORKER_PID, log ${OUTBOX_WORKER_LOG#"$BENCHFOLD_ROOT/"})"
      return 0
    fi
    kill -0 "$OUTBOX_WORKER_PID" 2>/dev/null || break
    sleep 0.2
  done
  tail -20 "$OUTBOX_WORKER_LOG" >&2
  log "the outbox worker did not start (log: $OUTBOX_WORKER_LOG)"
  return 1
}

# Said when the fake SMTP server is in use, so nobody mistakes it for a working mail set-up.
warn_mail_not_delivered() {
  log "MAIL IS NOT BEING DELIVERED: no SMTP_HOST is set, so invitations and password-reset links are caught"
  log "by the local fake SMTP server. Read them at http://localhost:$PORT/dev/mailbox (only from this machine:"
  log "the page answers 404 to any other address or through a proxy). Set SMTP_HOST in .env to deliver mail."
}

run_tsx() { node "$BENCHFOLD_ROOT/node_modules/tsx/dist/cli.mjs" "$@"; }
