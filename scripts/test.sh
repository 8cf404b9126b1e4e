#!/usr/bin/env bash
# npm test: installs what is missing, brings up a throwaway PostgreSQL cluster, then runs every suite:
# lint (ESLint, Prettier, knip), typecheck, client build, vitest (unit, integration against the real app and database, browser tests in chromium).
# Ends with one line "N passed, N failed" and exits non-zero on any failure.
set -uo pipefail
source "$(dirname "$0")/lib/setup.sh"

ensure_node_modules || exit 1
ensure_postgres_package || exit 1
ensure_chromium || exit 1
ensure_nginx || exit 1

free_port() { node -e "const s=require('net').createServer().listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})"; }

run_dir=$(mktemp -d /tmp/outroll-test-XXXXXX)
chmod 755 "$run_dir"
pg_port=$(free_port)
cleanup() {
  stop_cluster "$run_dir/postgres"
  rm -rf "$run_dir"
}
trap cleanup EXIT

start_cluster "$run_dir/postgres" "$pg_port" || exit 1
ensure_database "$pg_port" outroll_test

export NODE_ENV=test
export DATABASE_URL="postgres://postgres@127.0.0.1:$pg_port/outroll_test"
export TEST_PG_PORT="$pg_port"
export DATA_DIR="$run_dir/data"
# Sign-in limits are shared through PostgreSQL, and every test file signs in from 127.0.0.1 at once.
export SIGN_IN_LIMIT_PER_MINUTE=${SIGN_IN_LIMIT_PER_MINUTE:-100000}
export SCREENSHOT_DIR="$project_root/screenshots"
export CLIENT_DIR="$run_dir/client"
export BETTER_AUTH_SECRET="test-secret-$(node -e "console.log(require('crypto').randomBytes(16).toString('hex'))")"
mkdir -p "$DATA_DIR" "$SCREENSHOT_DIR"

results="$run_dir/steps.txt"
: > "$results"
step() {
  local name=$1; shift
  log "$name"
  if "$@"; then echo "passed $name" >> "$results"; else echo "failed $name" >> "$results"; fi
}

# With arguments (test files or folders) only those run, for quick local loops; the full run takes none.
if [ "$#" -eq 0 ]; then
  step "lint" npm run lint --silent
  step "typecheck" npx tsc --noEmit -p tsconfig.json
fi
if [ "$#" -eq 0 ] || printf '%s\n' "$@" | grep -q e2e; then
  step "client build" env NODE_ENV=production npx vite build --logLevel warn --outDir "$CLIENT_DIR"
fi
step "vitest" npx vitest run --reporter=default --reporter=json --outputFile="$run_dir/vitest.json" "$@"

node scripts/lib/summarize-tests.mjs "$results" "$run_dir/vitest.json"
