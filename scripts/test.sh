#!/usr/bin/env bash
# `npm test [-- jest args]`: same setup as `npm start` plus Chromium for the end-to-end tests and
# an up-to-date client build, then one jest run against throwaway services on free ports
# (.data/test-runs/<id>/, deleted afterwards). Never touches the dev stack or its data.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$TW_ROOT"
t0=$(tw_now_ms)

tw_lock_setup
tw_ensure_packages ffmpeg=ffmpeg postgresql=/usr/lib/postgresql/15/bin/initdb chromium=/usr/lib/chromium/chromium
tw_ensure_node_modules
tw_ensure_client_build
tw_unlock_setup

export TW_SETUP_MS=$(( $(tw_now_ms) - t0 ))
exec node --import tsx scripts/stack.ts test "$@"
