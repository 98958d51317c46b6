#!/usr/bin/env bash
# One command for the demo: MariaDB, the mail and Stripe fakes, migrations, demo data, the client build, the server.
set -euo pipefail
cd "$(dirname "$0")/../.."

export PORT="${PORT:-3000}"
export SMTP_PORT="${SMTP_PORT:-2525}"
export MAIL_FAKE_HTTP_PORT="${MAIL_FAKE_HTTP_PORT:-2580}"
export DB_NAME="${DB_NAME:-cellarpact}"
export STRIPE_API_PORT="${STRIPE_API_PORT:-12111}"

# Set before anything starts, so Ctrl-C at any moment stops whatever was started so far.
cleanup() {
  trap - EXIT INT TERM
  for pid in "${FAKE:-}" "${PAYMENTS:-}" "${APP:-}"; do
    [ -n "$pid" ] && kill "$pid" 2>/dev/null || true
  done
  wait 2>/dev/null || true
  bash server/scripts/db.sh stop || true
}
trap cleanup EXIT
trap 'cleanup; exit 130' INT
trap 'cleanup; exit 143' TERM

bash server/scripts/db.sh start

mkdir -p .data
# A secret per checkout, kept beside the data, so sessions survive a restart but no secret is committed.
[ -s .data/session-secret ] || node -e 'process.stdout.write(require("crypto").randomBytes(48).toString("base64url"))' > .data/session-secret
export JWT_SECRET="$(cat .data/session-secret)"
# The Stripe fake signs its webhooks with this secret and the app checks them with it.
[ -s .data/stripe-webhook-secret ] || node -e 'process.stdout.write("whsec_" + require("crypto").randomBytes(24).toString("hex"))' > .data/stripe-webhook-secret
export STRIPE_WEBHOOK_SECRET="$(cat .data/stripe-webhook-secret)"

node --import tsx server/scripts/migrate.ts up
node --import tsx server/scripts/migrate.ts seed
node node_modules/vite/bin/vite.js build --logLevel warn

node --import tsx server/fakes/run-mail-fake.ts &
FAKE=$!
STRIPE_FAKE_PORT="$STRIPE_API_PORT" STRIPE_WEBHOOK_URL="http://127.0.0.1:$PORT/api/webhooks/stripe" node --import tsx server/fakes/stripe/run.ts &
PAYMENTS=$!

NODE_ENV=production CLIENT_DIR=dist APP_URL="${APP_URL:-http://127.0.0.1:$PORT}" node --import tsx server/main.ts &
APP=$!
echo "Demo accounts are listed in README.md (password Cellarpact-demo-2026). Mail inbox (this machine only): http://127.0.0.1:$MAIL_FAKE_HTTP_PORT/"
wait "$APP"
