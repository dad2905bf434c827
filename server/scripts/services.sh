#!/usr/bin/env bash
# Starts (up) or stops (down) the services Warpmeter needs, all private to this checkout and bound to 127.0.0.1:
#   MariaDB (data in .data/mariadb), Redis for the job queue (append-only, .data/redis),
#   the fake SMTP server (caught mail readable over HTTP) and the fake payment-provider API.
# Idempotent: a second `up` finds them running. Used by `npm start` and by the test command.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
DATA="$ROOT/.data"
DB_PORT=${WARPMETER_DB_PORT:-3307}
REDIS_PORT=${WARPMETER_REDIS_PORT:-6380}
SMTP_PORT=${WARPMETER_SMTP_PORT:-3025}
MAILBOX_PORT=${WARPMETER_MAILBOX_PORT:-3026}
PAY_PORT=${WARPMETER_PAY_PORT:-3027}
DB_USER=${WARPMETER_DB_USER:-warpmeter}
DB_PASSWORD=${WARPMETER_DB_PASSWORD:-warpmeter-local}
DB_NAME=${WARPMETER_DB_NAME:-warpmeter}
SOCK="$DATA/mariadb/mysqld.sock"
mkdir -p "$DATA/run" "$DATA/logs"
# One caller at a time (parallel test runs share the servers); servers close fd 9 so they never hold it.
exec 9>"$DATA/run/services.lock"
flock 9

alive() { [ -f "$1" ] && kill -0 "$(cat "$1")" 2>/dev/null; }

wait_port() { # host port seconds
  for _ in $(seq 1 $(( $3 * 10 ))); do
    (echo >"/dev/tcp/$1/$2") 2>/dev/null && return 0; sleep 0.1
  done
  echo "warpmeter: nothing answered on $1:$2 after $3 s" >&2; return 1
}

mariadb_up() {
  bash "$ROOT/server/scripts/ensure-debian.sh" /usr/sbin/mariadbd:mariadb-server mariadb-admin:mariadb-client
  if [ ! -d "$DATA/mariadb/mysql" ]; then
    mkdir -p "$DATA/mariadb"
    mariadb-install-db --no-defaults --user=root --datadir="$DATA/mariadb" \
      --auth-root-authentication-method=socket --skip-test-db >"$DATA/logs/mariadb-install.log" 2>&1
  fi
  if ! mariadb-admin --no-defaults --socket="$SOCK" ping >/dev/null 2>&1; then
    # setsid + closed fds: the server must not inherit a caller's lock or terminal.
    setsid /usr/sbin/mariadbd --no-defaults --user=root --datadir="$DATA/mariadb" --socket="$SOCK" \
      --pid-file="$DATA/run/mariadb.pid" --log-error="$DATA/logs/mariadb.err" --port="$DB_PORT" \
      --bind-address=127.0.0.1 --skip-name-resolve --character-set-server=utf8mb4 \
      --collation-server=utf8mb4_unicode_ci --max-allowed-packet=256M --innodb-flush-log-at-trx-commit=2 \
      --max-connections=500 </dev/null >/dev/null 2>&1 9>&- &
    for _ in $(seq 1 300); do
      mariadb-admin --no-defaults --socket="$SOCK" ping >/dev/null 2>&1 && break; sleep 0.1
    done
    mariadb-admin --no-defaults --socket="$SOCK" ping >/dev/null 2>&1 || { echo "warpmeter: MariaDB did not start, see $DATA/logs/mariadb.err" >&2; exit 1; }
  fi
  mariadb --no-defaults --socket="$SOCK" -u root <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON *.* TO '$DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

redis_up() {
  bash "$ROOT/server/scripts/ensure-debian.sh" redis-server:redis-server
  mkdir -p "$DATA/redis"
  if ! alive "$DATA/run/redis.pid"; then
    setsid redis-server --port "$REDIS_PORT" --bind 127.0.0.1 --dir "$DATA/redis" --appendonly yes \
      --save "" --pidfile "$DATA/run/redis.pid" --logfile "$DATA/logs/redis.log" --daemonize no \
      </dev/null >/dev/null 2>&1 9>&- &
    echo $! >"$DATA/run/redis.pid"
    wait_port 127.0.0.1 "$REDIS_PORT" 10
  fi
}

node_service_up() { # name script port
  [ -f "$ROOT/$2" ] || return 0
  if ! alive "$DATA/run/$1.pid"; then
    setsid "$ROOT/node_modules/.bin/tsx" "$ROOT/$2" </dev/null >>"$DATA/logs/$1.log" 2>&1 9>&- &
    echo $! >"$DATA/run/$1.pid"
  fi
  wait_port 127.0.0.1 "$3" 20
}

fakes_up() {
  WARPMETER_SMTP_PORT=$SMTP_PORT WARPMETER_MAILBOX_PORT=$MAILBOX_PORT node_service_up fake-smtp server/fakes/smtp-main.ts "$SMTP_PORT"
  WARPMETER_PAY_PORT=$PAY_PORT node_service_up fake-pay server/fakes/pay-main.ts "$PAY_PORT"
}

stop_pid() { # name
  local f="$DATA/run/$1.pid"
  if alive "$f"; then
    kill "$(cat "$f")" 2>/dev/null || true
    for _ in $(seq 1 50); do alive "$f" || break; sleep 0.1; done
    alive "$f" && kill -9 "$(cat "$f")" 2>/dev/null || true
  fi
  rm -f "$f"
}

down() {
  stop_pid app; stop_pid worker; stop_pid fake-smtp; stop_pid fake-pay; stop_pid redis
  if [ -S "$SOCK" ] && mariadb-admin --no-defaults --socket="$SOCK" ping >/dev/null 2>&1; then
    mariadb-admin --no-defaults --socket="$SOCK" -u root shutdown || true
  fi
}

case "${1:-up}" in
  up) mariadb_up; redis_up; if [ "${WARPMETER_NO_FAKES:-}" != 1 ]; then fakes_up; fi ;;
  db) mariadb_up ;;
  down) down ;;
  *) echo "usage: services.sh up|db|down" >&2; exit 2 ;;
esac
