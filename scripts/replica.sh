#!/usr/bin/env bash
# A local MariaDB read replica of the private primary (scripts/db.sh), for the replica test and to
# try DB_REPLICA_HOSTS on one machine; npm start never needs it. GTID replication of one database:
#
#   scripts/replica.sh start [database]   fresh data directory (.data/replica), a consistent dump of
#                                         the database from the primary (--single-transaction, with
#                                         its GTID), then CHANGE MASTER TO … MASTER_USE_GTID=slave_pos;
#                                         read_only, only that database replicated
#   scripts/replica.sh stop | status
#   scripts/replica.sh sql "<statement>"  as root on the replica (the test stops and starts its SQL thread)
#
# Port REPLICA_DB_PORT (default DB_PORT + 10). The app's user may only read on it (SELECT on the
# database, SLAVE MONITOR for the lag probe of lib/server/db/public-reads.ts).
set -euo pipefail
source "$(dirname "$0")/lib.sh"
load_env

REPLICA_DB_PORT="${REPLICA_DB_PORT:-$((DB_PORT + 10))}"
PRIMARY_SOCK="$BENCHFOLD_DATA_DIR/run/mariadb.sock"
DATADIR="$BENCHFOLD_DATA_DIR/replica"
TEMPLATE="$BENCHFOLD_DATA_DIR/replica-template"
SOCK="$BENCHFOLD_DATA_DIR/run/replica.sock"
PIDFILE="$BENCHFOLD_DATA_DIR/run/replica.pid"
LOGFILE="$BENCHFOLD_DATA_DIR/logs/replica.log"
REPL_USER=benchfold_repl
REPL_PASSWORD="${REPLICA_REPL_PASSWORD:-benchfold-repl-local-only}"

primary() { mariadb --no-defaults --socket="$PRIMARY_SOCK" -uroot "$@"; }
replica() { mariadb --no-defaults --socket="$SOCK" -uroot "$@"; }
ping_replica() { mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1; }
sql_quote() { printf "%s" "$1" | sed "s/'/''/g"; }

stop() {
  if ping_replica; then mariadb-admin --no-defaults --socket="$SOCK" -uroot shutdown; log "replica stopped"; fi
  true
}

start() {
  local db="${1:-$DB_NAME}" began pw
  began=$(date +%s%N)
  [[ "$db" =~ ^[A-Za-z0-9_]+$ ]] || die "database name '$db' must be letters, digits and _"
  uses_external_database && die "the replica script copies the local primary; DB_HOST is $DB_HOST"
  [ "$(primary -N -e 'SELECT @@log_bin' 2>/dev/null)" = 1 ] \
    || die "the primary on $DB_PORT is not running or writes no binary log: restart it (bash scripts/db.sh stop; bash scripts/db.sh start)"
  pw="$(sql_quote "$DB_PASSWORD")"
  stop
  rm -rf "$DATADIR"; mkdir -p "$(dirname "$SOCK")" "$(dirname "$LOGFILE")"
  local userflag=()
  [ "$(id -u)" -eq 0 ] && userflag=(--user=root)
  # The empty system tables are made once (.data/replica-template) and copied: a fresh replica each time, quickly.
  if [ ! -d "$TEMPLATE/mysql" ]; then
    rm -rf "$TEMPLATE"
    mariadb-install-db --no-defaults "${userflag[@]}" --datadir="$TEMPLATE" --skip-test-db --skip-name-resolve \
      >"$BENCHFOLD_DATA_DIR/logs/replica-install.log" 2>&1 || { rm -rf "$TEMPLATE"; die "mariadb-install-db failed (see logs/replica-install.log)"; }
  fi
  cp -a "$TEMPLATE" "$DATADIR"
  setsid mariadbd --no-defaults "${userflag[@]}" --datadir="$DATADIR" --socket="$SOCK" --port="$REPLICA_DB_PORT" \
    --bind-address=127.0.0.1 --pid-file="$PIDFILE" --log-error="$LOGFILE" --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci --default-time-zone=+00:00 \
    --max-connections=200 --max-allowed-packet=64M --server-id=2 --read-only=1 --skip-slave-start \
    --relay-log=replica-relay --replicate-wild-do-table="$db.%" --innodb-buffer-pool-size=64M </dev/null >/dev/null 2>&1 &
  local i
  for i in $(seq 1 150); do ping_replica && break; sleep 0.1; done
  ping_replica || die "the replica did not start: $(tail -5 "$LOGFILE")"

  primary <<SQL
CREATE USER IF NOT EXISTS '$REPL_USER'@'127.0.0.1' IDENTIFIED BY '$(sql_quote "$REPL_PASSWORD")';
GRANT REPLICATION SLAVE ON *.* TO '$REPL_USER'@'127.0.0.1';
SQL
  replica <<SQL
CREATE DATABASE \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
CREATE USER '$DB_USER'@'localhost' IDENTIFIED BY '$pw';
GRANT SELECT, SHOW VIEW ON \`$db\`.* TO '$DB_USER'@'127.0.0.1', '$DB_USER'@'localhost';
GRANT SLAVE MONITOR ON *.* TO '$DB_USER'@'127.0.0.1', '$DB_USER'@'localhost';
SQL
  # One consistent snapshot and the GTID it stands at (--master-data=1 --gtid writes SET GLOBAL gtid_slave_pos).
  mariadb-dump --no-defaults --socket="$PRIMARY_SOCK" -uroot --single-transaction --master-data=1 --gtid \
    --triggers --routines --hex-blob "$db" | replica "$db" || die "copying $db to the replica failed"
  replica <<SQL
CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=$DB_PORT, MASTER_USER='$REPL_USER',
  MASTER_PASSWORD='$(sql_quote "$REPL_PASSWORD")', MASTER_USE_GTID=slave_pos, MASTER_CONNECT_RETRY=1;
START SLAVE;
SQL
  for i in $(seq 1 100); do
    [ "$(replica -N -e "SELECT COUNT(*) FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'SLAVE_RUNNING' AND VARIABLE_VALUE = 'ON'")" = 1 ] && break
    sleep 0.1
  done
  replica -e 'SHOW SLAVE STATUS\G' | grep -qE 'Slave_SQL_Running: Yes' || die "replication did not start: $(replica -e 'SHOW SLAVE STATUS\G' | grep -E 'Last_(IO|SQL)_Error')"
  log "replica of $db on 127.0.0.1:$REPLICA_DB_PORT (GTID $(replica -N -e 'SELECT @@gtid_slave_pos')), ready in $(( ($(date +%s%N) - began) / 1000000 )) ms"
}

case "${1:-}" in
  start) start "${2:-}" ;;
  stop) stop ;;
  status) if ping_replica; then replica -e 'SHOW SLAVE STATUS\G' | grep -E 'Running|Seconds_Behind|Last_.*Error:'; else echo "stopped"; exit 1; fi ;;
  sql) replica -e "${2:?statement}" ;;
  *) echo "usage: $0 start [database] | stop | status | sql <statement>" >&2; exit 2 ;;
esac
