#!/usr/bin/env bash
# Installs what is missing, then runs every check and test: lint, typecheck, unit and API tests
# (vitest), Angular component tests, fault tests, and the end-to-end tests in Chromium.
# Ends with one line "Tests: N passed, N failed" and exits non-zero when anything failed.
set -uo pipefail
cd "$(dirname "$0")/.."

if [ ! -d node_modules ] || [ ! -e node_modules/.package-lock.json ]; then
  echo "== installing npm packages"
  npm ci --no-audit --no-fund || exit 1
fi
if [ ! -x /usr/bin/chromium ]; then
  if [ "$(id -u)" = 0 ]; then
    echo "== installing Debian's chromium"
    (apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y chromium) || exit 1
  else
    echo "chromium is missing: run 'sudo apt-get install -y chromium' and try again" >&2
    exit 1
  fi
fi

# The PostgreSQL specs start throwaway clusters (tests/support/pg-cluster.ts, docs/postgresql.md):
# they need the server binaries initdb and pg_ctl.
if ! command -v initdb >/dev/null 2>&1 && ! compgen -G '/usr/lib/postgresql/*/bin/initdb' >/dev/null; then
  if [ "$(id -u)" = 0 ]; then
    echo "== installing Debian's postgresql"
    (apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends postgresql >/dev/null) || exit 1
  else
    echo "initdb is missing: run 'sudo apt-get install -y postgresql' and try again" >&2
    exit 1
  fi
fi

rm -rf test-results && mkdir -p test-results e2e/artifacts
failed_steps=()
step() {
  local name=$1
  shift
  echo
  echo "== $name"
  if ! "$@"; then failed_steps+=("$name"); fi
}

step lint npm run -s lint
step typecheck npm run -s typecheck
step "unit and API tests" npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json
step "app component tests" npx ng test seamwright --watch=false --no-progress
# The editor core's specs run in vitest above; the Angular builder runs the component specs, if any.
if find projects/template-editor/src -name '*.spec.ts' -not -path '*/lib/core/*' | grep -q .; then
  step "editor component tests" npx ng test template-editor --watch=false --no-progress
fi
step "app build" npx ng build seamwright
step "end-to-end tests" env CI=true npx playwright test

echo
node scripts/test-totals.mjs test-results
totals=$?
if [ ${#failed_steps[@]} -gt 0 ]; then
  echo "failed steps: ${failed_steps[*]}" >&2
  exit 1
fi
exit $totals
