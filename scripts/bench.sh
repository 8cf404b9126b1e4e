#!/usr/bin/env bash
# npm run bench: speed and memory figures, printed as tables (targets are in docs/performance.md; nothing here asserts).
# Benchmarks that need PostgreSQL get a throwaway cluster of their own through BENCH_DATABASE_URL.
set -euo pipefail
source "$(dirname "$0")/lib/setup.sh"
ensure_node_modules
ensure_postgres_package
ensure_nginx

free_port() { node -e "const s=require('net').createServer().listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})"; }
run_dir=$(mktemp -d /tmp/outroll-bench-XXXXXX)
chmod 755 "$run_dir"
pg_port=$(free_port)
trap 'stop_cluster "$run_dir/postgres"; rm -rf "$run_dir"' EXIT
start_cluster "$run_dir/postgres" "$pg_port"
ensure_database "$pg_port" outroll_bench
export BENCH_DATABASE_URL="postgres://postgres@127.0.0.1:$pg_port/outroll_bench"
export BENCH_PG_PORT="$pg_port"
export BENCH_DATA_DIR="$run_dir/data"
mkdir -p "$BENCH_DATA_DIR"

log "Probability engine"
npx tsx scripts/bench/engine.ts

log "A large tree diagram in chromium (two 60-faced dice at two dice each; the time to the next key press while it is worked out)"
export BENCH_TREE_REPORT="$run_dir/tree-report.txt"
: > "$BENCH_TREE_REPORT"
bash "$(dirname "$0")/test.sh" tests/e2e/tree-responsiveness.test.ts > "$run_dir/tree-test.log" 2>&1 || { tail -20 "$run_dir/tree-test.log"; }
cat "$BENCH_TREE_REPORT"

log "Set finder"
npx tsx scripts/bench/set-finder.ts

log "Results exports (100,000 rolls, in a database of their own on the bench cluster)"
node --expose-gc --import tsx scripts/bench/results-export.ts

log "Class run load (300 phones on loopback against the real server and PostgreSQL, then a bare socket.io ceiling)"
npx tsx scripts/bench/class-run-load.ts

log "Account answers (sign-up and password reset for existing and unknown addresses)"
npx tsx scripts/bench/account-timing.ts
log "Roll pad in a phone's browser (first and second visit, throttled and not)"
npx tsx scripts/bench/roll-pad-load.ts
