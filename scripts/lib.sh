# shellcheck shell=bash
# Setup steps shared by scripts/start.sh and scripts/test.sh. Every step checks first and does
# nothing when nothing changed, so a warm run skips apt, npm ci and ng build entirely.
# Steps that write shared state run under one flock, so two concurrent runs are safe.

TW_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
TW_DATA="$TW_ROOT/.data"
TW_APT_UPDATED=0
TW_LOCK_FD=""

tw_log() { printf '[setup] %s\n' "$*" >&2; }
tw_die() { printf '[setup] error: %s\n' "$*" >&2; exit 1; }
tw_now_ms() { date +%s%3N; }

# Root can install packages itself; anyone else needs sudo (or the packages already present).
tw_as_root() {
  if [[ $EUID -eq 0 ]]; then "$@";
  elif command -v sudo >/dev/null 2>&1; then sudo "$@";
  else tw_die "need root to run: $* (install the packages yourself or run as root)"; fi
}

# Held from the first setup step until hand-over; released before exec so that no service
# started afterwards inherits the lock file descriptor.
tw_lock_setup() {
  mkdir -p "$TW_DATA/locks"
  exec {TW_LOCK_FD}>"$TW_DATA/locks/setup.lock"
  if ! flock -n "$TW_LOCK_FD"; then
    tw_log "another start/test run is setting up; waiting for it..."
    flock "$TW_LOCK_FD"
  fi
}
tw_unlock_setup() {
  if [[ -n "$TW_LOCK_FD" ]]; then
    flock -u "$TW_LOCK_FD"
    exec {TW_LOCK_FD}>&-
    TW_LOCK_FD=""
  fi
}

# Usage: tw_ensure_packages PACKAGE=PROBE ...  where PROBE is an absolute path or a command name.
# A package counts as present when its probe exists (dpkg -s alone would trust a half-removed
# package); apt runs only when something is missing.
tw_ensure_packages() {
  local missing=() spec pkg probe
  for spec in "$@"; do
    pkg="${spec%%=*}"; probe="${spec#*=}"
    if [[ "$probe" == /* ]]; then [[ -x "$probe" ]] && continue
    else command -v "$probe" >/dev/null 2>&1 && continue; fi
    missing+=("$pkg")
  done
  [[ ${#missing[@]} -eq 0 ]] && return 0
  command -v apt-get >/dev/null 2>&1 || tw_die "missing ${missing[*]} and no apt-get here; install them yourself"
  local t0; t0=$(tw_now_ms)
  if [[ $TW_APT_UPDATED -eq 0 ]]; then
    tw_log "apt-get update (missing: ${missing[*]})"
    tw_as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq || tw_die "apt-get update failed"
    TW_APT_UPDATED=1
  fi
  tw_log "apt-get install ${missing[*]}"
  tw_as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${missing[@]}" \
    || tw_die "apt-get install ${missing[*]} failed"
  for spec in "$@"; do
    probe="${spec#*=}"
    if [[ "$probe" == /* ]]; then [[ -x "$probe" ]] || tw_die "${spec%%=*} installed but $probe is still missing"
    else command -v "$probe" >/dev/null 2>&1 || tw_die "${spec%%=*} installed but '$probe' is still missing"; fi
  done
  tw_log "packages ready in $(( ($(tw_now_ms) - t0) / 1000 )) s"
}

tw_lock_hash() { sha256sum "$TW_ROOT/package-lock.json" | cut -d' ' -f1; }

# npm ci when node_modules is missing or was installed from a different package-lock.json.
# Without our stamp (node_modules installed by hand), npm's own record of the installed tree
# (node_modules/.package-lock.json) is compared with package-lock.json before reinstalling.
tw_ensure_node_modules() {
  local stamp="$TW_ROOT/node_modules/.trenchwork-lock-hash" want
  want=$(tw_lock_hash)
  if [[ -d "$TW_ROOT/node_modules" && -f "$stamp" && "$(cat "$stamp")" == "$want" ]]; then return 0; fi
  if [[ -d "$TW_ROOT/node_modules" && ! -f "$stamp" ]] \
     && node "$TW_ROOT/scripts/node-modules-check.cjs" "$TW_ROOT" >/dev/null 2>&1; then
    printf '%s\n' "$want" > "$stamp"
    return 0
  fi
  local t0; t0=$(tw_now_ms)
  tw_log "npm ci (package-lock.json changed or node_modules missing)"
  (cd "$TW_ROOT" && npm ci --no-audit --no-fund) || tw_die "npm ci failed"
  printf '%s\n' "$want" > "$stamp"
  tw_log "npm ci done in $(( ($(tw_now_ms) - t0) / 1000 )) s"
}

# Content hash of everything the Angular build reads (spec files excluded: the build skips them).
tw_client_hash() {
  (
    cd "$TW_ROOT"
    local inputs=() p
    for p in src shared public angular.json package-lock.json tsconfig*.json; do [[ -e "$p" ]] && inputs+=("$p"); done
    find "${inputs[@]}" -type f ! -name '*.spec.ts' -print0 | LC_ALL=C sort -z | xargs -0 -r sha256sum | sha256sum | cut -d' ' -f1
  )
}

# ng build when the output is missing or any build input changed since the last build.
tw_ensure_client_build() {
  local out="$TW_ROOT/dist/trenchwork" stamp="$TW_ROOT/dist/trenchwork/.trenchwork-build-hash" want
  want=$(tw_client_hash)
  if [[ -f "$out/browser/index.html" && -f "$stamp" && "$(cat "$stamp")" == "$want" ]]; then return 0; fi
  [[ -f "$TW_ROOT/angular.json" ]] || tw_die "angular.json is missing: cannot build the client"
  local t0; t0=$(tw_now_ms)
  tw_log "ng build (client sources changed or no build yet)"
  (cd "$TW_ROOT" && npx ng build) || tw_die "ng build failed"
  [[ -f "$out/browser/index.html" ]] || tw_die "ng build finished but $out/browser/index.html is missing"
  printf '%s\n' "$want" > "$stamp"
  tw_log "ng build done in $(( ($(tw_now_ms) - t0) / 1000 )) s"
}

# The dev stack writes .data/dev/stack.pid: line 1 its pid, line 2 the app URL, line 3 the mailbox URL.
tw_dev_stack_pid() {
  local file="$TW_DATA/dev/stack.pid" pid
  [[ -f "$file" ]] || return 1
  pid=$(sed -n 1p "$file")
  [[ "$pid" =~ ^[0-9]+$ ]] || return 1
  kill -0 "$pid" 2>/dev/null || return 1
  tr '\0' ' ' < "/proc/$pid/cmdline" 2>/dev/null | grep -q 'scripts/stack.ts dev' || return 1
  printf '%s\n' "$pid"
}

tw_print_running_dev_stack() {
  local file="$TW_DATA/dev/stack.pid"
  printf 'Trenchwork is already running (pid %s): %s\n' "$1" "$(sed -n 2p "$file")"
  local mailbox; mailbox=$(sed -n 3p "$file")
  [[ -n "$mailbox" ]] && printf 'Dev mailbox: %s/messages\n' "$mailbox"
  printf 'Stop it with Ctrl-C in its terminal or: kill %s\n' "$1"
}
