/**
 * The Align screen's live state between renders: orientation readings go in as they arrive (tens per second, for
 * hours), a snapshot comes out at the render rate. Memory is fixed: two SteadinessTrackers (ring buffers) — a 1 s
 * window for the displayed (smoothed) values and a 3 s window for steadiness and capture — and a few scalars.
 * Azimuths held here are MAGNETIC (from the phone's compass); the declination is added when the snapshot is used.
 */
import { plateOrientationFromDeviceAngles } from '../../../core/alignment/deviceOrientation.ts';
import { captureAverage, DEFAULT_STEADINESS, SteadinessTracker, type CapturedOrientation, type SteadinessStatus } from '../../../core/alignment/smoothing.ts';
import type { OrientationReading, OrientationSource } from '../../../sensors/index.ts';

/** Window of the displayed running mean, s (about 1 s, as the brief asks). */
export const DISPLAY_WINDOW_S = 1;
/** Window for steadiness and capture, s. */
export const CAPTURE_WINDOW_S = DEFAULT_STEADINESS.windowS;
/** No reading for this long → the values shown are dropped, ms. */
export const STALE_AFTER_MS = 2000;

export interface LiveSnapshot {
  /** Smoothed plate orientation (azimuth MAGNETIC, null without a compass); tilt not yet bias-corrected. */
  measured: { azimuthMagDeg: number | null; tiltDeg: number; rollDeg: number } | null;
  /** Set while the phone stands near vertical (cannot measure). */
  nearVertical: string | null;
  absolute: boolean;
  source: OrientationSource | null;
  compassAccuracyDeg: number | null;
  steadiness: SteadinessStatus;
  /** Readings that arrived in total (for a "live" indicator). */
  readingCount: number;
}

export class LiveAlignment {
  // 128 samples over 1 s keeps every reading up to 64 Hz (the tracker drops readings closer than window/(capacity/2)).
  private readonly display = new SteadinessTracker({ windowS: DISPLAY_WINDOW_S, capacity: 128 });
  private readonly capture = new SteadinessTracker({ windowS: CAPTURE_WINDOW_S });
  private lastTimeMs: number | null = null;
  private nearVertical: string | null = null;
  private absolute = false;
  private source: OrientationSource | null = null;
  private compassAccuracyDeg: number | null = null;
  private count = 0;

  push(r: OrientationReading): void {
    this.count++;
    this.lastTimeMs = r.timeMs;
    // A switch between compass and relative readings changes what alpha means: start the windows again.
    if (r.absolute !== this.absolute) this.reset();
    this.absolute = r.absolute;
    this.source = r.source;
    this.compassAccuracyDeg = r.compassAccuracyDeg ?? null;
    let o;
    try {
      o = plateOrientationFromDeviceAngles({ alphaDeg: r.alphaDeg, betaDeg: r.betaDeg, gammaDeg: r.gammaDeg });
    } catch {
      return; // a malformed reading (non-finite angle) is skipped
    }
    if (!o.ok) {
      this.nearVertical = o.error.message;
      this.reset();
      return;
    }
    this.nearVertical = null;
    const sample = { timeMs: r.timeMs, azimuthDeg: r.absolute ? o.value.azimuthDeg : null, tiltDeg: o.value.tiltDeg, rollDeg: o.value.rollDeg };
    this.display.push(sample);
    this.capture.push(sample);
  }

  snapshot(nowMs: number): LiveSnapshot {
    const stale = this.lastTimeMs === null || nowMs - this.lastTimeMs > STALE_AFTER_MS;
    const samples = stale ? [] : this.display.samples();
    let measured: LiveSnapshot['measured'] = null;
    if (samples.length) {
      const c = captureAverage(samples);
      measured = { azimuthMagDeg: c.azimuthDeg, tiltDeg: c.tiltDeg, rollDeg: c.rollDeg };
    }
    return {
      measured,
      nearVertical: stale ? null : this.nearVertical,
      absolute: !stale && this.absolute,
      source: stale ? null : this.source,
      compassAccuracyDeg: stale ? null : this.compassAccuracyDeg,
      steadiness: stale ? { steady: false, spanS: 0, sampleCount: 0, std: { azimuthDeg: null, tiltDeg: 0, rollDeg: 0 } } : this.capture.status(),
      readingCount: this.count,
    };
  }

  /** Average of the last ~3 s (azimuth magnetic), or null when nothing is held. */
  captureWindow(): CapturedOrientation | null {
    const s = this.capture.samples();
    return s.length ? captureAverage(s) : null;
  }

  reset(): void {
    this.display.reset();
    this.capture.reset();
  }
}
