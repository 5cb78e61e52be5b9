#!/usr/bin/env bash
# The start command: installs what is missing, starts PostgreSQL, the storage fake and the mail fake on loopback,
# migrates, seeds the demo workspace, builds and serves the app at http://127.0.0.1:3000 (nginx in front of one app
# process per core, see start_app in services.sh). Ctrl-C stops it all.
PROFILE=dev
source "$(dirname "$0")/services.sh"

trap 'echo; log "stopping"; stop_all; exit 0' INT TERM
trap 'stop_all' EXIT

ensure_system_packages
ensure_node_modules
stop_stale
start_services

cd "$ROOT"
log "migrating"
node_modules/.bin/tsx scripts/migrate.ts || die "migration failed"
log "seeding the demo workspace"
node_modules/.bin/tsx --conditions=react-server scripts/seed.ts || die "seed failed"
log "building"
node_modules/.bin/next build >"$DATA_DIR/build.log" 2>&1 || { tail -40 "$DATA_DIR/build.log"; die "build failed"; }

log "serving: ${PF_APP_PROCESSES:-$(nproc)} app processes behind nginx"
start_app

cat <<MSG

  Pulsefence is running.
    app       $APP_URL   (nginx in front of ${PF_APP_PROCESSES:-$(nproc)} app processes; logs in $DATA_DIR)
    health    $APP_URL/api/health
    inbox     $MAIL_INBOX_URL   (every e-mail the app sends lands here)
    storage   $S3_ENDPOINT/$BUCKET
$(node_modules/.bin/tsx --conditions=react-server scripts/seed.ts --print-sign-in 2>/dev/null)

  Ctrl-C stops everything. Data is kept in .data/dev.

MSG
# Runs until Ctrl-C or until a process of the app stops.
wait -n "${PIDS[@]}"
log "a process of the app stopped; see $DATA_DIR/app-*.log and $DATA_DIR/nginx/error.log"
