#!/usr/bin/env bash
# npm start: build the front end, then serve it and the API on the real Workers runtime (workerd via wrangler dev)
# at http://127.0.0.1:${PORT:-8787}, with local KV persisted under ${PERSIST_DIR:-.wrangler/state}. Offline: no telemetry, no
# request-metadata fetch, no prompts. `exec` makes wrangler this script's process, so a signal to the process group
# (setsid bash scripts/start.sh & ... kill -TERM -- -$PID) stops workerd too.
set -euo pipefail
cd "$(dirname "$0")/.."
export CLOUDFLARE_CF_FETCH_ENABLED=false WRANGLER_SEND_METRICS=false WRANGLER_HIDE_BANNER=true CI=true
PORT="${PORT:-8787}"
# SKIP_BUILD=1 serves the dist/ already built (test harnesses that start several servers at once build it once).
[ "${SKIP_BUILD:-}" = 1 ] || npx vite build --logLevel warn
# local.env holds the local-only share-id key (a .dev.vars file, when present, is read instead).
exec npx wrangler dev --env-file local.env --ip 127.0.0.1 --port "$PORT" --persist-to "${PERSIST_DIR:-.wrangler/state}" --log-level "${LOG_LEVEL:-info}" \
  --show-interactive-dev-session=false </dev/null
