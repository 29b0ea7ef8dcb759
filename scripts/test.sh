#!/usr/bin/env bash
# The whole test suite: science, the API on the real Workers runtime, Lit elements and end-to-end flows in Chromium.
# Installs what it needs (npm packages, Debian's chromium) and builds the front end first.
set -euo pipefail
cd "$(dirname "$0")/.."
export CLOUDFLARE_CF_FETCH_ENABLED=false WRANGLER_SEND_METRICS=false
bash scripts/ensure-chromium.sh
npx tsc --noEmit -p tsconfig.json   # the whole tree type-checks (strict)
npx vite build --logLevel warn
npx vitest run "$@"
