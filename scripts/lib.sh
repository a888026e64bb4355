#!/usr/bin/env bash
# Shared set-up for scripts/start.sh and scripts/test.sh: Debian packages, node
# modules, a project-local PostgreSQL cluster run as an unprivileged user.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA="$ROOT/.data"
mkdir -p "$DATA"

log() { printf '\033[1;33mtonewright\033[0m %s\n' "$*"; }
die() { printf '\033[1;31mtonewright\033[0m %s\n' "$*" >&2; exit 1; }

is_root() { [ "$(id -u)" = 0 ]; }

APT_UPDATED=0
apt_install() {
  is_root || die "Missing Debian packages ($*). Install them with: sudo apt-get install -y $*"
  if [ "$APT_UPDATED" = 0 ]; then
    log "Updating Debian's package lists…"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    APT_UPDATED=1
  fi
  log "Installing $* from Debian's packages…"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

require_node() {
  command -v node >/dev/null || die "Node.js 20 or newer is needed (node was not found)."
  local major; major=$(node -p 'process.versions.node.split(".")[0]')
  [ "$major" -ge 20 ] || die "Node.js 20 or newer is needed (found $(node -v))."
}

# npm ci when node_modules is missing or was installed from another lock file.
ensure_node_modules() {
  local want have=""
  want=$(sha256sum "$ROOT/package-lock.json" | cut -c1-64)
  [ -f "$ROOT/node_modules/.tonewright-lock" ] && have=$(cat "$ROOT/node_modules/.tonewright-lock")
  if [ ! -d "$ROOT/node_modules" ] || [ "$want" != "$have" ]; then
    log "Installing node modules (npm ci)…"
    # The font packages' install step would otherwise start a telemetry process that calls
    # out to the network; only the npm registry is reached from set-up.
    (cd "$ROOT" && IBM_TELEMETRY_DISABLED=true npm ci --no-audit --no-fund --loglevel=error)
    echo "$want" > "$ROOT/node_modules/.tonewright-lock"
  fi
}

pg_bindir() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }

ensure_postgres() {
  local bin; bin=$(pg_bindir)
  if [ -z "$bin" ] || [ ! -x "$bin/postgres" ] || [ ! -x "$bin/initdb" ]; then
    apt_install postgresql
    bin=$(pg_bindir)
  fi
  [ -n "$bin" ] || die "PostgreSQL's server programs were not found after installing them."
  PG_BIN="$bin"
  if is_root; then
    id postgres >/dev/null 2>&1 || useradd --system --user-group --home-dir /var/lib/postgresql --shell /usr/sbin/nologin postgres
    PG_USER=postgres
  else
    PG_USER=$(id -un)
  fi
  export PG_BIN PG_USER
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then apt_install chromium fonts-liberation; fi
}

ensure_poppler() {
  command -v pdftoppm >/dev/null || apt_install poppler-utils
}

# What the engine's accuracy tests render their real-strike fixtures with (at test time,
# into .data/fixtures): timidity + freepats (GPL patches), sox, sonic-pi-samples (CC0).
ensure_fixture_packages() {
  local missing=()
  command -v timidity >/dev/null || missing+=(timidity)
  [ -f /etc/timidity/freepats.cfg ] || missing+=(freepats)
  command -v sox >/dev/null || missing+=(sox libsox-fmt-base)
  [ -d /usr/share/sonic-pi/samples ] || missing+=(sonic-pi-samples)
  if [ "${#missing[@]}" -gt 0 ]; then apt_install "${missing[@]}"; fi
}

# PostgreSQL clusters and roles; builds, locks and the processes the scripts start.
source "$ROOT/scripts/lib-postgres.sh"
source "$ROOT/scripts/lib-processes.sh"
