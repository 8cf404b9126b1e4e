#!/usr/bin/env bash
# npm start: installs what is missing, starts PostgreSQL, builds the client and the server, migrates, seeds and serves
# with the built server (node alone, no tsx). E-mail goes to the local fake mail server unless SMTP_URL is set.
set -euo pipefail
source "$(dirname "$0")/lib/setup.sh"

export PGPORT_OUTROLL=${PGPORT_OUTROLL:-54329}
data_dir=$(cluster_dir_for "$project_root/.data/postgres")
if [ "$data_dir" != "$project_root/.data/postgres" ]; then
  log "The postgres user cannot reach $project_root (a private folder), so the database cluster lives in $data_dir"
fi

ensure_node_modules
ensure_postgres_package
start_cluster "$data_dir" "$PGPORT_OUTROLL"
trap 'log "Stopping PostgreSQL (data kept in $data_dir)"; stop_cluster "$data_dir"' EXIT
ensure_database "$PGPORT_OUTROLL" outroll

export DATABASE_URL=${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT_OUTROLL/outroll}
export NODE_ENV=${NODE_ENV:-production}
# One computer in a classroom: without SMTP_URL, invitations go to the local fake mail server (read at /dev/mail).
if [ -z "${SMTP_URL:-}" ]; then export FAKE_SMTP=${FAKE_SMTP:-1}; fi

log "Building the client and the server"
npx vite build --logLevel warn
npx vite build --config vite.server.config.ts --logLevel warn
log "Applying migrations and demo data"
node dist/server/seed.js
node dist/server/index.js
