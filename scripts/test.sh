#!/usr/bin/env bash
# The whole test suite: formatting, lint and types first, then the science, the API on the real Workers runtime, Lit
# elements and end-to-end flows in Chromium. Installs what it needs (Debian's chromium) and builds the front end first.
set -euo pipefail
cd "$(dirname "$0")/.."
export CLOUDFLARE_CF_FETCH_ENABLED=false WRANGLER_SEND_METRICS=false
bash scripts/ensure-chromium.sh
npm run --silent lint
npx vite build --logLevel warn
npx vitest run "$@"
