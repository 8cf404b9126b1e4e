#!/usr/bin/env bash
# npm run dev: Vite dev server with hot reload, proxying /api and /socket.io to the Express server in watch mode.
set -euo pipefail
source "$(dirname "$0")/lib/setup.sh"

export PGPORT_OUTROLL=${PGPORT_OUTROLL:-54329}
data_dir="$project_root/.data/postgres"
ensure_node_modules
ensure_postgres_package
start_cluster "$data_dir" "$PGPORT_OUTROLL"
trap 'stop_cluster "$data_dir"' EXIT
ensure_database "$PGPORT_OUTROLL" outroll
export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT_OUTROLL/outroll}
export APP_ORIGIN=${APP_ORIGIN:-http://localhost:5173}
npx tsx seed/index.ts
npx concurrently --names server,client --kill-others \
  "tsx watch server/index.ts" "vite --host 127.0.0.1"
