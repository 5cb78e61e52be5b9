#!/usr/bin/env bash
# The test command: same setup as start, in an isolated environment (own data folder, database and ports), then
# lint, type-check, unit and integration tests on the real services, and the Playwright suite in Debian's Chromium.
# Prints "N passed, N failed" last and exits non-zero on any failure. Cleans up every process it started.
PROFILE=test
NEED_CHROMIUM=1
source "$(dirname "$0")/services.sh"

START=$(date +%s)
trap 'stop_all' EXIT
trap 'exit 130' INT TERM

ensure_system_packages
ensure_node_modules
stop_stale
rm -rf "$DATA_DIR"
start_services

cd "$ROOT"
export NEXT_DIST_DIR=.next-test
REPORTS="$DATA_DIR/reports"
mkdir -p "$REPORTS"
FAILED_STEPS=()
step() { # step NAME COMMAND...: runs a step, records its failure, goes on
  local name=$1
  shift
  log "── $name"
  if ! "$@"; then
    FAILED_STEPS+=("$name")
    log "✗ $name failed"
  fi
}

step migrate node_modules/.bin/tsx scripts/migrate.ts
step seed node_modules/.bin/tsx --conditions=react-server scripts/seed.ts
step lint node_modules/.bin/biome check .
step typecheck node_modules/.bin/tsc --noEmit
step vitest node_modules/.bin/vitest run --config scripts/vitest.config.ts --coverage \
  --reporter=default --reporter=json --outputFile.json="$REPORTS/vitest.json"

build_and_serve() {
  node_modules/.bin/next build >"$DATA_DIR/build.log" 2>&1 || { tail -60 "$DATA_DIR/build.log"; return 1; }
  # Behind nginx as in production, with one app process unless PF_APP_PROCESSES says otherwise: every process warms
  # up on its own, and the browser tests' time limits are set for one.
  PF_APP_PROCESSES=${PF_APP_PROCESSES:-1} PF_API_PROCESSES=${PF_API_PROCESSES:-1} start_app
}
if step build build_and_serve; then :; fi
if [ -f "$DATA_DIR/nginx.pid" ]; then
  step e2e env PLAYWRIGHT_JSON_OUTPUT_NAME="$REPORTS/playwright.json" \
    node_modules/.bin/playwright test --config e2e/playwright.config.ts --reporter=list,json
fi

stop_all
log "test command took $(( $(date +%s) - START ))s"
node scripts/test-summary.mjs "$REPORTS" "${FAILED_STEPS[@]}"
