#!/usr/bin/env bash
# Playwright drives Debian's Chromium: browser downloads are not possible here.
set -euo pipefail
bin="${CHROMIUM_PATH:-/usr/bin/chromium}"
if [ -x "$bin" ]; then
  exit 0
fi
if [ "$(id -u)" = "0" ]; then
  echo "Installing Debian's chromium package for the end-to-end tests…"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq chromium >/dev/null
else
  echo "Chromium is missing. Run as root: apt-get update && apt-get install -y chromium" >&2
  exit 1
fi
