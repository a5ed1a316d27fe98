/**
 * Position from the phone's GNSS through @capacitor/geolocation (the only module that imports it).
 *
 * On a phone (native) the plugin asks the crew for permission itself; we check first and ask once if the answer is
 * still open. On the web, `Geolocation.requestPermissions()` throws "Not implemented on web", so it is never called
 * there: the browser asks when the position is first read.
 * Heights: the W3C Geolocation API and Android give the altitude above the WGS84 ellipsoid; iOS (Core Location
 * `altitude`) gives it above mean sea level, so on iOS it is reported as `heightMslM` and `heightEllM` is null.
 */
import { Capacitor } from '@capacitor/core';
import { Geolocation, type Position, type PositionOptions } from '@capacitor/geolocation';
import { err, ok } from '../core/result.ts';
export { assessFix, type FixAssessment } from './fixQuality.ts';
import type { Fix, FixError, FixErrorKind, FixOptions, FixResult, GeolocationSensor } from './types.ts';

/** The parts of the Capacitor plugin used here (so tests can pass a stub). */
export interface GeolocationPluginLike {
  getCurrentPosition(options?: PositionOptions): Promise<Position>;
  watchPosition(options: PositionOptions, callback: (position: Position | null, error?: unknown) => void): Promise<string>;
  clearWatch(options: { id: string }): Promise<void>;
  checkPermissions(): Promise<{ location: string }>;
  requestPermissions(): Promise<{ location: string }>;
}

export interface GeolocationDeps {
  plugin: GeolocationPluginLike;
  /** Capacitor.isNativePlatform(): decides whether permissions are asked through the plugin. */
  native: boolean;
  platform: 'android' | 'ios' | 'web';
  setTimeout: (fn: () => void, ms: number) => unknown;
  clearTimeout: (h: unknown) => void;
}

/** Extra wait beyond the requested timeout before we stop waiting for a platform that never answers, ms. */
const TIMEOUT_MARGIN_MS = 2000;
/** Timeout used between fixes while watching, ms. */
const WATCH_TIMEOUT_MS = 30_000;

const MESSAGES: Record<FixErrorKind, string> = {
  'permission-denied':
    'Glintmark is not allowed to use this phone\u2019s location. Allow location for Glintmark in the phone\u2019s settings, or type the site\u2019s coordinates.',
  timeout: 'No position yet. Move into the open, away from buildings, trees and the vehicle, and try again \u2014 or type the coordinates.',
  unavailable: 'This phone cannot give a position right now. Check that location is switched on, or type the coordinates.',
};
const SERVICES_OFF = 'Location is switched off on this phone. Turn it on in the phone\u2019s settings, or type the coordinates.';

const fixError = (kind: FixErrorKind, message = MESSAGES[kind]): FixError => ({ kind, message });

/**
 * Map a platform error to one of three kinds. Web: W3C GeolocationPositionError codes 1 (denied), 2 (unavailable),
 * 3 (timeout). Native: the plugin's "OS-PLUG-GLOC-00nn" codes (3 denied, 8 restricted, 7/9 location switched off,
 * 10 timeout; see the plugin's GeolocationErrors.kt and GeolocationError.swift).
 */
export function classifyFixError(e: unknown): FixError {
  const code = typeof e === 'object' && e !== null && 'code' in e ? (e as { code: unknown }).code : undefined;
  const msg = e instanceof Error ? e.message : typeof e === 'object' && e !== null && 'message' in e ? String((e as { message: unknown }).message) : String(e);
  if (code === 1) return fixError('permission-denied');
  if (code === 3) return fixError('timeout');
  if (code === 2) return fixError('unavailable');
  if (typeof code === 'string') {
    const n = Number(code.replace(/^OS-PLUG-GLOC-/, ''));
    if (n === 3 || n === 8) return fixError('permission-denied');
    if (n === 7 || n === 9) return fixError('unavailable', SERVICES_OFF);
    if (n === 10) return fixError('timeout');
  }
  if (/denied|not allowed|permission/i.test(msg)) return fixError('permission-denied');
  if (/timeout|timed out|in time/i.test(msg)) return fixError('timeout');
  if (/not enabled|disabled|switched off/i.test(msg)) return fixError('unavailable', SERVICES_OFF);
  return fixError('unavailable');
}

/** A platform position as a Fix, or an 'unavailable' error when it carries no usable coordinates. */
export function fixFromPosition(p: Position, platform: GeolocationDeps['platform']): FixResult {
  const c = p.coords;
  if (!Number.isFinite(c.latitude) || !Number.isFinite(c.longitude) || Math.abs(c.latitude) > 90 || Math.abs(c.longitude) > 360) {
    return err(fixError('unavailable'));
  }
  const alt = typeof c.altitude === 'number' && Number.isFinite(c.altitude) ? c.altitude : null;
  const fix: Fix = {
    latDeg: c.latitude,
    lonDeg: c.longitude > 180 ? c.longitude - 360 : c.longitude,
    heightEllM: platform === 'ios' ? null : alt,
    horizontalAccuracyM: Number.isFinite(c.accuracy) && c.accuracy >= 0 ? c.accuracy : Infinity,
    timeMs: Number.isFinite(p.timestamp) ? p.timestamp : NaN,
  };
  if (platform === 'ios') fix.heightMslM = alt;
  return ok(fix);
}

export function createGeolocationSensor(deps: GeolocationDeps): GeolocationSensor {
  const native = deps.native;

  /** On a phone: check, and ask once if still undecided. On the web: nothing (the browser asks on first read). */
  async function ensurePermission(): Promise<FixError | null> {
    if (!native) return null;
    try {
      let s = (await deps.plugin.checkPermissions()).location;
      if (s === 'prompt' || s === 'prompt-with-rationale') s = (await deps.plugin.requestPermissions()).location;
      return s === 'granted' ? null : fixError('permission-denied');
    } catch (e) {
      return classifyFixError(e);
    }
  }

  return {
    async currentFix(opts: FixOptions): Promise<FixResult> {
      const denied = await ensurePermission();
      if (denied) return err(denied);
      let timer: unknown;
      const guard = new Promise<FixResult>((resolve) => {
        timer = deps.setTimeout(() => resolve(err(fixError('timeout'))), opts.timeoutMs + TIMEOUT_MARGIN_MS);
      });
      const read = deps.plugin
        .getCurrentPosition({ enableHighAccuracy: true, timeout: opts.timeoutMs, maximumAge: opts.maxAgeMs })
        .then((p) => fixFromPosition(p, deps.platform))
        .catch((e: unknown) => err(classifyFixError(e)));
      try {
        return await Promise.race([read, guard]);
      } finally {
        deps.clearTimeout(timer);
      }
    },

    watchFix(cb: (r: FixResult) => void): () => void {
      let stopped = false;
      let id: string | null = null;
      void (async () => {
        const denied = await ensurePermission();
        if (stopped) return;
        if (denied) return cb(err(denied));
        try {
          const got = await deps.plugin.watchPosition({ enableHighAccuracy: true, timeout: WATCH_TIMEOUT_MS, maximumAge: 0 }, (p, e) => {
            if (stopped) return;
            cb(p ? fixFromPosition(p, deps.platform) : err(classifyFixError(e)));
          });
          if (stopped) void deps.plugin.clearWatch({ id: got }).catch(() => undefined);
          else id = got;
        } catch (e) {
          if (!stopped) cb(err(classifyFixError(e)));
        }
      })();
      return () => {
        stopped = true;
        if (id !== null) void deps.plugin.clearWatch({ id }).catch(() => undefined);
        id = null;
      };
    },
  };
}

/** The adapter wired to the real Capacitor plugin. */
export function realGeolocation(): GeolocationSensor {
  const p = Capacitor.getPlatform();
  return createGeolocationSensor({
    plugin: Geolocation,
    native: Capacitor.isNativePlatform(),
    platform: p === 'android' || p === 'ios' ? p : 'web',
    setTimeout: (fn, ms) => globalThis.setTimeout(fn, ms),
    clearTimeout: (h) => globalThis.clearTimeout(h as ReturnType<typeof setTimeout>),
  });
}
