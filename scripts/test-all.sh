#!/usr/bin/env bash
# Every test: type checks, lint, unit and reference tests (Vitest), and browser tests (Vitest + playwright-core driving
# Debian's chromium). Installs what it needs on a fresh machine: npm packages (if absent) and Debian's chromium.
# Ends with a plain line "N passed, N failed" counting every test run.
set -uo pipefail
cd "$(dirname "$0")/.."

if [ ! -d node_modules ]; then npm ci --no-audit --no-fund || exit 1; fi

if ! command -v chromium >/dev/null 2>&1 && [ ! -x /usr/bin/chromium ]; then
  echo "Installing Debian's chromium for the browser tests…"
  SUDO=""; [ "$(id -u)" -ne 0 ] && SUDO="sudo"
  $SUDO apt-get update -qq && DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq chromium >/dev/null || {
    echo "could not install chromium (apt-get install -y chromium)"; exit 1; }
fi

# Team register: Debian's PostgreSQL 15 for the server tests (a throwaway cluster is started by
# test/server/pg-global-setup.ts on 127.0.0.1:${GLINTMARK_PG_PORT:-55432} and removed afterwards).
if [ ! -x /usr/lib/postgresql/15/bin/initdb ]; then
  echo "Installing Debian's postgresql for the register tests…"
  SUDO=""; [ "$(id -u)" -ne 0 ] && SUDO="sudo"
  $SUDO apt-get update -qq && DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq postgresql >/dev/null || {
    echo "could not install postgresql (apt-get install -y postgresql)"; exit 1; }
fi

mkdir -p test/e2e/artifacts
passed=0; failed=0

count() { # $1 = vitest JSON report
  node -e '
    const r = JSON.parse(require("fs").readFileSync(process.argv[1], "utf8"));
    const broken = r.testResults.filter((t) => t.status === "failed" && t.assertionResults.length === 0).length;
    console.log(`${r.numPassedTests} ${r.numFailedTests + broken}`);
  ' "$1" 2>/dev/null || echo "0 1"
}

echo "== type check"
if npx tsc -p tsconfig.json --noEmit && npx tsc -p src/core/tsconfig.json --noEmit; then
  passed=$((passed + 1)); echo "type check passed"
else
  failed=$((failed + 1)); echo "type check FAILED"
fi

# Lint gate: ESLint (typescript-eslint, React hooks rules, folder import rules) with zero warnings; one step.
echo "== lint"
if npx eslint . --max-warnings 0; then
  passed=$((passed + 1)); echo "lint passed"
else
  failed=$((failed + 1)); echo "lint FAILED"
fi

echo "== unit and reference tests"
npx vitest run --reporter=default --reporter=json --outputFile=test/e2e/artifacts/unit.json
read p f < <(count test/e2e/artifacts/unit.json); passed=$((passed + p)); failed=$((failed + f))

echo "== team register tests (real PostgreSQL)"
npx vitest run --config vitest.server.config.ts --reporter=default --reporter=json --outputFile=test/e2e/artifacts/server.json
read p f < <(count test/e2e/artifacts/server.json); passed=$((passed + p)); failed=$((failed + f))

echo "== browser tests"
npx vitest run --config vitest.e2e.config.ts --reporter=default --reporter=json --outputFile=test/e2e/artifacts/e2e.json
read p f < <(count test/e2e/artifacts/e2e.json); passed=$((passed + p)); failed=$((failed + f))

echo "$passed passed, $failed failed"
[ "$failed" -eq 0 ]
