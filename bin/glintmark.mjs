#!/usr/bin/env node
// The planner. Runs the bundle that `npm ci` builds (scripts/build-cli.mjs, the `prepare` step); with
// GLINTMARK_FROM_SOURCE=1, or before the bundle exists, it runs the TypeScript sources through tsx (a dev tool).
import { existsSync } from 'node:fs';

const bundle = new URL('../dist-cli/glintmark.mjs', import.meta.url);
let main;
if (process.env.GLINTMARK_FROM_SOURCE !== '1' && existsSync(bundle)) {
  ({ main } = await import(bundle.href));
} else {
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import('../src/cli/main.ts'));
}
process.exitCode = await main(process.argv.slice(2));
