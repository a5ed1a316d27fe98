import { describe, expect, it } from 'vitest';
import type { Position } from '@capacitor/geolocation';
import { classifyFixError, createGeolocationSensor, fixFromPosition, type GeolocationDeps, type GeolocationPluginLike } from '../../src/sensors/geolocation.ts';

const pos = (lat: number, lon: number, acc: number, alt: number | null = 12.5, ts = 1_750_000_000_000): Position => ({
  timestamp: ts,
  coords: { latitude: lat, longitude: lon, accuracy: acc, altitude: alt, altitudeAccuracy: null, speed: null, heading: null },
});

/** A plugin stub whose answers the test scripts; it records what was called. */
function stubPlugin(opts: { position?: () => Promise<Position>; perm?: string; permAfterRequest?: string } = {}) {
  const calls: string[] = [];
  let watchCb: ((p: Position | null, e?: unknown) => void) | null = null;
  const plugin: GeolocationPluginLike = {
    getCurrentPosition: async () => {
      calls.push('getCurrentPosition');
      return (opts.position ?? (async () => pos(52.1, -1.2, 4)))();
    },
    watchPosition: async (_o, cb) => {
      calls.push('watchPosition');
      watchCb = cb;
      return '7';
    },
    clearWatch: async ({ id }) => {
      calls.push(`clearWatch:${id}`);
    },
    checkPermissions: async () => {
      calls.push('checkPermissions');
      return { location: opts.perm ?? 'granted' };
    },
    requestPermissions: async () => {
      calls.push('requestPermissions');
      if (opts.permAfterRequest === undefined) throw new Error('Not implemented on web.');
      return { location: opts.permAfterRequest };
    },
  };
  return { plugin, calls, emit: (p: Position | null, e?: unknown) => watchCb?.(p, e) };
}

const deps = (plugin: GeolocationPluginLike, native: boolean, platform: GeolocationDeps['platform'] = native ? 'android' : 'web'): GeolocationDeps => ({
  plugin,
  native,
  platform,
  setTimeout: (fn, ms) => setTimeout(fn, ms),
  clearTimeout: (h) => clearTimeout(h as ReturnType<typeof setTimeout>),
});

const flush = () => new Promise((r) => setTimeout(r, 0));

describe('currentFix', () => {
  it('on the web never asks the plugin for permissions (it throws "Not implemented on web")', async () => {
    const s = stubPlugin();
    const r = await createGeolocationSensor(deps(s.plugin, false)).currentFix({ timeoutMs: 1000, maxAgeMs: 0 });
    expect(r).toEqual({ ok: true, value: { latDeg: 52.1, lonDeg: -1.2, heightEllM: 12.5, horizontalAccuracyM: 4, timeMs: 1_750_000_000_000 } });
    expect(s.calls).toEqual(['getCurrentPosition']);
  });

  it('on a phone checks, asks once when undecided, and reports a refusal plainly', async () => {
    const s = stubPlugin({ perm: 'prompt', permAfterRequest: 'denied' });
    const r = await createGeolocationSensor(deps(s.plugin, true)).currentFix({ timeoutMs: 1000, maxAgeMs: 0 });
    expect(s.calls).toEqual(['checkPermissions', 'requestPermissions']);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.kind).toBe('permission-denied');
      expect(r.error.message).toMatch(/settings/);
    }
  });

  it('on a phone with permission reads the position', async () => {
    const s = stubPlugin({ perm: 'granted' });
    const r = await createGeolocationSensor(deps(s.plugin, true)).currentFix({ timeoutMs: 1000, maxAgeMs: 0 });
    expect(r.ok).toBe(true);
    expect(s.calls).toEqual(['checkPermissions', 'getCurrentPosition']);
  });

  it('maps a web timeout (code 3) and a platform that never answers to "timeout"', async () => {
    const t = stubPlugin({ position: () => Promise.reject({ code: 3, message: 'Timeout expired' }) });
    const r1 = await createGeolocationSensor(deps(t.plugin, false)).currentFix({ timeoutMs: 10, maxAgeMs: 0 });
    expect(!r1.ok && r1.error.kind).toBe('timeout');
    const hang = stubPlugin({ position: () => new Promise<Position>(() => undefined) });
    const d = deps(hang.plugin, false);
    d.setTimeout = (fn) => {
      queueMicrotask(fn); // the guard fires at once: no waiting on the wall clock
      return 0;
    };
    const r2 = await createGeolocationSensor(d).currentFix({ timeoutMs: 60_000, maxAgeMs: 0 });
    expect(!r2.ok && r2.error.kind).toBe('timeout');
  });

  it('on iOS reports the altitude as sea-level height, not ellipsoidal', async () => {
    const s = stubPlugin();
    const r = await createGeolocationSensor(deps(s.plugin, true, 'ios')).currentFix({ timeoutMs: 1000, maxAgeMs: 0 });
    expect(r.ok && r.value.heightEllM).toBe(null);
    expect(r.ok && r.value.heightMslM).toBe(12.5);
  });
});

describe('classifyFixError', () => {
  it.each([
    [{ code: 1, message: 'User denied Geolocation' }, 'permission-denied'],
    [{ code: 2, message: 'Position unavailable' }, 'unavailable'],
    [{ code: 3, message: 'Timeout expired' }, 'timeout'],
    [{ code: 'OS-PLUG-GLOC-0003', message: 'Location permission request was denied.' }, 'permission-denied'],
    [{ code: 'OS-PLUG-GLOC-0008', message: 'restricted' }, 'permission-denied'],
    [{ code: 'OS-PLUG-GLOC-0007', message: 'Location services are not enabled.' }, 'unavailable'],
    [{ code: 'OS-PLUG-GLOC-0010', message: 'Could not obtain location in time.' }, 'timeout'],
    [new Error('something else'), 'unavailable'],
    ['User denied Geolocation', 'permission-denied'],
  ])('%j → %s', (e, kind) => {
    const r = classifyFixError(e);
    expect(r.kind).toBe(kind);
    expect(r.message.length).toBeGreaterThan(20);
  });

  it('says location is switched off when the platform says so', () => {
    expect(classifyFixError({ code: 'OS-PLUG-GLOC-0007' }).message).toMatch(/switched off/);
  });
});

describe('fixFromPosition', () => {
  it('wraps east longitudes above 180° and rejects a position without coordinates', () => {
    const r = fixFromPosition(pos(10, 350, 3), 'web');
    expect(r.ok && r.value.lonDeg).toBe(-10);
    expect(fixFromPosition(pos(NaN, 0, 3), 'web').ok).toBe(false);
  });

  it('gives a null height when the platform has none, and infinite accuracy when it gives none', () => {
    const p = pos(1, 2, NaN, null);
    const r = fixFromPosition(p, 'android');
    expect(r.ok && r.value.heightEllM).toBe(null);
    expect(r.ok && r.value.horizontalAccuracyM).toBe(Infinity);
  });
});

describe('watchFix', () => {
  it('delivers fixes and errors, and clears the watch on stop', async () => {
    const s = stubPlugin();
    const got: string[] = [];
    const stop = createGeolocationSensor(deps(s.plugin, false)).watchFix((r) => got.push(r.ok ? `fix ${r.value.latDeg}` : r.error.kind));
    await flush();
    s.emit(pos(1, 2, 3));
    s.emit(null, { code: 1 });
    stop();
    s.emit(pos(5, 6, 7));
    await flush();
    expect(got).toEqual(['fix 1', 'permission-denied']);
    expect(s.calls).toContain('clearWatch:7');
  });

  it('does not start a watch when stop() comes first', async () => {
    const s = stubPlugin();
    const stop = createGeolocationSensor(deps(s.plugin, false)).watchFix(() => undefined);
    stop();
    await flush();
    expect(s.calls).toEqual([]);
  });

  it('clears a watch whose id arrives after stop()', async () => {
    const s = stubPlugin();
    let release: () => void = () => undefined;
    const gate = new Promise<void>((r) => (release = r));
    const slow: GeolocationPluginLike = { ...s.plugin, watchPosition: async (o, cb) => (await gate, s.plugin.watchPosition(o, cb)) };
    const stop = createGeolocationSensor(deps(slow, false)).watchFix(() => undefined);
    await flush();
    stop();
    release();
    await flush();
    await flush();
    expect(s.calls).toEqual(['watchPosition', 'clearWatch:7']);
  });
});
