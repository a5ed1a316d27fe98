#!/usr/bin/env node
// Bundles the planner (src/cli/main.ts and what it imports from src/) into one ES module, dist-cli/glintmark.mjs,
// so `npx glintmark` starts without compiling TypeScript. npm packages stay external (loaded from node_modules).
// Runs as the `prepare` step of `npm ci`/`npm install`, and by `npm run build:cli`.
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
await build({
  entryPoints: [`${root}src/cli/main.ts`],
  outfile: `${root}dist-cli/glintmark.mjs`,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  sourcemap: true,
  logLevel: 'warning',
});
