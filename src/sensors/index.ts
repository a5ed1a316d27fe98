/**
 * The sensors the app uses. Screens call `sensors.<name>`; the real adapters are created on first use, and tests
 * swap in fakes with `setSensors(...)` (see ./fake/) and restore the real ones with `resetSensors()`.
 * This folder is the only place that touches @capacitor/geolocation, @capacitor/haptics and the window's
 * orientation events.
 */
import { realCues } from './cues.ts';
import { realGeolocation } from './geolocation.ts';
import { realMagnetometer } from './magnetometer.ts';
import { realOrientation } from './orientation.ts';
import type { Sensors } from './types.ts';

export type * from './types.ts';
export { assessFix, GOOD_ACCURACY_M, POOR_ACCURACY_M, STALE_AFTER_S, type FixAssessment } from './fixQuality.ts';
export { ORIENTATION_MESSAGES } from './orientation.ts';

const factories: { [K in keyof Sensors]: () => Sensors[K] } = {
  geolocation: realGeolocation,
  orientation: realOrientation,
  magnetometer: realMagnetometer,
  cues: realCues,
};

let overrides: Partial<Sensors> = {};
const real: Partial<Sensors> = {};

function pick<K extends keyof Sensors>(k: K): Sensors[K] {
  const o = overrides[k];
  if (o) return o;
  return (real[k] ??= factories[k]()) as Sensors[K];
}

export const sensors: Sensors = {
  get geolocation() {
    return pick('geolocation');
  },
  get orientation() {
    return pick('orientation');
  },
  get magnetometer() {
    return pick('magnetometer');
  },
  get cues() {
    return pick('cues');
  },
};

/** Use these adapters instead of the real ones (tests); the rest stay real. */
export function setSensors(s: Partial<Sensors>): void {
  overrides = { ...overrides, ...s };
}

/** Back to the real adapters. */
export function resetSensors(): void {
  overrides = {};
}

/** Ask for motion-sensor access (iOS); call it from a tap. 'granted' where no permission is needed. */
export function requestOrientationPermission(): Promise<'granted' | 'denied'> {
  return sensors.orientation.requestPermission();
}
