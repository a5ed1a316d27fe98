#!/usr/bin/env node
// Runs the planner straight from its TypeScript sources, so `npx glintmark` needs no build step.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
