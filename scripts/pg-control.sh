#!/usr/bin/env bash
# pg-control.sh start|stop DIR PORT: used by the health test to take the test
# cluster away and bring it back.
source "$(dirname "$0")/lib.sh"
ensure_postgres
case "${1:-}" in
  start) pg_start "$2" "$3" ;;
  stop) pg_stop "$2" ;;
  *) die "usage: pg-control.sh start|stop DIR PORT" ;;
esac
