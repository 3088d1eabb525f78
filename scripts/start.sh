#!/usr/bin/env bash
# `npm start`: install what is missing, build the client when its sources changed, then run the
# whole development stack (PostgreSQL, S3 fake, SMTP fake, migrations, seed, worker, server)
# in the foreground. Ctrl-C stops all of it. Data stays in .data/dev between runs.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$TW_ROOT"
t0=$(tw_now_ms)

# One dev stack per checkout: a second `npm start` only points at the running one.
if pid=$(tw_dev_stack_pid); then tw_print_running_dev_stack "$pid"; exit 0; fi

tw_lock_setup
packages=(ffmpeg=ffmpeg)
[[ -z "${DATABASE_URL:-}" ]] && packages+=(postgresql=/usr/lib/postgresql/15/bin/initdb)
tw_ensure_packages "${packages[@]}"
tw_ensure_node_modules
tw_ensure_client_build
tw_unlock_setup

# Checked again: another `npm start` may have won the race while this one waited for the lock.
if pid=$(tw_dev_stack_pid); then tw_print_running_dev_stack "$pid"; exit 0; fi

export TW_SETUP_MS=$(( $(tw_now_ms) - t0 ))
exec node --import tsx scripts/stack.ts dev "$@"
