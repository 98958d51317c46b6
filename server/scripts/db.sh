#!/usr/bin/env bash
# Private MariaDB for Cellarpact: its own data folder, socket and port, bound to 127.0.0.1 only.
# Usage: db.sh start | stop | status
#   start  installs mariadb-server when mariadbd is missing (root only), initialises the data folder,
#          starts the server, waits until it answers, and creates the demo and test databases and user.
#   stop   stops the server by the PID in its own pid file.
set -euo pipefail
cd "$(dirname "$0")/../.."

DIR="${DB_DIR:-$PWD/.data/mariadb}"
PORT="${DB_PORT:-3407}"
USER_NAME="${DB_USER:-cellarpact}"
USER_PASS="${DB_PASSWORD:-cellarpact-local}"
DATABASES="${DB_NAMES:-cellarpact cellarpact_test cellarpact_bench}"
SOCK="$DIR/run/mysqld.sock"
PIDFILE="$DIR/run/mysqld.pid"

ensure_installed() {
  if command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; then return; fi
  if [ "$(id -u)" != "0" ]; then
    echo "mariadbd is missing. Install Debian's MariaDB server first, as root:" >&2
    echo "  sudo apt-get update && sudo apt-get install -y mariadb-server" >&2
    exit 1
  fi
  echo "Installing mariadb-server (Debian package)..."
  apt-get update -q >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -q mariadb-server >/dev/null
}

# A server killed outright can linger a moment as a zombie; that one is not running.
running() {
  [ -f "$PIDFILE" ] || return 1
  local pid; pid="$(cat "$PIDFILE")"
  kill -0 "$pid" 2>/dev/null && [ "$(awk '{print $3}' "/proc/$pid/stat" 2>/dev/null)" != "Z" ]
}

start() {
  ensure_installed
  export PATH="$PATH:/usr/sbin:/usr/bin"
  mkdir -p "$DIR/run"
  if [ ! -d "$DIR/data/mysql" ]; then
    echo "Initialising MariaDB data folder in $DIR/data"
    mariadb-install-db --no-defaults --datadir="$DIR/data" --user="$(id -un)" \
      --auth-root-authentication-method=normal --skip-test-db >"$DIR/run/install.log" 2>&1
  fi
  if ! running; then
    mariadbd --no-defaults --datadir="$DIR/data" --socket="$SOCK" --pid-file="$PIDFILE" --port="$PORT" \
      --bind-address=127.0.0.1 --user="$(id -un)" --skip-name-resolve --log-error="$DIR/run/error.log" \
      --innodb-buffer-pool-size=128M --max-connections=200 >/dev/null 2>&1 &
    for _ in $(seq 1 300); do
      mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1 && break
      sleep 0.1
    done
  fi
  mariadb-admin --no-defaults --socket="$SOCK" -uroot ping >/dev/null 2>&1 || { echo "MariaDB did not start; see $DIR/run/error.log" >&2; exit 1; }
  local sql="CREATE USER IF NOT EXISTS '$USER_NAME'@'127.0.0.1' IDENTIFIED BY '$USER_PASS';"
  for db in $DATABASES; do
    sql+="CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
    sql+="GRANT ALL PRIVILEGES ON \`$db\`.* TO '$USER_NAME'@'127.0.0.1';"
  done
  mariadb --no-defaults --socket="$SOCK" -uroot -e "$sql"
  echo "MariaDB ready on 127.0.0.1:$PORT (pid $(cat "$PIDFILE"))"
}

stop() {
  if running; then
    local pid; pid="$(cat "$PIDFILE")"
    kill -TERM "$pid"
    while kill -0 "$pid" 2>/dev/null; do sleep 0.1; done
    echo "MariaDB stopped"
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if running; then echo "running (pid $(cat "$PIDFILE"))"; else echo "stopped"; exit 1; fi ;;
  *) echo "usage: $0 start|stop|status" >&2; exit 2 ;;
esac
