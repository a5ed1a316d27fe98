/**
 * Seeded pseudo-random numbers for tests, so no test depends on Math.random or the clock.
 * The 32-bit "mulberry32" generator (public domain, T. Ettinger).
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296; // uniform in [0, 1)
  };
}

/** Uniform noise in [−1, 1) from the same generator. */
export function noise(seed: number): () => number {
  const r = mulberry32(seed);
  return () => r() * 2 - 1;
}

/** `n` pseudo-random bytes from the seeded generator (four bytes per draw), e.g. photo stand-ins that do not compress. */
export function randomBytes(n: number, seed: number): Uint8Array<ArrayBuffer> {
  const r = mulberry32(seed);
  const out = new Uint8Array(n);
  const whole = n - (n % 4);
  const view = new DataView(out.buffer);
  for (let i = 0; i < whole; i += 4) view.setUint32(i, Math.floor(r() * 4294967296));
  for (let i = whole; i < n; i++) out[i] = Math.floor(r() * 256);
  return out;
}
