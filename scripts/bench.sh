#!/usr/bin/env bash
# npm run bench: speed and memory figures, printed as tables (targets are in the README; nothing here asserts).
set -euo pipefail
source "$(dirname "$0")/lib/setup.sh"
ensure_node_modules

log "Probability engine"
npx tsx scripts/bench/engine.ts
