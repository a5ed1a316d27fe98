/**
 * The clock for screens that show or depend on the time of day: read once when the screen mounts and again every
 * `periodMs`, so render itself never reads the clock (a render must give the same result for the same state).
 */
import { useEffect, useState } from 'react';

export function useNow(periodMs: number): number {
  const [nowMs, setNowMs] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNowMs(Date.now()), periodMs);
    return () => clearInterval(t);
  }, [periodMs]);
  return nowMs;
}
