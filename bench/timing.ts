import { performance } from 'node:perf_hooks';

/** Median wall time in ms of `fn` over `runs` runs (after one warm-up), and the last result. */
export async function timeMs<T>(fn: () => T | Promise<T>, runs = 5): Promise<{ medianMs: number; result: T }> {
  let result = await fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    result = await fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { medianMs: times[Math.floor(times.length / 2)], result };
}
