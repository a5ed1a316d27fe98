/**
 * Averaging noisy orientation readings, and telling when the phone has been held steady.
 *
 * Azimuths (and rolls) are angles on a circle: 359° and 1° average to 0°, not 180°. They are averaged as unit
 * vectors: C = Σ cos θᵢ / n, S = Σ sin θᵢ / n, mean direction θ̄ = atan2(S, C), mean resultant length R̄ = √(C² + S²),
 * circular standard deviation v = √(−2 ln R̄) (radians).
 * Source: Mardia & Jupp, "Directional Statistics", Wiley 2000, §2.2 (mean direction and mean resultant length) and
 *   §2.3 (circular standard deviation). For tightly grouped samples v equals the ordinary standard deviation to
 *   second order.
 * Tilt lives in [−90°, 90°] and never wraps: it is averaged linearly.
 */
import { normalizeAzimuthDeg, toDeg, toRad, wrapSignedDeg } from '../units.ts';
import { requireFinite, requireInRange, requirePositive } from '../validate.ts';

/** Below this mean resultant length the directions cancel and have no mean (dimensionless). */
const MIN_RESULTANT = 1e-9;

function requireValues(name: string, values: readonly number[]): void {
  if (values.length === 0) throw new RangeError(`${name} must hold at least one value, got an empty list`);
  values.forEach((v, i) => requireFinite(`${name}[${i}]`, v));
}

function resultant(valuesDeg: readonly number[]): { meanRad: number; length: number } {
  let c = 0, s = 0;
  for (const v of valuesDeg) {
    c += Math.cos(toRad(v));
    s += Math.sin(toRad(v));
  }
  c /= valuesDeg.length;
  s /= valuesDeg.length;
  return { meanRad: Math.atan2(s, c), length: Math.min(1, Math.hypot(c, s)) };
}

/**
 * Circular mean direction, degrees in [0, 360) (Mardia & Jupp 2000, §2.2). Throws RangeError when the values
 * cancel (mean resultant length below 1e-9, e.g. [0, 180]) since no mean direction exists.
 */
export function circularMeanDeg(valuesDeg: readonly number[]): number {
  requireValues('valuesDeg', valuesDeg);
  const r = resultant(valuesDeg);
  if (r.length < MIN_RESULTANT) {
    throw new RangeError(`valuesDeg point in opposite directions (mean resultant length ${r.length}): no mean direction`);
  }
  return normalizeAzimuthDeg(toDeg(r.meanRad));
}

/** Circular standard deviation √(−2 ln R̄), degrees (Mardia & Jupp 2000, §2.3); Infinity when the values cancel. */
export function circularStdDeg(valuesDeg: readonly number[]): number {
  requireValues('valuesDeg', valuesDeg);
  const R = resultant(valuesDeg).length;
  return R < MIN_RESULTANT ? Infinity : toDeg(Math.sqrt(-2 * Math.log(R)));
}

/** Arithmetic mean Σxᵢ/n. */
export function linearMean(values: readonly number[]): number {
  requireValues('values', values);
  return values.reduce((a, b) => a + b, 0) / values.length;
}

/** Root-mean-square deviation from the mean, √(Σ(xᵢ − x̄)²/n) (divisor n, like the circular standard deviation). */
export function linearStd(values: readonly number[]): number {
  const m = linearMean(values);
  return Math.sqrt(values.reduce((a, b) => a + (b - m) ** 2, 0) / values.length);
}

export interface OrientationSample {
  /** Time of the reading, ms since 1970-01-01T00:00Z (any monotonic clock in ms works). */
  timeMs: number;
  /** Azimuth of the bisector, degrees; null when there is no compass reading. */
  azimuthDeg: number | null;
  tiltDeg: number;
  rollDeg: number;
}

export interface CapturedOrientation {
  /** Circular mean of the azimuths, [0, 360); null when no sample had one or they cancel. */
  azimuthDeg: number | null;
  tiltDeg: number;
  /** Circular mean of the rolls, (−180, 180]. */
  rollDeg: number;
  azimuthStdDeg: number | null;
  tiltStdDeg: number;
  rollStdDeg: number;
  sampleCount: number;
  /** How many samples carried an azimuth. */
  azimuthSampleCount: number;
}

/**
 * Average of a run of readings: circular for azimuth and roll, linear for tilt, each with its standard deviation.
 * Throws RangeError for an empty list or rolls that cancel (no mean roll); azimuths that cancel give null.
 */
export function captureAverage(samples: readonly OrientationSample[]): CapturedOrientation {
  if (samples.length === 0) throw new RangeError('samples must hold at least one reading, got an empty list');
  const az = samples.map((s) => s.azimuthDeg).filter((a): a is number => a !== null);
  const tilts = samples.map((s) => s.tiltDeg);
  const rolls = samples.map((s) => s.rollDeg);
  if (az.length) requireValues('azimuthDeg', az);
  const azR = az.length ? resultant(az) : null;
  const azOk = azR !== null && azR.length >= MIN_RESULTANT;
  return {
    azimuthDeg: azOk ? normalizeAzimuthDeg(toDeg(azR.meanRad)) : null,
    tiltDeg: linearMean(tilts),
    rollDeg: wrapSignedDeg(circularMeanDeg(rolls)),
    azimuthStdDeg: azOk ? toDeg(Math.sqrt(-2 * Math.log(azR.length))) : null,
    tiltStdDeg: linearStd(tilts),
    rollStdDeg: circularStdDeg(rolls),
    sampleCount: samples.length,
    azimuthSampleCount: az.length,
  };
}

export interface SteadinessOptions {
  /** How long the readings must stay within the thresholds, seconds (default 3). */
  windowS?: number;
  /** Largest standard deviation over the window that still counts as steady, degrees. */
  maxStdDeg?: { azimuthDeg: number; tiltDeg: number; rollDeg: number };
  /** Ring-buffer size, samples (default 240). Memory stays fixed however long the tracker runs. */
  capacity?: number;
}

/** Defaults: 3 s, and 0.5° azimuth / 0.2° tilt / 0.2° roll standard deviation (common practice, no source). */
export const DEFAULT_STEADINESS = { windowS: 3, maxStdDeg: { azimuthDeg: 0.5, tiltDeg: 0.2, rollDeg: 0.2 }, capacity: 240 };

/** Fewest samples in a window that may be called steady. */
export const MIN_STEADY_SAMPLES = 5;

export interface SteadinessStatus {
  steady: boolean;
  /** Time covered by the samples held, seconds. */
  spanS: number;
  sampleCount: number;
  /** Standard deviations over the window, degrees (azimuth null when no sample had one; Infinity if directions cancel). */
  std: { azimuthDeg: number | null; tiltDeg: number; rollDeg: number };
}

/**
 * Sliding window of timed orientation samples in a fixed-size ring buffer. Steady = at least MIN_STEADY_SAMPLES
 * samples covering at least `windowS`, and every standard deviation below its threshold (azimuth is ignored while
 * no sample has one). To keep a full window inside the ring at any sensor rate, a sample arriving sooner than
 * windowS/(capacity/2) after the last one kept is dropped. A sample older than the last one kept (clock stepped
 * back) or more than `windowS` after it (readings stopped, e.g. the app was in the background) restarts the window.
 */
export class SteadinessTracker {
  private readonly windowMs: number;
  private readonly minSpacingMs: number;
  private readonly maxStd: { azimuthDeg: number; tiltDeg: number; rollDeg: number };
  private readonly ring: (OrientationSample | undefined)[];
  private head = 0; // index of the oldest sample
  private count = 0;

  constructor(opts: SteadinessOptions = {}) {
    const windowS = requirePositive('windowS', opts.windowS ?? DEFAULT_STEADINESS.windowS, 's');
    const capacity = requireInRange('capacity', opts.capacity ?? DEFAULT_STEADINESS.capacity, { min: 8, max: 100_000 });
    if (!Number.isInteger(capacity)) throw new RangeError(`capacity must be a whole number of samples, got ${capacity}`);
    const m = opts.maxStdDeg ?? DEFAULT_STEADINESS.maxStdDeg;
    this.maxStd = {
      azimuthDeg: requirePositive('maxStdDeg.azimuthDeg', m.azimuthDeg, '°'),
      tiltDeg: requirePositive('maxStdDeg.tiltDeg', m.tiltDeg, '°'),
      rollDeg: requirePositive('maxStdDeg.rollDeg', m.rollDeg, '°'),
    };
    this.windowMs = windowS * 1000;
    this.minSpacingMs = this.windowMs / (capacity / 2);
    this.ring = new Array<OrientationSample | undefined>(capacity);
  }

  /** Add a reading (copied). Non-finite numbers throw RangeError. */
  push(sample: OrientationSample): void {
    requireFinite('timeMs', sample.timeMs);
    if (sample.azimuthDeg !== null) requireFinite('azimuthDeg', sample.azimuthDeg);
    requireFinite('tiltDeg', sample.tiltDeg);
    requireFinite('rollDeg', sample.rollDeg);
    const last = this.at(this.count - 1);
    if (last && (sample.timeMs < last.timeMs || sample.timeMs - last.timeMs > this.windowMs)) this.reset();
    else if (last && sample.timeMs - last.timeMs < this.minSpacingMs) return;
    if (this.count === this.ring.length) this.dropOldest();
    this.ring[(this.head + this.count) % this.ring.length] = { ...sample };
    this.count++;
    // Keep only what covers the window: drop the oldest while the next one still reaches back windowMs.
    const latest = sample.timeMs;
    while (this.count > 1 && latest - this.at(1)!.timeMs >= this.windowMs) this.dropOldest();
  }

  /** Samples currently held, oldest first (copies), e.g. for `captureAverage`. */
  samples(): OrientationSample[] {
    const out: OrientationSample[] = [];
    for (let i = 0; i < this.count; i++) out.push({ ...this.at(i)! });
    return out;
  }

  status(): SteadinessStatus {
    if (this.count === 0) return { steady: false, spanS: 0, sampleCount: 0, std: { azimuthDeg: null, tiltDeg: 0, rollDeg: 0 } };
    // Standard deviations only: these never throw (cancelling directions give Infinity, i.e. not steady).
    const held = this.samples();
    const az = held.map((x) => x.azimuthDeg).filter((a): a is number => a !== null);
    const std = {
      azimuthDeg: az.length ? circularStdDeg(az) : null,
      tiltDeg: linearStd(held.map((x) => x.tiltDeg)),
      rollDeg: circularStdDeg(held.map((x) => x.rollDeg)),
    };
    const spanS = (held[held.length - 1].timeMs - held[0].timeMs) / 1000;
    const steady =
      this.count >= MIN_STEADY_SAMPLES &&
      spanS * 1000 >= this.windowMs &&
      (std.azimuthDeg === null || std.azimuthDeg < this.maxStd.azimuthDeg) &&
      std.tiltDeg < this.maxStd.tiltDeg &&
      std.rollDeg < this.maxStd.rollDeg;
    return { steady, spanS, sampleCount: this.count, std };
  }

  reset(): void {
    this.ring.fill(undefined);
    this.head = 0;
    this.count = 0;
  }

  private at(i: number): OrientationSample | undefined {
    return i < 0 || i >= this.count ? undefined : this.ring[(this.head + i) % this.ring.length];
  }

  private dropOldest(): void {
    this.ring[this.head] = undefined;
    this.head = (this.head + 1) % this.ring.length;
    this.count--;
  }
}
