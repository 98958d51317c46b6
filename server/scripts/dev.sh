#!/usr/bin/env bash
# Development: MariaDB, mail and Stripe fakes, migrations and demo data, then the API (watch mode) and Vite side by side.
set -euo pipefail
cd "$(dirname "$0")/../.."
export SMTP_PORT="${SMTP_PORT:-2525}" MAIL_FAKE_HTTP_PORT="${MAIL_FAKE_HTTP_PORT:-2580}"
bash server/scripts/db.sh start
node --import tsx server/scripts/migrate.ts up
node --import tsx server/scripts/migrate.ts seed
node --import tsx server/fakes/run-mail-fake.ts & FAKE=$!
STRIPE_FAKE_PORT="${STRIPE_API_PORT:-12111}" STRIPE_WEBHOOK_URL="http://127.0.0.1:${PORT:-3000}/api/webhooks/stripe" STRIPE_WEBHOOK_SECRET="whsec_cellarpact_local_development" node --import tsx server/fakes/stripe/run.ts & PAYMENTS=$!
DEV_INBOX_URL="http://127.0.0.1:$MAIL_FAKE_HTTP_PORT" APP_URL="http://127.0.0.1:5173" node node_modules/tsx/dist/cli.mjs watch server/main.ts & API=$!
node node_modules/vite/bin/vite.js & WEB=$!
trap 'kill $FAKE $PAYMENTS $API $WEB 2>/dev/null; bash server/scripts/db.sh stop' EXIT INT TERM
wait -n
