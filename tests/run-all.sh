#!/usr/bin/env bash
# The whole test suite: MariaDB, the client build, unit + API + browser tests, then "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")/.."

# Debian's chromium drives the browser tests; poppler-utils' pdftotext reads the PDFs back.
need=()
command -v chromium >/dev/null 2>&1 || [ -x /usr/bin/chromium ] || need+=(chromium)
command -v pdftotext >/dev/null 2>&1 || need+=(poppler-utils)
if [ ${#need[@]} -gt 0 ]; then
  if [ "$(id -u)" = "0" ]; then
    echo "Installing ${need[*]} for the tests..."
    apt-get update -q >/dev/null && DEBIAN_FRONTEND=noninteractive apt-get install -y -q "${need[@]}" >/dev/null || { echo "installing ${need[*]} failed" >&2; exit 1; }
  else
    echo "Missing ${need[*]}. Install them first, as root:" >&2
    echo "  sudo apt-get update && sudo apt-get install -y ${need[*]}" >&2
    exit 1
  fi
fi

# Leave a database that was already running (e.g. the demo's server) as it was.
bash server/scripts/db.sh status >/dev/null 2>&1 || STARTED_DB=1
bash server/scripts/db.sh start || exit 1
trap '[ -n "${STARTED_DB:-}" ] && bash server/scripts/db.sh stop >/dev/null' EXIT

# Static checks count as tests: type-check and the lint that enforces the import direction.
STATIC_PASSED=0
STATIC_FAILED=0
for check in "node node_modules/typescript/bin/tsc -p tsconfig.json" "node node_modules/eslint/bin/eslint.js --config .eslint.config.js --max-warnings=0 ."; do
  if $check; then STATIC_PASSED=$((STATIC_PASSED + 1)); else STATIC_FAILED=$((STATIC_FAILED + 1)); echo "FAILED: $check"; fi
done

node node_modules/vite/bin/vite.js build --logLevel warn || { echo "$STATIC_PASSED passed, $((STATIC_FAILED + 1)) failed"; exit 1; }

mkdir -p test-results
REPORT=test-results/vitest.json
rm -f "$REPORT"
NO_COLOR=1 node node_modules/vitest/vitest.mjs run --reporter=default --reporter=json --outputFile="$REPORT"
STATUS=$?

# The fault tests (kill -9 of the app and of a private MariaDB; about a minute) count as one more check.
if node --import tsx tests/faults/run.ts; then STATIC_PASSED=$((STATIC_PASSED + 1)); else STATIC_FAILED=$((STATIC_FAILED + 1)); echo "FAILED: npm run test:faults"; fi
if [ -f "$REPORT" ]; then
  # A run that failed without a failing test (a broken global setup, no test files) still counts as one failure.
  node -e 'const r=require("./'"$REPORT"'");const broken='"$STATUS"'!==0&&r.numFailedTests===0?1:0;console.log(`${r.numPassedTests + '"$STATIC_PASSED"'} passed, ${r.numFailedTests + broken + '"$STATIC_FAILED"'} failed`)'
else
  echo "$STATIC_PASSED passed, $((STATIC_FAILED + 1)) failed"
  STATUS=1
fi
[ "$STATIC_FAILED" -gt 0 ] && STATUS=1
exit $STATUS
