#!/usr/bin/env bash
# `npm start`: installs what is missing, builds the app when its sources changed since the last build,
# starts the local fake mail and payment servers and the Seamwright server (which migrates the database
# and seeds the demo data when it is empty), and serves everything at http://localhost:4200.
# Ports (README "Ports"): PORT (4200), SMTP_PORT (1025), FAKE_MAIL_HTTP_PORT (1080), FAKE_STRIPE_PORT (12111).
set -euo pipefail
cd "$(dirname "$0")/.."

export PORT="${PORT:-4200}"
export HOST="${HOST:-127.0.0.1}"
export SEAMWRIGHT_DATA_DIR="${SEAMWRIGHT_DATA_DIR:-./data}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}"
export SMTP_PORT="${SMTP_PORT:-1025}"
export FAKE_SMTP_PORT="${FAKE_SMTP_PORT:-$SMTP_PORT}"
export FAKE_MAIL_HTTP_PORT="${FAKE_MAIL_HTTP_PORT:-1080}"
export MAIL_INBOX_URL="${MAIL_INBOX_URL:-http://127.0.0.1:$FAKE_MAIL_HTTP_PORT}"
export PUBLIC_URL="${PUBLIC_URL:-http://localhost:$PORT}"
export SEAMWRIGHT_SEED_DEMO=1
export NODE_ENV="${NODE_ENV:-development}"

if [ ! -d node_modules ] || [ ! -e node_modules/.package-lock.json ]; then
  echo "Installing npm packages (the first time takes a few minutes: better-sqlite3 compiles)…"
  npm ci --no-audit --no-fund
fi

# Builds only when the app's sources changed since the last build (SEAMWRIGHT_REBUILD=1 builds anyway).
bash scripts/build-app-if-changed.sh

echo "Starting the local fake mail server (SMTP $FAKE_SMTP_PORT, inbox $MAIL_INBOX_URL)…"
node --import tsx server/dev/fake-mail-server.ts &
mail_pid=$!
# The shop pays through a local fake payment provider unless real keys are in the environment.
if [ -z "${STRIPE_SECRET_KEY:-}" ]; then export STRIPE_SECRET_KEY=sk_test_seamwright_local STRIPE_WEBHOOK_SECRET=whsec_seamwright_local STRIPE_API_BASE="http://127.0.0.1:${FAKE_STRIPE_PORT:-12111}" FAKE_STRIPE_WEBHOOK_URL="http://127.0.0.1:$PORT/api/shop/webhook"; node --import tsx server/dev/fake-stripe-server.ts & stripe_pid=$!; fi
trap 'kill $mail_pid ${stripe_pid:-} 2>/dev/null || true' EXIT INT TERM

echo
echo "  Seamwright: $PUBLIC_URL"
echo "  Demo sign-in (studio \"Fernbrook Patterns\"):"
# The accounts come from the seed's own list (server/db/demo-accounts.ts), so this cannot drift from the database.
node --import tsx -e "import('./server/db/demo-accounts.ts').then((m) => { for (const a of m.DEMO_ACCOUNTS) console.log('    ' + a.role.padEnd(9) + ' ' + a.email + ' / ' + a.password); })"
echo "  Mail sent by the app: $MAIL_INBOX_URL"
echo
node --import tsx server/main.ts
