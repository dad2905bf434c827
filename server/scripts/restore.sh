#!/usr/bin/env bash
# Restores a dump written by backup.sh into a database (created if missing): restore.sh <file> [database]
# Restore into a new database first, check it, then point WARPMETER_DB_NAME at it.
set -euo pipefail
FILE=${1:?usage: restore.sh <dump.sql.gz> [database]}
DB_NAME=${2:-${WARPMETER_DB_NAME:-warpmeter}}
[ -f "$FILE" ] || { echo "restore: no such file: $FILE" >&2; exit 2; }
export MYSQL_PWD=${WARPMETER_DB_PASSWORD:-warpmeter-local}
conn=(--no-defaults -h "${WARPMETER_DB_HOST:-127.0.0.1}" -P "${WARPMETER_DB_PORT:-3307}" -u "${WARPMETER_DB_USER:-warpmeter}")
mariadb "${conn[@]}" -e "CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci"
gunzip -c "$FILE" | mariadb "${conn[@]}" --default-character-set=utf8mb4 "$DB_NAME"
echo "restored $FILE into $DB_NAME"
