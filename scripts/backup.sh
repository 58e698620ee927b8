#!/usr/bin/env bash
# npm run backup [-- --out <folder>] / npm run restore -- <folder> / npm run storage:sweep [-- --dry-run]
# [--grace-hours N]: the settings of npm start (.env, the local MariaDB and fake S3 store when none is
# configured), then scripts/backup.ts, scripts/restore.ts or scripts/storage-sweep.ts. The local database and store must be running (npm start, or db:start).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$BENCHFOLD_ROOT"
ensure_debian_packages mariadb-dump:mariadb-client mariadb:mariadb-client
ensure_node_modules
load_env
FAKE_S3_PID=""
trap '[ -n "$FAKE_S3_PID" ] && kill "$FAKE_S3_PID" 2>/dev/null; true' EXIT
start_fake_s3
if [ "${1:-}" = --restore ]; then
  shift
  node --conditions=react-server "$BENCHFOLD_ROOT/node_modules/tsx/dist/cli.mjs" scripts/restore.ts "$@"
elif [ "${1:-}" = --sweep ]; then
  shift
  node --conditions=react-server "$BENCHFOLD_ROOT/node_modules/tsx/dist/cli.mjs" scripts/storage-sweep.ts "$@"
else
  node --conditions=react-server "$BENCHFOLD_ROOT/node_modules/tsx/dist/cli.mjs" scripts/backup.ts "$@"
fi
