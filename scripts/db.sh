#!/usr/bin/env bash
# A private MariaDB instance for Benchfold: own data directory (.data/mariadb), own port and
# socket, bound to 127.0.0.1. Usage: scripts/db.sh start|stop|status|reset <database>|create <database>
# It writes a row-based binary log (server id 1), so scripts/replica.sh can start a replica of it;
# the benchfold user creates triggers, which a binary log allows only with
# log-bin-trust-function-creators.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
load_env

DATADIR="$BENCHFOLD_DATA_DIR/mariadb"
RUNDIR="$BENCHFOLD_DATA_DIR/run"
SOCK="$RUNDIR/mariadb.sock"
PIDFILE="$RUNDIR/mariadb.pid"
LOGFILE="$BENCHFOLD_DATA_DIR/logs/mariadb.log"

client() { mariadb --no-defaults --socket="$SOCK" -uroot "$@"; }
ping_db() { mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1; }

sql_quote() { printf "%s" "$1" | sed "s/'/''/g"; }

ensure_database() {
  local db="$1" pw
  [[ "$db" =~ ^[A-Za-z0-9_]+$ ]] || die "database name '$db' must be letters, digits and _"
  pw="$(sql_quote "$DB_PASSWORD")"
  client <<SQL
CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$pw';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
ALTER USER '$DB_USER'@'localhost' IDENTIFIED BY '$pw';
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$DB_USER'@'localhost';
FLUSH PRIVILEGES;
SQL
}

start() {
  ensure_debian_packages mariadbd:mariadb-server mariadb:mariadb-client
  mkdir -p "$DATADIR" "$RUNDIR" "$(dirname "$LOGFILE")"
  local userflag=()
  [ "$(id -u)" -eq 0 ] && userflag=(--user=root)
  if [ ! -d "$DATADIR/mysql" ]; then
    log "initialising MariaDB data directory in $DATADIR"
    mariadb-install-db --no-defaults "${userflag[@]}" --datadir="$DATADIR" \
      --skip-test-db --skip-name-resolve >"$BENCHFOLD_DATA_DIR/logs/mariadb-install.log" 2>&1 \
      || die "mariadb-install-db failed: see $BENCHFOLD_DATA_DIR/logs/mariadb-install.log"
  fi
  # One started by an older db.sh writes no binary log, which a replica (scripts/replica.sh) needs.
  if ping_db && [ "$(client -N -e 'SELECT @@log_bin' 2>/dev/null)" = 0 ]; then
    log "MariaDB on $DB_PORT was started without a binary log: restarting it with one"
    mariadb-admin --no-defaults --socket="$SOCK" -uroot shutdown
  fi
  if ping_db; then
    log "MariaDB already running on 127.0.0.1:$DB_PORT"
  else
    log "starting MariaDB on 127.0.0.1:$DB_PORT"
    setsid mariadbd --no-defaults "${userflag[@]}" --datadir="$DATADIR" --socket="$SOCK" \
      --port="$DB_PORT" --bind-address=127.0.0.1 --pid-file="$PIDFILE" --log-error="$LOGFILE" \
      --skip-name-resolve --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
      --default-time-zone=+00:00 --max-connections=300 --max-allowed-packet=64M \
      --server-id=1 --log-bin=mariadb-bin --binlog-format=ROW --binlog-expire-logs-seconds=86400 \
      --log-bin-trust-function-creators=1 </dev/null >/dev/null 2>&1 &
    local i
    for i in $(seq 1 150); do
      ping_db && break
      sleep 0.2
    done
    ping_db || die "MariaDB did not start: $(tail -5 "$LOGFILE")"
  fi
  ensure_database "$DB_NAME"
}

stop() {
  if ping_db; then
    log "stopping MariaDB"
    mariadb-admin --no-defaults --socket="$SOCK" -uroot shutdown
  else
    log "MariaDB not running"
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if ping_db; then echo "running on 127.0.0.1:$DB_PORT"; else echo "stopped"; exit 1; fi ;;
  reset)
    db="${2:?database name}"
    [[ "$db" == *test* ]] || die "refusing to reset '$db': only databases whose name contains 'test'"
    ping_db || start
    client -e "DROP DATABASE IF EXISTS \`$db\`;"
    ensure_database "$db" ;;
  # An empty database for the app user (npm run restore's target), left as it is when it exists.
  create) ping_db || start; ensure_database "${2:?database name}" ;;
  *) echo "usage: $0 start|stop|status|reset <test-database>|create <database>" >&2; exit 2 ;;
esac
