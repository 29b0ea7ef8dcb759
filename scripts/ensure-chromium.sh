#!/usr/bin/env bash
# Browser tests drive Debian's chromium (playwright-core downloads no browser). Install it when missing.
set -euo pipefail
if [ -x /usr/bin/chromium ]; then exit 0; fi
echo "Installing Debian's chromium for the browser tests..."
if [ "$(id -u)" = 0 ]; then SUDO=""; else SUDO="sudo"; fi
$SUDO apt-get update -qq
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq chromium >/dev/null
