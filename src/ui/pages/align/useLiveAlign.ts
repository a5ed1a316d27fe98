/**
 * Runs the orientation and field sensors while the Align screen is in view and hands the page a snapshot about
 * ten times a second, however fast the sensor fires. Readings go straight into a fixed-size LiveAlignment.
 */
import { useEffect, useState } from 'react';
import { sensors, ORIENTATION_MESSAGES, type FieldReading, type OrientationStatus } from '../../../sensors/index.ts';
import { LiveAlignment, type LiveSnapshot } from './liveAlign.ts';

/** Render interval, ms (about 10 Hz). */
export const RENDER_INTERVAL_MS = 100;

export interface LiveAlignState {
  snap: LiveSnapshot;
  status: OrientationStatus;
  field: FieldReading | null;
  fieldUnavailable: string | null;
  live: LiveAlignment;
}

export function useLiveAlign(active: boolean): LiveAlignState {
  const [live] = useState(() => new LiveAlignment());
  const [snap, setSnap] = useState<LiveSnapshot>(() => live.snapshot(Date.now()));
  const [status, setStatus] = useState<OrientationStatus>({ kind: 'starting', message: ORIENTATION_MESSAGES.starting });
  const [field, setField] = useState<FieldReading | null>(null);
  const [fieldUnavailable, setFieldUnavailable] = useState<string | null>(null);

  useEffect(() => {
    if (!active) return;
    let lastField: FieldReading | null = null;
    const stopOrientation = sensors.orientation.start((r) => live.push(r), setStatus);
    const stopField = sensors.magnetometer.start((r) => (lastField = r), setFieldUnavailable);
    const timer = setInterval(() => {
      setSnap(live.snapshot(Date.now()));
      setField((f) => (f === lastField ? f : lastField));
    }, RENDER_INTERVAL_MS);
    return () => {
      clearInterval(timer);
      stopOrientation();
      stopField();
    };
  }, [active, live]);

  return { snap, status, field, fieldUnavailable, live };
}
