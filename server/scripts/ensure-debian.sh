#!/usr/bin/env bash
# Installs the named Debian packages when the command each provides is missing.
# Usage: ensure-debian.sh command:package [command:package ...]
# Never starts the packaged system services: the project runs its own private servers.
set -euo pipefail
missing=()
for pair in "$@"; do
  cmd=${pair%%:*}; pkg=${pair#*:}
  case "$cmd" in
    /*) [ -e "$cmd" ] || missing+=("$pkg") ;;              # a file the package installs
    *) command -v "$cmd" >/dev/null 2>&1 || missing+=("$pkg") ;;  # a command on PATH
  esac
done
[ ${#missing[@]} -eq 0 ] && exit 0
echo "warpmeter: installing Debian packages: ${missing[*]}" >&2
SUDO=""; [ "$(id -u)" -ne 0 ] && SUDO="sudo"
# policy-rc.d stops Debian's maintainer scripts from starting mariadb/redis as system services.
if [ ! -e /usr/sbin/policy-rc.d ]; then
  printf '#!/bin/sh\nexit 101\n' | $SUDO tee /usr/sbin/policy-rc.d >/dev/null; $SUDO chmod +x /usr/sbin/policy-rc.d
  trap '$SUDO rm -f /usr/sbin/policy-rc.d' EXIT
fi
$SUDO apt-get update -qq >/dev/null
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
