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
/**
 * Browsers send orientation events only when the angles change (Chromium: by more than 0.1°), so a phone lying
 * still may send nothing for minutes. Silence therefore means "unchanged": at each render tick the last reading is
 * held (re-entered with the tick's time) at most this often, ms, so that steadiness and capture still see 3 s of data.
 */
export const HOLD_STEP_MS = 100;

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
  /** Seconds since the sensor last sent a reading (the value shown is held meanwhile); null before the first. */
  lastReadingAgeS: number | null;
}

export class LiveAlignment {
  // 128 samples over 1 s keeps every reading up to 64 Hz (the tracker drops readings closer than window/(capacity/2)).
  private readonly display = new SteadinessTracker({ windowS: DISPLAY_WINDOW_S, capacity: 128 });
  private readonly capture = new SteadinessTracker({ windowS: CAPTURE_WINDOW_S });
  private last: OrientationReading | null = null;
  private lastSampleMs = -Infinity;
  private nearVertical: string | null = null;
  private absolute = false;
  private source: OrientationSource | null = null;
  private compassAccuracyDeg: number | null = null;
  private count = 0;

  push(r: OrientationReading): void {
    this.count++;
    this.last = r;
    this.ingest(r);
  }

  /** Hold the last reading up to `nowMs` (see HOLD_STEP_MS). Called by `snapshot`. */
  tick(nowMs: number): void {
    if (this.last && nowMs - this.lastSampleMs >= HOLD_STEP_MS && nowMs >= this.last.timeMs) this.ingest({ ...this.last, timeMs: nowMs });
  }

  private ingest(r: OrientationReading): void {
    this.lastSampleMs = r.timeMs;
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
    this.tick(nowMs);
    const samples = this.display.samples();
    let measured: LiveSnapshot['measured'] = null;
    if (samples.length) {
      const c = captureAverage(samples);
      measured = { azimuthMagDeg: c.azimuthDeg, tiltDeg: c.tiltDeg, rollDeg: c.rollDeg };
    }
    return {
      measured,
      nearVertical: this.nearVertical,
      absolute: this.absolute,
      source: this.source,
      compassAccuracyDeg: this.compassAccuracyDeg,
      steadiness: this.capture.status(),
      readingCount: this.count,
      lastReadingAgeS: this.last ? (nowMs - this.last.timeMs) / 1000 : null,
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
