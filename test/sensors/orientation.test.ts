import { describe, expect, it } from 'vitest';
import { compassHeadingToAlphaDeg } from '../../src/core/alignment/deviceOrientation.ts';
import { ABSOLUTE_HOLD_MS, createOrientationSensor, NO_SENSOR_AFTER_MS, readingFromEvent, RELATIVE_ONLY_AFTER_MS, type OrientationEnv } from '../../src/sensors/orientation.ts';
import type { OrientationReading, OrientationStatus } from '../../src/sensors/types.ts';

/** A window stand-in: a plain EventTarget, a hand-driven clock, and an interval the test ticks itself. */
function stubEnv(opts: { absoluteEvent?: boolean; requestPermission?: () => Promise<string> } = {}) {
  const target = new EventTarget();
  let nowMs = 0;
  const timers = new Set<() => void>();
  const env: OrientationEnv = {
    target,
    hasAbsoluteEvent: opts.absoluteEvent ?? true,
    requestPermission: opts.requestPermission,
    now: () => nowMs,
    setInterval: (fn) => (timers.add(fn), fn),
    clearInterval: (h) => timers.delete(h as () => void),
  };
  const advance = (ms: number) => {
    nowMs += ms;
    timers.forEach((t) => t());
  };
  const fire = (type: string, fields: Record<string, unknown>) => target.dispatchEvent(Object.assign(new Event(type), fields));
  return { env, advance, fire, timers, target };
}

function collect(env: OrientationEnv) {
  const readings: OrientationReading[] = [];
  const statuses: OrientationStatus[] = [];
  const sensor = createOrientationSensor(env);
  const stop = sensor.start((r) => readings.push(r), (s) => statuses.push(s));
  return { sensor, stop, readings, statuses, kinds: () => statuses.map((s) => s.kind) };
}

describe('readingFromEvent', () => {
  it('reads an absolute event as compass-referenced', () => {
    const e = Object.assign(new Event('deviceorientationabsolute'), { alpha: 30, beta: 5, gamma: -2, absolute: true });
    expect(readingFromEvent(e, 7)).toEqual({ alphaDeg: 30, betaDeg: 5, gammaDeg: -2, absolute: true, source: 'deviceorientationabsolute', timeMs: 7 });
  });

  it('turns an iOS compass heading into W3C alpha (anticlockwise) and keeps its accuracy', () => {
    const e = Object.assign(new Event('deviceorientation'), { alpha: 123, beta: 1, gamma: 2, absolute: false, webkitCompassHeading: 90, webkitCompassAccuracy: 5 });
    const r = readingFromEvent(e, 0)!;
    expect(r.source).toBe('ios-compass');
    expect(r.absolute).toBe(true);
    expect(r.alphaDeg).toBe(compassHeadingToAlphaDeg(90));
    expect(r.alphaDeg).toBe(270);
    expect(r.compassAccuracyDeg).toBe(5);
  });

  it('drops an uncalibrated iOS accuracy (−1) and ignores a heading of −1', () => {
    const e = Object.assign(new Event('deviceorientation'), { alpha: 10, beta: 1, gamma: 2, webkitCompassHeading: 45, webkitCompassAccuracy: -1 });
    expect(readingFromEvent(e, 0)!.compassAccuracyDeg).toBeUndefined();
    const bad = Object.assign(new Event('deviceorientation'), { alpha: 10, beta: 1, gamma: 2, webkitCompassHeading: -1 });
    expect(readingFromEvent(bad, 0)!.source).toBe('relative');
  });

  it('returns null for an event with no angles (a browser without the sensor)', () => {
    expect(readingFromEvent(Object.assign(new Event('deviceorientation'), { alpha: null, beta: null, gamma: null }), 0)).toBeNull();
  });

  it('keeps tilt and roll when alpha is missing', () => {
    const r = readingFromEvent(Object.assign(new Event('deviceorientation'), { alpha: null, beta: 3, gamma: 4 }), 0)!;
    expect(r).toMatchObject({ absolute: false, source: 'relative', betaDeg: 3, gammaDeg: 4 });
  });
});

describe('orientation stream', () => {
  it('prefers deviceorientationabsolute and hides the relative events Chrome sends alongside', () => {
    const s = stubEnv();
    const c = collect(s.env);
    expect(c.kinds()).toEqual(['starting']);
    s.advance(16);
    s.fire('deviceorientation', { alpha: 200, beta: 10, gamma: 0, absolute: false });
    s.fire('deviceorientationabsolute', { alpha: 30, beta: 10, gamma: 0, absolute: true });
    s.advance(16);
    s.fire('deviceorientation', { alpha: 200, beta: 10, gamma: 0, absolute: false });
    s.fire('deviceorientationabsolute', { alpha: 31, beta: 10, gamma: 0, absolute: true });
    expect(c.readings.map((r) => r.source)).toEqual(['relative', 'deviceorientationabsolute', 'deviceorientationabsolute']);
    expect(c.statuses.at(-1)).toMatchObject({ kind: 'absolute', source: 'deviceorientationabsolute' });
    c.stop();
  });

  it('says "compass unavailable" when only relative readings come, and only after a short wait', () => {
    const s = stubEnv({ absoluteEvent: false });
    const c = collect(s.env);
    for (let t = 0; t < RELATIVE_ONLY_AFTER_MS + 200; t += 50) {
      s.fire('deviceorientation', { alpha: 5, beta: 2, gamma: 1, absolute: false });
      s.advance(50);
    }
    expect(c.kinds()).toEqual(['starting', 'relative-only']);
    expect(c.statuses.at(-1)!.message).toMatch(/^Compass unavailable: tilt works, set azimuth by the sun, a reference bearing or another instrument/);
    expect(c.readings.every((r) => !r.absolute)).toBe(true);
    c.stop();
  });

  it('falls back to relative readings when the compass stops, and says so', () => {
    const s = stubEnv();
    const c = collect(s.env);
    s.fire('deviceorientationabsolute', { alpha: 30, beta: 10, gamma: 0, absolute: true });
    for (let t = 0; t < NO_SENSOR_AFTER_MS + ABSOLUTE_HOLD_MS; t += 100) {
      s.advance(100);
      s.fire('deviceorientation', { alpha: 5, beta: 2, gamma: 1, absolute: false });
    }
    expect(c.kinds()).toEqual(['starting', 'absolute', 'relative-only']);
    expect(c.readings.at(-1)!.source).toBe('relative');
    c.stop();
  });

  it('reports "no orientation sensor" when nothing arrives within 2 s', () => {
    const s = stubEnv();
    const c = collect(s.env);
    s.advance(NO_SENSOR_AFTER_MS - 1);
    expect(c.kinds()).toEqual(['starting']);
    s.advance(1);
    expect(c.kinds()).toEqual(['starting', 'no-sensor']);
    expect(c.statuses.at(-1)!.message).toMatch(/No orientation sensor/);
    c.stop();
  });

  it('stops listening and ticking on stop()', () => {
    const s = stubEnv();
    const c = collect(s.env);
    c.stop();
    expect(s.timers.size).toBe(0);
    s.fire('deviceorientationabsolute', { alpha: 30, beta: 10, gamma: 0, absolute: true });
    expect(c.readings).toEqual([]);
  });

  it('passes on every reading at once over a long run (nothing is queued)', () => {
    const s = stubEnv();
    let n = 0;
    const stop = createOrientationSensor(s.env).start(() => n++, () => undefined);
    for (let i = 0; i < 20_000; i++) {
      s.fire('deviceorientationabsolute', { alpha: i % 360, beta: 1, gamma: 1, absolute: true });
      s.advance(16);
    }
    expect(n).toBe(20_000);
    stop();
  });
});

describe('iOS permission', () => {
  it('asks for a tap instead of reporting no sensor, then listens once granted', async () => {
    let calls = 0;
    const s = stubEnv({ absoluteEvent: false, requestPermission: async () => (calls++ === 0 ? 'denied' : 'granted') });
    const c = collect(s.env);
    expect(c.sensor.permissionNeeded()).toBe(true);
    s.advance(NO_SENSOR_AFTER_MS * 2);
    expect(c.kinds()).toEqual(['permission-needed']);
    expect(await c.sensor.requestPermission()).toBe('granted');
    expect(c.sensor.permissionNeeded()).toBe(false);
    s.fire('deviceorientation', { alpha: 1, beta: 2, gamma: 3, webkitCompassHeading: 10, webkitCompassAccuracy: 3 });
    expect(c.statuses.at(-1)).toMatchObject({ kind: 'absolute', source: 'ios-compass' });
    c.stop();
  });

  it('takes a "granted" from a silent first ask (Chromium), so no tap is needed there', async () => {
    const s = stubEnv({ requestPermission: async () => 'granted' });
    const c = collect(s.env);
    await Promise.resolve();
    await Promise.resolve();
    expect(c.sensor.permissionNeeded()).toBe(false);
    s.advance(NO_SENSOR_AFTER_MS);
    expect(c.kinds()).toEqual(['permission-needed', 'starting', 'no-sensor']);
    c.stop();
  });

  it('ignores a refusal of the silent first ask (iOS refuses calls made outside a tap)', async () => {
    let calls = 0;
    const s = stubEnv({ absoluteEvent: false, requestPermission: () => (calls++ === 0 ? Promise.reject(new Error('NotAllowedError')) : Promise.resolve('granted')) });
    const c = collect(s.env);
    await Promise.resolve();
    await Promise.resolve();
    expect(c.sensor.permissionNeeded()).toBe(true);
    expect(c.kinds()).toEqual(['permission-needed']);
    expect(await c.sensor.requestPermission()).toBe('granted');
    c.stop();
  });

  it('reports a refusal (or a call made outside a tap) plainly', async () => {
    const s = stubEnv({ absoluteEvent: false, requestPermission: () => Promise.reject(new Error('requires user gesture')) });
    const c = collect(s.env);
    expect(await c.sensor.requestPermission()).toBe('denied');
    expect(c.statuses.at(-1)).toMatchObject({ kind: 'permission-denied' });
    expect(c.statuses.at(-1)!.message).toMatch(/settings/);
    c.stop();
  });

  it('needs no permission where the platform has no requestPermission', async () => {
    const s = stubEnv();
    const sensor = createOrientationSensor(s.env);
    expect(sensor.permissionNeeded()).toBe(false);
    expect(await sensor.requestPermission()).toBe('granted');
  });
});

describe('event-on-change sources (Chromium sends an event only when the angles change)', () => {
  it('keeps the compass status through long silences, and a later twin relative event does not replace it', () => {
    const s = stubEnv();
    const c = collect(s.env);
    s.fire('deviceorientationabsolute', { alpha: 30, beta: 10, gamma: 0, absolute: true });
    s.fire('deviceorientation', { alpha: 200, beta: 10, gamma: 0, absolute: false });
    s.advance(60_000);
    // The phone moves a minute later: the relative twin may come first.
    s.fire('deviceorientation', { alpha: 201, beta: 11, gamma: 0, absolute: false });
    s.fire('deviceorientationabsolute', { alpha: 31, beta: 11, gamma: 0, absolute: true });
    s.advance(60_000);
    expect(c.kinds()).toEqual(['starting', 'absolute']);
    expect(c.readings.map((r) => r.source)).toEqual(['deviceorientationabsolute', 'deviceorientationabsolute']);
    c.stop();
  });

  it('a single relative reading followed by silence is "compass unavailable", not "no sensor"', () => {
    const s = stubEnv();
    const c = collect(s.env);
    s.fire('deviceorientationabsolute', { alpha: null, beta: null, gamma: null, absolute: true });
    s.fire('deviceorientation', { alpha: 30, beta: 10, gamma: -5, absolute: false });
    s.advance(NO_SENSOR_AFTER_MS * 5);
    expect(c.kinds()).toEqual(['starting', 'relative-only']);
    expect(c.readings).toHaveLength(1);
    c.stop();
  });
});
