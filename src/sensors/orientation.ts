/**
 * Phone orientation as W3C DeviceOrientation angles, from the best source the platform has (the only module that
 * listens to the window's orientation events):
 *  1. `deviceorientationabsolute` (Chrome and Android WebView): alpha from magnetic north;
 *  2. iOS: `deviceorientation` carrying `webkitCompassHeading` (clockwise from magnetic north), converted to alpha
 *     with compassHeadingToAlphaDeg; iOS sends nothing until DeviceOrientationEvent.requestPermission() has been
 *     granted from a tap (see `requestPermission`);
 *  3. otherwise relative `deviceorientation` (alpha has an arbitrary zero): tilt and roll only.
 * @capacitor/motion is not used: it has no native code and only relays the WebView's `deviceorientation` (never
 * the absolute event), so listening to the window directly gives the same data plus the compass.
 * Memory is fixed: the adapter keeps only the time of the last reading of each kind.
 */
import { compassHeadingToAlphaDeg } from '../core/alignment/deviceOrientation.ts';
import type { OrientationReading, OrientationSensor, OrientationSource, OrientationStatus } from './types.ts';

type Listener = (e: Event) => void;

/** What the adapter needs from the browser (a plain EventTarget and a fake clock in tests). */
export interface OrientationEnv {
  target: { addEventListener(type: string, l: Listener): void; removeEventListener(type: string, l: Listener): void };
  /** 'ondeviceorientationabsolute' in window. */
  hasAbsoluteEvent: boolean;
  /** DeviceOrientationEvent.requestPermission where it exists (iOS 13+). */
  requestPermission?: () => Promise<string>;
  now: () => number;
  setInterval: (fn: () => void, ms: number) => unknown;
  clearInterval: (h: unknown) => void;
}

/** No reading at all within this long after start (or after permission) → 'no-sensor', ms. Once readings have come,
 * silence is not an error: browsers send events only when the angles change. */
export const NO_SENSOR_AFTER_MS = 2000;
/** A relative reading within this long after an absolute one is Chrome's twin event, not a lost compass, ms. */
export const ABSOLUTE_HOLD_MS = 1000;
/** Relative readings must come this long without an absolute one before the compass is called unavailable, ms. */
export const RELATIVE_ONLY_AFTER_MS = 1000;
/** How often the status is re-evaluated when no event arrives, ms. */
const TICK_MS = 250;

export const ORIENTATION_MESSAGES = {
  absolute: { deviceorientationabsolute: 'Compass working (absolute orientation).', 'ios-compass': 'Compass working (iOS compass heading).' },
  'relative-only': 'Compass unavailable: tilt works, set azimuth by the sun, a reference bearing or another instrument.',
  'no-sensor': 'No orientation sensor: this phone sends no orientation readings. Measure tilt and roll with an inclinometer and type them in.',
  starting: 'Waiting for the orientation sensor\u2026',
  'permission-needed': 'This phone asks before sharing its motion sensors: tap \u201cAllow motion sensors\u201d.',
  'permission-denied':
    'Motion sensors were refused. Allow motion and orientation access for this app in the phone\u2019s settings and reopen this screen; meanwhile type readings from another instrument.',
} as const;

const num = (e: Event, key: string): number | null => {
  const v = (e as unknown as Record<string, unknown>)[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
};

/** Turn one event into a reading, or null when it carries no angles (e.g. Chrome's all-null event without a sensor). */
export function readingFromEvent(e: Event, timeMs: number): OrientationReading | null {
  const beta = num(e, 'beta'), gamma = num(e, 'gamma');
  if (beta === null || gamma === null) return null;
  const alpha = num(e, 'alpha');
  const heading = num(e, 'webkitCompassHeading');
  if (e.type === 'deviceorientation' && heading !== null && heading >= 0) {
    const acc = num(e, 'webkitCompassAccuracy');
    const r: OrientationReading = { alphaDeg: compassHeadingToAlphaDeg(heading), betaDeg: beta, gammaDeg: gamma, absolute: true, source: 'ios-compass', timeMs };
    if (acc !== null && acc >= 0) r.compassAccuracyDeg = acc;
    return r;
  }
  const absolute = (e as unknown as { absolute?: unknown }).absolute === true && alpha !== null;
  const source: OrientationSource = absolute ? 'deviceorientationabsolute' : 'relative';
  return { alphaDeg: alpha ?? 0, betaDeg: beta, gammaDeg: gamma, absolute, source, timeMs };
}

export function createOrientationSensor(env: OrientationEnv): OrientationSensor {
  let permission: 'unknown' | 'granted' | 'denied' = env.requestPermission ? 'unknown' : 'granted';
  const permissionWatchers = new Set<() => void>();
  let probed = false;

  /**
   * Ask once without a tap. Chromium (which has requestPermission too) answers 'granted' at once where the sensors
   * are allowed; iOS refuses a call made outside a tap. Only a 'granted' is taken: anything else leaves the
   * question open for the crew's tap on "Allow motion sensors".
   */
  const probePermission = () => {
    if (probed || permission !== 'unknown' || !env.requestPermission) return;
    probed = true;
    env
      .requestPermission()
      .then((answer) => {
        if (answer === 'granted' && permission === 'unknown') {
          permission = 'granted';
          permissionWatchers.forEach((w) => w());
        }
      })
      .catch(() => undefined);
  };

  return {
    permissionNeeded: () => permission !== 'granted' && env.requestPermission !== undefined,

    async requestPermission() {
      if (!env.requestPermission) return 'granted';
      try {
        permission = (await env.requestPermission()) === 'granted' ? 'granted' : 'denied';
      } catch {
        // Called outside a tap, or refused by the platform.
        permission = 'denied';
      }
      permissionWatchers.forEach((w) => w());
      return permission;
    },

    start(onReading, onStatus) {
      let startMs = env.now();
      let firstRelativeMs: number | null = null;
      let lastAbsoluteMs: number | null = null;
      let lastAbsoluteSource: OrientationSource = 'deviceorientationabsolute';
      let lastRelativeMs: number | null = null;
      /** Start of the current unbroken run of relative readings since the latest absolute one (null right after one). */
      let relSinceAbsMs: number | null = null;
      let status: OrientationStatus | null = null;

      const setStatus = (s: OrientationStatus) => {
        if (status && status.kind === s.kind && status.source === s.source) return;
        status = s;
        onStatus(s);
      };
      // Browsers send an event only when the angles change (Chromium: by more than 0.1°), so silence after the
      // first readings means "unchanged", not "gone": the status follows the kind of the latest readings.
      const compassFlowing = () =>
        lastAbsoluteMs !== null && (relSinceAbsMs === null || lastRelativeMs === null || lastRelativeMs - relSinceAbsMs <= ABSOLUTE_HOLD_MS);
      const evaluate = () => {
        const now = env.now();
        if (compassFlowing()) {
          const src = lastAbsoluteSource === 'ios-compass' ? 'ios-compass' : 'deviceorientationabsolute';
          return setStatus({ kind: 'absolute', source: src, message: ORIENTATION_MESSAGES.absolute[src] });
        }
        if (lastRelativeMs !== null) {
          const since = Math.max(lastAbsoluteMs !== null && relSinceAbsMs !== null ? relSinceAbsMs + ABSOLUTE_HOLD_MS : firstRelativeMs ?? now, startMs);
          if (now - since >= RELATIVE_ONLY_AFTER_MS) {
            return setStatus({ kind: 'relative-only', source: 'relative', message: ORIENTATION_MESSAGES['relative-only'] });
          }
          if (lastAbsoluteMs !== null) return; // the compass was working: keep saying so until it is surely gone
          return setStatus({ kind: 'starting', message: ORIENTATION_MESSAGES.starting });
        }
        if (permission === 'denied') return setStatus({ kind: 'permission-denied', message: ORIENTATION_MESSAGES['permission-denied'] });
        if (permission === 'unknown' && env.requestPermission) {
          return setStatus({ kind: 'permission-needed', message: ORIENTATION_MESSAGES['permission-needed'] });
        }
        if (now - startMs >= NO_SENSOR_AFTER_MS) return setStatus({ kind: 'no-sensor', message: ORIENTATION_MESSAGES['no-sensor'] });
        return setStatus({ kind: 'starting', message: ORIENTATION_MESSAGES.starting });
      };

      const onEvent: Listener = (e) => {
        const now = env.now();
        const r = readingFromEvent(e, now);
        if (!r) return;
        if (r.absolute) {
          lastAbsoluteMs = now;
          lastAbsoluteSource = r.source;
          relSinceAbsMs = null;
          onReading(r);
        } else {
          // A new run of relative readings starts after a pause (events come only on change).
          if (relSinceAbsMs === null || (lastRelativeMs !== null && now - lastRelativeMs > ABSOLUTE_HOLD_MS)) relSinceAbsMs = now;
          lastRelativeMs = now;
          firstRelativeMs ??= now;
          // Chrome sends both events: keep the compass-referenced one unless relative ones come on without it.
          if (lastAbsoluteMs === null || now - relSinceAbsMs > ABSOLUTE_HOLD_MS) onReading(r);
        }
        evaluate();
      };
      const onPermission = () => {
        startMs = env.now();
        evaluate();
      };

      if (env.hasAbsoluteEvent) env.target.addEventListener('deviceorientationabsolute', onEvent);
      env.target.addEventListener('deviceorientation', onEvent);
      permissionWatchers.add(onPermission);
      probePermission();
      const timer = env.setInterval(evaluate, TICK_MS);
      evaluate();
      return () => {
        env.clearInterval(timer);
        permissionWatchers.delete(onPermission);
        if (env.hasAbsoluteEvent) env.target.removeEventListener('deviceorientationabsolute', onEvent);
        env.target.removeEventListener('deviceorientation', onEvent);
      };
    },
  };
}

/** The adapter on the real window (a no-sensor stub outside a browser). */
export function realOrientation(): OrientationSensor {
  const w = globalThis as unknown as Partial<Window> & { DeviceOrientationEvent?: { requestPermission?: () => Promise<string> } };
  const target = typeof w.addEventListener === 'function' ? (w as unknown as OrientationEnv['target']) : { addEventListener() {}, removeEventListener() {} };
  const rp = w.DeviceOrientationEvent?.requestPermission;
  return createOrientationSensor({
    target,
    hasAbsoluteEvent: typeof w === 'object' && 'ondeviceorientationabsolute' in w,
    requestPermission: typeof rp === 'function' ? () => rp.call(w.DeviceOrientationEvent) : undefined,
    now: () => Date.now(),
    setInterval: (fn, ms) => globalThis.setInterval(fn, ms),
    clearInterval: (h) => globalThis.clearInterval(h as ReturnType<typeof setInterval>),
  });
}
