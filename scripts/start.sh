#!/usr/bin/env bash
# npm start: installs what is missing, starts PostgreSQL and the fake mail server, migrates, seeds, builds and serves.
set -euo pipefail
source "$(dirname "$0")/lib/setup.sh"

export PGPORT_OUTROLL=${PGPORT_OUTROLL:-54329}
data_dir="$project_root/.data/postgres"

ensure_node_modules
ensure_postgres_package
start_cluster "$data_dir" "$PGPORT_OUTROLL"
trap 'log "Stopping PostgreSQL (data kept in .data/)"; stop_cluster "$data_dir"' EXIT
ensure_database "$PGPORT_OUTROLL" outroll

export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT_OUTROLL/outroll}
export NODE_ENV=${NODE_ENV:-production}

log "Applying migrations and demo data"
npx tsx seed/index.ts
log "Building the client"
npx vite build --logLevel warn
node --import tsx server/index.ts
