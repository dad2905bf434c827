#!/usr/bin/env bash
# Writes a consistent, compressed dump of Warpmeter's database: backup.sh [out-file]
# --single-transaction gives a consistent InnoDB snapshot without locking writers;
# --triggers keeps the sign-off table's write-protection triggers; --routines for completeness.
set -euo pipefail
DB_NAME=${WARPMETER_DB_NAME:-warpmeter}
OUT=${1:-".data/backups/${DB_NAME}-$(date -u +%Y%m%dT%H%M%SZ).sql.gz"}
mkdir -p "$(dirname "$OUT")"
MYSQL_PWD=${WARPMETER_DB_PASSWORD:-warpmeter-local} mariadb-dump --no-defaults \
  -h "${WARPMETER_DB_HOST:-127.0.0.1}" -P "${WARPMETER_DB_PORT:-3307}" -u "${WARPMETER_DB_USER:-warpmeter}" \
  --single-transaction --quick --triggers --routines --hex-blob --default-character-set=utf8mb4 \
  "$DB_NAME" | gzip -c >"$OUT.partial"
mv "$OUT.partial" "$OUT"   # never leave a half-written file under the final name
echo "$OUT"
