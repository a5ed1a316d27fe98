/** One phone position fix on request, with its quality in words (the sensors module wraps the platform). */
import { useCallback, useState } from 'react';
import { assessFix, sensors, type Fix, type FixAssessment } from '../../../sensors/index.ts';

const GPS_TIMEOUT_MS = 20_000;

export interface GpsFix {
  busy: boolean;
  error: string | null;
  quality: FixAssessment | null;
  /** Read a fresh fix; null (with `error` set) when none came. */
  get: () => Promise<Fix | null>;
}

export function useGpsFix(): GpsFix {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [quality, setQuality] = useState<FixAssessment | null>(null);
  const get = useCallback(async () => {
    setBusy(true);
    setError(null);
    try {
      const r = await sensors.geolocation.currentFix({ timeoutMs: GPS_TIMEOUT_MS, maxAgeMs: 0 });
      if (!r.ok) {
        setError(r.error.message);
        return null;
      }
      setQuality(assessFix(r.value, Date.now()));
      return r.value;
    } catch (e) {
      setError(`The position could not be read: ${e instanceof Error ? e.message : String(e)}`);
      return null;
    } finally {
      setBusy(false);
    }
  }, []);
  return { busy, error, quality, get };
}
