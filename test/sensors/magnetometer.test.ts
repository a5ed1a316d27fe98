import { describe, expect, it } from 'vitest';
import { createMagnetometer, type MagnetometerLike } from '../../src/sensors/magnetometer.ts';

/** A Generic Sensor stand-in built on EventTarget. */
class StubMagnetometer extends EventTarget implements MagnetometerLike {
  static last: StubMagnetometer | null = null;
  static failStart = false;
  x: number | null = null;
  y: number | null = null;
  z: number | null = null;
  started = false;
  constructor(readonly opts: { frequency: number }) {
    super();
    StubMagnetometer.last = this;
  }
  start() {
    if (StubMagnetometer.failStart) throw new Error('SecurityError');
    this.started = true;
  }
  stop() {
    this.started = false;
  }
  read(x: number, y: number, z: number) {
    Object.assign(this, { x, y, z });
    this.dispatchEvent(new Event('reading'));
  }
}

const TOL_NT = 1e-6;

describe('magnetometer', () => {
  it('reports the magnitude of the measured vector in nT (µT × 1000)', () => {
    StubMagnetometer.failStart = false;
    const got: number[] = [];
    const stop = createMagnetometer(StubMagnetometer, () => 0).start((r) => got.push(r.totalIntensityNt), () => undefined);
    StubMagnetometer.last!.read(30, 40, 0);
    expect(Math.abs(got[0] - 50_000)).toBeLessThan(TOL_NT);
    stop();
    expect(StubMagnetometer.last!.started).toBe(false);
  });

  it('says "unavailable" where there is no Magnetometer, and when it refuses to start or errors', () => {
    const msgs: string[] = [];
    createMagnetometer(undefined, () => 0).start(() => undefined, (m) => msgs.push(m));
    StubMagnetometer.failStart = true;
    createMagnetometer(StubMagnetometer, () => 0).start(() => undefined, (m) => msgs.push(m));
    StubMagnetometer.failStart = false;
    createMagnetometer(StubMagnetometer, () => 0).start(() => undefined, (m) => msgs.push(m));
    StubMagnetometer.last!.dispatchEvent(new Event('error'));
    StubMagnetometer.last!.dispatchEvent(new Event('error'));
    expect(msgs.length).toBe(3);
    expect(msgs[0]).toMatch(/does not report magnetic field strength/);
  });
});
