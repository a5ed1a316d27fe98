import { afterEach, describe, expect, it } from 'vitest';
import { requestOrientationPermission, resetSensors, sensors, setSensors } from '../../src/sensors/index.ts';
import { createFakeSensors } from '../../src/sensors/fake/index.ts';

afterEach(() => resetSensors());

describe('sensor registry', () => {
  it('hands out the fakes a test injects, and the real adapters after reset', async () => {
    const f = createFakeSensors();
    setSensors(f.sensors);
    expect(sensors.orientation).toBe(f.orientation);
    expect(sensors.geolocation).toBe(f.geolocation);
    f.orientation.needsPermission = true;
    expect(await requestOrientationPermission()).toBe('granted');
    expect(f.orientation.needsPermission).toBe(false);
    resetSensors();
    expect(sensors.orientation).not.toBe(f.orientation);
  });

  it('lets a test replace one sensor and keep the others', () => {
    const f = createFakeSensors();
    setSensors({ cues: f.cues });
    expect(sensors.cues).toBe(f.cues);
    expect(sensors.geolocation).not.toBe(f.geolocation);
  });
});

describe('fakes', () => {
  it('drive readings, statuses, fixes and errors', async () => {
    const f = createFakeSensors();
    const statuses: string[] = [];
    const alphas: number[] = [];
    const stop = f.orientation.start((r) => alphas.push(r.alphaDeg), (s) => statuses.push(s.kind));
    f.orientation.push({ alphaDeg: 12, timeMs: 1 });
    f.orientation.setStatus('relative-only');
    stop();
    f.orientation.push({ alphaDeg: 13, timeMs: 2 });
    expect(alphas).toEqual([12]);
    expect(statuses).toEqual(['starting', 'absolute', 'relative-only']);

    f.geolocation.setError('timeout');
    const r = await f.geolocation.currentFix({ timeoutMs: 1, maxAgeMs: 0 });
    expect(!r.ok && r.error.kind).toBe('timeout');
    const seen: number[] = [];
    const unwatch = f.geolocation.watchFix((x) => x.ok && seen.push(x.value.latDeg));
    f.geolocation.push({ latDeg: 1, lonDeg: 2, heightEllM: null, horizontalAccuracyM: 3, timeMs: 0 });
    unwatch();
    expect(seen).toEqual([1]);
    expect(f.geolocation.watching).toBe(0);
  });
});
