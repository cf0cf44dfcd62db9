#!/usr/bin/env bash
# `npm test`: type-check, lint (eslint.config.js), build the web app (the browser tests load
# it), then every test — pure library tests, API tests against a throwaway PostgreSQL cluster
# that the test setup starts and always removes, and browser tests in Debian's Chromium.
# Prints the closing line "N passed, N failed" and exits non-zero on any failure.
set -uo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
export AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED=true
mkdir -p test-results
rm -f test-results/vitest.json

rc=0
steps_failed=0 # type-check, lint and build: each one that fails counts as one failure
step_failed() { rc=1; steps_failed=$((steps_failed + 1)); }
echo "== type-check"
npx tsc --noEmit -p tsconfig.json || step_failed
echo "== lint (import boundaries, no cycles)"
npm run --silent lint || step_failed
echo "== web build"
npx vite build --logLevel warn || step_failed
echo "== tests"
npx vitest run --reporter=default --reporter=json --outputFile.json=test-results/vitest.json "$@" || rc=1

node -e "
const fs = require('fs');
let passed = 0, failed = 0;
try {
  const r = JSON.parse(fs.readFileSync('test-results/vitest.json', 'utf8'));
  passed = r.numPassedTests; failed = r.numFailedTests + (r.numTotalTestSuites && r.success === false && r.numFailedTests === 0 ? 1 : 0);
} catch { failed = 1 }
failed += $steps_failed;
if ($rc !== 0 && failed === 0) failed = 1;
console.log(passed + ' passed, ' + failed + ' failed');
"
exit $rc
