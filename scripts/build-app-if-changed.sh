#!/usr/bin/env bash
# Builds the app into dist/seamwright unless the build there was made from the sources as they are now
# (the stamp of scripts/app-build-stamp.mjs). `npm start` runs it; SEAMWRIGHT_REBUILD=1 builds anyway.
# SEAMWRIGHT_ROOT (another tree) and SEAMWRIGHT_BUILD_COMMAND (another build) are for its test.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
cd "${SEAMWRIGHT_ROOT:-$here/..}"
export SEAMWRIGHT_ROOT="$PWD"
out=dist/seamwright
if [ "${SEAMWRIGHT_REBUILD:-0}" != "1" ] && node "$here/app-build-stamp.mjs" check "$out"; then
  echo "The app is built and its sources have not changed since: not building it again."
else
  echo "Building the app…"
  rm -f "$out/.build-stamp"
  if [ -n "${SEAMWRIGHT_BUILD_COMMAND:-}" ]; then bash -c "$SEAMWRIGHT_BUILD_COMMAND"; else npx ng build seamwright --no-progress; fi
  node "$here/app-build-stamp.mjs" write "$out"
fi
