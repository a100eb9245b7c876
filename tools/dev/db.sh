#!/usr/bin/env bash
# Local MariaDB for Dwellform: a private instance on loopback with its own data
# directory, socket and pid file inside the project (.data/ is git-ignored).
# No system service is touched. Usage: bash tools/dev/db.sh start|stop|status
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
# DB_DATA_DIR lets a second, throw-away instance run beside the main one
# (the health test stops and starts such an instance on its own port).
BASE="${DB_DATA_DIR:-$ROOT/.data/mariadb}"
DATADIR="$BASE/data"
if [ -n "${DB_DATA_DIR:-}" ]; then SOCKET="$BASE/mariadb.sock"; else SOCKET="$ROOT/.data/mariadb.sock"; fi
PIDFILE="$BASE/mariadbd.pid"
LOGFILE="$BASE/mariadbd.err"
PORT="${DB_PORT:-3307}"
DB_NAME="${DB_NAME:-dwellform}"
DB_TEST_NAME="${DB_TEST_NAME:-dwellform_test}"
DB_USER="${DB_USER:-dwellform}"
DB_PASSWORD="${DB_PASSWORD:-dwellform-dev}"

say() { printf 'db: %s\n' "$*"; }

# Run a SQL statement as the instance's root over its private socket.
as_root() { mariadb --no-defaults --protocol=socket --socket="$SOCKET" -uroot "$@"; }

ensure_installed() {
  if command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; then return 0; fi
  local cmd="apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends mariadb-server mariadb-client"
  if [ "$(id -u)" = "0" ]; then
    say "mariadbd not found; installing Debian's mariadb-server"
    sh -c "$cmd"
  else
    say "mariadbd not found. Install it as root with:"
    printf '  sudo sh -c "%s"\n' "$cmd"
    exit 1
  fi
}

mariadbd_bin() { command -v mariadbd 2>/dev/null || echo /usr/sbin/mariadbd; }

running_pid() {
  [ -f "$PIDFILE" ] || return 1
  local pid; pid="$(cat "$PIDFILE" 2>/dev/null || true)"
  [ -n "$pid" ] && kill -0 "$pid" 2>/dev/null || return 1
  # A recycled pid that is not a mariadbd does not count.
  if [ -r "/proc/$pid/comm" ] && ! grep -q 'mariadbd\|mysqld' "/proc/$pid/comm"; then return 1; fi
  echo "$pid"
}

ping_db() { mariadb-admin --no-defaults --protocol=socket --socket="$SOCKET" -uroot ping >/dev/null 2>&1; }

create_databases() {
  local pw_sql="${DB_PASSWORD//\'/\'\'}"
  as_root <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS \`$DB_TEST_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw_sql';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw_sql';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_TEST_NAME\`.* TO '$DB_USER'@'127.0.0.1';
-- the test suite also creates scratch databases named ${DB_TEST_NAME}_<purpose>
GRANT ALL PRIVILEGES ON \`$DB_TEST_NAME%\`.* TO '$DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

start() {
  ensure_installed
  mkdir -p "$BASE"
  if pid="$(running_pid)"; then
    say "already running (pid $pid) on 127.0.0.1:$PORT"
    create_databases
    return 0
  fi
  if [ -f "$PIDFILE" ]; then say "removing stale pid file"; rm -f "$PIDFILE"; fi
  rm -f "$SOCKET"
  if [ ! -d "$DATADIR/mysql" ]; then
    say "initialising data directory $DATADIR"
    mkdir -p "$DATADIR"
    local user_args=()
    [ "$(id -u)" = "0" ] && user_args=(--user=root)
    mariadb-install-db --no-defaults --datadir="$DATADIR" "${user_args[@]}" \
      --auth-root-authentication-method=normal --skip-test-db >"$BASE/install.log" 2>&1 \
      || { say "mariadb-install-db failed; see $BASE/install.log"; tail -n 20 "$BASE/install.log"; exit 1; }
  fi
  local args=(--no-defaults)
  [ "$(id -u)" = "0" ] && args+=(--user=root)
  args+=(--datadir="$DATADIR" --socket="$SOCKET" --port="$PORT" --bind-address=127.0.0.1
    --pid-file="$PIDFILE" --log-error="$LOGFILE" --skip-name-resolve --skip-log-bin
    --max-connections=300 --innodb-buffer-pool-size=128M)
  # setsid: the server must outlive the shell (and npm) that started it.
  setsid "$(mariadbd_bin)" "${args[@]}" </dev/null >/dev/null 2>&1 &
  local i
  for i in $(seq 1 150); do
    if ping_db; then break; fi
    sleep 0.2
  done
  if ! ping_db; then
    say "mariadbd did not answer within 30 s; last lines of $LOGFILE:"
    tail -n 20 "$LOGFILE" 2>/dev/null || true
    exit 1
  fi
  # the pid file may appear a moment after the socket answers
  for i in $(seq 1 50); do [ -s "$PIDFILE" ] && break; sleep 0.1; done
  create_databases
  say "started (pid $(cat "$PIDFILE")) on 127.0.0.1:$PORT, databases $DB_NAME and $DB_TEST_NAME"
}

stop() {
  local pid
  if ! pid="$(running_pid)"; then
    [ -f "$PIDFILE" ] && rm -f "$PIDFILE"
    say "not running"
    return 0
  fi
  kill -TERM "$pid"
  local i
  for i in $(seq 1 300); do
    kill -0 "$pid" 2>/dev/null || break
    sleep 0.1
  done
  if kill -0 "$pid" 2>/dev/null; then say "mariadbd (pid $pid) did not stop within 30 s"; exit 1; fi
  rm -f "$PIDFILE"
  say "stopped"
}

status() {
  local pid
  if pid="$(running_pid)" && ping_db; then
    say "running (pid $pid) on 127.0.0.1:$PORT, data in $DATADIR"
  elif pid="$(running_pid)"; then
    say "process $pid exists but does not answer on $SOCKET"; exit 1
  else
    say "not running"; exit 3
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) status ;;
  *) echo "usage: $0 start|stop|status" >&2; exit 2 ;;
esac
