/**
 * What the app reads from the phone, in core conventions (CONVENTIONS.md): degrees, metres, ms since the epoch.
 * Each adapter in this folder wraps one platform API and returns these shapes; the fakes in ./fake/ return the same
 * shapes so that tests can drive the screens without a phone.
 */
import type { Result } from '../core/result.ts';

/** A position fix from the phone's GNSS. */
export interface Fix {
  latDeg: number;
  lonDeg: number;
  /** Height above the WGS84 ellipsoid, m; null when the platform gives none or gives only a sea-level height. */
  heightEllM: number | null;
  /** Height above mean sea level, m, when that is what the platform gives (iOS); otherwise absent. */
  heightMslM?: number | null;
  /** Radius of 68 % confidence of the horizontal position, m (W3C Geolocation `accuracy`). */
  horizontalAccuracyM: number;
  /** When the fix was taken, ms since 1970-01-01T00:00Z. */
  timeMs: number;
}

export type FixErrorKind = 'permission-denied' | 'timeout' | 'unavailable';

export interface FixError {
  kind: FixErrorKind;
  /** Plain words for a field user, saying what to do. */
  message: string;
}

export interface FixOptions {
  /** Give up after this long, ms. */
  timeoutMs: number;
  /** Accept a fix the phone already holds if it is no older than this, ms. */
  maxAgeMs: number;
}

export type FixResult = Result<Fix, FixError>;

export interface GeolocationSensor {
  currentFix(opts: FixOptions): Promise<FixResult>;
  /** Call `cb` with every new fix or error until the returned function is called. */
  watchFix(cb: (r: FixResult) => void): () => void;
}

export type OrientationSource = 'deviceorientationabsolute' | 'ios-compass' | 'relative';

/** One orientation event, as W3C DeviceOrientation angles (alpha anticlockwise from magnetic north when absolute). */
export interface OrientationReading {
  alphaDeg: number;
  betaDeg: number;
  gammaDeg: number;
  /** True when alpha is measured from magnetic north (a compass); false when its zero is arbitrary. */
  absolute: boolean;
  source: OrientationSource;
  /** iOS `webkitCompassAccuracy`: ± degrees of the heading; absent when the platform does not say. */
  compassAccuracyDeg?: number;
  timeMs: number;
}

/**
 * What the orientation stream can offer at the moment:
 * - 'starting': listening, nothing heard yet;
 * - 'absolute': compass-referenced readings arrive (azimuth, tilt and roll);
 * - 'relative-only': readings arrive but without a compass (tilt and roll only);
 * - 'no-sensor': nothing arrived within the wait;
 * - 'permission-needed': the platform (iOS) asks for a tap before it sends readings;
 * - 'permission-denied': the crew (or the platform) refused motion access.
 */
export type OrientationStatusKind = 'starting' | 'absolute' | 'relative-only' | 'no-sensor' | 'permission-needed' | 'permission-denied';

export interface OrientationStatus {
  kind: OrientationStatusKind;
  source?: OrientationSource;
  message: string;
}

export interface OrientationSensor {
  /** Start listening; returns stop(). Readings and status changes arrive through the callbacks. */
  start(onReading: (r: OrientationReading) => void, onStatus: (s: OrientationStatus) => void): () => void;
  /** True when the platform needs `requestPermission()` from a tap before it sends readings (iOS 13+). */
  permissionNeeded(): boolean;
  /** Ask for motion access. Call from a tap handler. */
  requestPermission(): Promise<'granted' | 'denied'>;
}

/** Total magnetic field measured by the phone. */
export interface FieldReading {
  /** Magnitude of the measured field vector, nT. */
  totalIntensityNt: number;
  timeMs: number;
}

export interface MagnetometerSensor {
  /** Start; returns stop(). `onUnavailable` is called once, with plain words, if the platform gives no field strength. */
  start(onReading: (r: FieldReading) => void, onUnavailable: (message: string) => void): () => void;
}

export interface CueSensor {
  /** A short vibration and beep for "within tolerance". Never throws; silently does nothing where unsupported. */
  withinTolerance(opts?: { haptic?: boolean; sound?: boolean }): void;
}

export interface Sensors {
  geolocation: GeolocationSensor;
  orientation: OrientationSensor;
  magnetometer: MagnetometerSensor;
  cues: CueSensor;
}
