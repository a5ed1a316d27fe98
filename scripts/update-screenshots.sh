#!/usr/bin/env bash
# Refresh the README's screenshots from the whole-workflow browser test (demo data, emulated phone).
set -euo pipefail
cd "$(dirname "$0")/.."
npx vitest run --config vitest.e2e.config.ts test/e2e/workflow.e2e.ts
a=test/e2e/artifacts; d=docs/screenshots
cp "$a/workflow-04-plan-aimed.png" "$d/plan.png"
cp "$a/workflow-03-passes.png" "$d/passes.png"
cp "$a/workflow-05-align-within.png" "$d/align.png"
cp "$a/workflow-02-site.png" "$d/logbook-site.png"
cp "$a/workflow-06-installation-form.png" "$d/installation.png"
cp "$a/workflow-09-offline-settings.png" "$d/settings.png"
echo "screenshots updated in $d"
