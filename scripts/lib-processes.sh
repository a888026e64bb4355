#!/usr/bin/env bash
# Sourced by scripts/lib.sh: builds, locks, and the app and mail catcher the scripts
# start in the background (recorded by pid so a later run can find them).

# build_if_stale [OUTPUT_DIR]: build when there is no build in OUTPUT_DIR (default
# .output) or a source file is newer than it. `npm test` builds into its own folder,
# so it never replaces the files a running `npm start` serves; the shared .nuxt
# folder is guarded by .data/build.lock, so two builds never run at once.
build_if_stale() {
  local out="${1:-$ROOT/.output}"
  local stamp="$out/nitro.json" log_file="$DATA/build-$(basename "$out").log"
  if [ -f "$stamp" ] && [ -z "$(cd "$ROOT" && find app server shared public modules nuxt.config.ts tailwind.config.ts package-lock.json scripts/build-analysis-worker.ts scripts/esbuild-bundle.mjs -newer "$stamp" -type f -print -quit 2>/dev/null)" ]; then
    return 0
  fi
  (
    exec 8>"$DATA/build.lock"
    if ! flock -n 8; then log "Another build in this checkout is running; waiting for it…"; flock -w 1800 8 || die "Waited 30 minutes for another build."; fi
    log "Building the app…"
    (cd "$ROOT" && TONEWRIGHT_OUTPUT_DIR="$out" NODE_ENV=production npx nuxt build >"$log_file" 2>&1) \
      || { tail -n 40 "$log_file" >&2; die "The build failed (full log: $log_file)."; }
  )
}

# ensure_cli_built: the precompiled command-line scripts (`npm run analyze`) in .data/cli,
# rebuilt only when a source changed; the CLI also does this by itself when needed.
ensure_cli_built() {
  (cd "$ROOT" && node scripts/run-built.mjs --build analyze) || die "The command-line build failed."
}

# take_lock FILE MESSAGE: an exclusive lock on FILE held on fd 9 until release_lock
# or the end of the script (the kernel drops it when the script dies, even by kill -9).
# Long-lived children are started with fd 9 closed so that they never hold it.
take_lock() {
  exec 9>"$1"
  if ! flock -n 9; then
    log "$2"
    flock -w 1800 9 || die "Waited 30 minutes for $1; giving up."
  fi
}
release_lock() { flock -u 9 2>/dev/null || true; exec 9>&-; }

# recorded_pid FILE PATTERN: prints the pid kept in FILE when that process is alive,
# runs in this checkout and its command line contains PATTERN (after a kill -9 the
# number may belong to another program by now, which must never be stopped).
recorded_pid() {
  local file="$1" pattern="$2" pid
  [ -s "$file" ] || return 1
  pid=$(cat "$file" 2>/dev/null || true)
  [[ "$pid" =~ ^[0-9]+$ ]] || return 1
  [ -r "/proc/$pid/cmdline" ] || return 1
  tr '\0' ' ' <"/proc/$pid/cmdline" | grep -qF -- "$pattern" || return 1
  [ "$(readlink "/proc/$pid/cwd" 2>/dev/null)" = "$ROOT" ] || return 1
  echo "$pid"
}

# stop_recorded FILE PATTERN: stops the process recorded in FILE (see recorded_pid),
# politely and then, after 10 s, by force; removes FILE either way.
stop_recorded() {
  local file="$1" pattern="$2" pid i
  if pid=$(recorded_pid "$file" "$pattern"); then
    kill "$pid" 2>/dev/null || true
    for i in $(seq 1 40); do kill -0 "$pid" 2>/dev/null || break; sleep 0.25; done
    if kill -0 "$pid" 2>/dev/null; then kill -9 "$pid" 2>/dev/null || true; fi
  fi
  rm -f "$file"
}

# app_start OUTPUT_DIR PORT PID_FILE [LOG]: the built server in the background, its
# pid recorded so that a later start can find it after this script was killed.
app_start() {
  local out="$1" port="$2" pid_file="$3" log_file="${4:-/dev/stdout}"
  (cd "$ROOT" && HOST=127.0.0.1 PORT="$port" NITRO_HOST=127.0.0.1 NITRO_PORT="$port" NODE_ENV=production \
    exec node "$out/server/index.mjs" >>"$log_file" 2>&1 9>&-) &
  APP_PID=$!
  echo "$APP_PID" >"$pid_file"
}

port_busy() { (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null; }

# wait_http URL SECONDS
wait_http() {
  local url="$1" limit="$2" i
  for i in $(seq 1 $((limit * 4))); do
    if node -e 'fetch(process.argv[1]).then(r=>process.exit(r.status<500?0:1),()=>process.exit(1))' "$url" 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  return 1
}

# mail_catcher_start PORT DIR: the local SMTP catcher (scripts/mail-catcher.ts) in the
# background; it writes DIR/catcher.pid. mail_catcher_stop DIR ends that process.
mail_catcher_start() {
  local port="$1" dir="$2"
  mkdir -p "$dir"
  (cd "$ROOT" && exec node --import tsx scripts/mail-catcher.ts --port "$port" --dir "$dir" >>"$dir/catcher.log" 2>&1 9>&-) &
  local i
  for i in $(seq 1 80); do port_busy "$port" && return 0; sleep 0.25; done
  tail -n 20 "$dir/catcher.log" >&2 || true
  die "The mail catcher did not start on 127.0.0.1:$port."
}

# own_helper NAME PID_FILE PATTERN PORT COMMAND...: takes over a helper (mail catcher, S3 fake)
# that an earlier start left running, or runs COMMAND to start it when PORT is free. Answers 0
# when this start now owns the helper, 1 when something else answers on PORT.
own_helper() {
  local name="$1" pid_file="$2" pattern="$3" port="$4"
  shift 4
  if recorded_pid "$pid_file" "$pattern" >/dev/null; then
    log "Taking over the $name left running by an earlier start."
  elif ! port_busy "$port"; then
    "$@"
  else
    return 1
  fi
}

mail_catcher_stop() { stop_recorded "$1/catcher.pid" scripts/mail-catcher.ts; }

# s3_fake_start PORT DIR BUCKETS PID_FILE: the local S3 fake (scripts/s3-fake.ts, s3rver) on
# loopback in the background, objects under DIR/objects, the buckets (comma-separated) made
# at start; it writes PID_FILE. s3_fake_stop PID_FILE ends that process.
s3_fake_start() {
  local port="$1" dir="$2" buckets="$3" pid_file="$4"
  mkdir -p "$dir"
  (cd "$ROOT" && exec node --import tsx scripts/s3-fake.ts --port "$port" --dir "$dir" --bucket "$buckets" --pid-file "$pid_file" >>"$dir/s3-fake.log" 2>&1 9>&-) &
  local i
  for i in $(seq 1 80); do [ -s "$pid_file" ] && port_busy "$port" && return 0; sleep 0.25; done
  tail -n 20 "$dir/s3-fake.log" >&2 || true
  die "The S3 fake did not start on 127.0.0.1:$port."
}

s3_fake_stop() { stop_recorded "$1" scripts/s3-fake.ts; }

# The fake's fixed keys (it accepts any signature made with them).
S3_FAKE_KEY=S3RVER
