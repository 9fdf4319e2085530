#!/usr/bin/env bash
# npm run stop: stops the app, the mail sink and the PostgreSQL cluster that npm start started.
source "$(dirname "$0")/common.sh"
stop_pidfile "$RUN_DIR/app.pid" "app"
stop_pidfile "$RUN_DIR/mail-sink.pid" "mail sink"
pg_stop "$DATA_DIR/pg"
