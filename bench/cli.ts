/** Planner start-up: wall time of `glintmark --version` and of one small `aim`, bundle against sources (target ≤ 0.3 s). */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const bin = fileURLToPath(new URL('../bin/glintmark.mjs', import.meta.url));
const bundle = fileURLToPath(new URL('../dist-cli/glintmark.mjs', import.meta.url));

function medianMs(args: string[], env: NodeJS.ProcessEnv, runs = 7): number {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    execFileSync(process.execPath, [bin, ...args], { env: { ...process.env, ...env }, stdio: 'ignore' });
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(runs / 2)];
}

export async function bench(): Promise<void> {
  const t0 = performance.now();
  execFileSync(process.execPath, ['-e', '0']);
  const bare = performance.now() - t0;
  console.log(`node itself (node -e 0): ${bare.toFixed(0)} ms`);
  if (!existsSync(bundle)) console.log('no bundle (run npm run build:cli): bundle figures skipped');
  else {
    console.log(`glintmark --version (bundle): median ${medianMs(['--version'], {}).toFixed(0)} ms (target ≤ 300 ms)`);
    console.log(`glintmark aim … (bundle):     median ${medianMs(['aim', '--incidence', '37.5', '--heading', '192.3'], {}).toFixed(0)} ms (target ≤ 300 ms)`);
  }
  console.log(`glintmark aim … (sources via tsx): median ${medianMs(['aim', '--incidence', '37.5', '--heading', '192.3'], { GLINTMARK_FROM_SOURCE: '1' }, 3).toFixed(0)} ms`);
}
