/**
 * Measured strength of the magnetic field, where the platform exposes it: the W3C Generic Sensor `Magnetometer`
 * (x, y, z in µT; W3C "Magnetometer" Working Draft). Android WebViews and iOS do not expose it, so on most phones this
 * reports 'unavailable' and the Align screen simply does not show the field check.
 */
import type { FieldReading, MagnetometerSensor } from './types.ts';

/** The parts of the Generic Sensor object used here. */
export interface MagnetometerLike {
  x?: number | null;
  y?: number | null;
  z?: number | null;
  addEventListener(type: 'reading' | 'error', l: (e: Event) => void): void;
  start(): void;
  stop(): void;
}

export type MagnetometerCtor = new (opts: { frequency: number }) => MagnetometerLike;

const UNAVAILABLE = 'This phone does not report magnetic field strength, so a nearby steel object cannot be detected: keep the phone away from steel, the vehicle and tools.';
/** Readings per second asked of the sensor. */
const FREQUENCY_HZ = 5;
const NT_PER_UT = 1000;

export function createMagnetometer(ctor: MagnetometerCtor | undefined, now: () => number): MagnetometerSensor {
  return {
    start(onReading, onUnavailable) {
      if (!ctor) {
        onUnavailable(UNAVAILABLE);
        return () => undefined;
      }
      let sensor: MagnetometerLike | null = null;
      let failed = false;
      const fail = () => {
        if (failed) return;
        failed = true;
        try {
          sensor?.stop();
        } catch {
          /* already stopped */
        }
        onUnavailable(UNAVAILABLE);
      };
      try {
        sensor = new ctor({ frequency: FREQUENCY_HZ });
        const s = sensor;
        s.addEventListener('reading', () => {
          const { x, y, z } = s;
          if (typeof x !== 'number' || typeof y !== 'number' || typeof z !== 'number') return;
          const totalIntensityNt = Math.hypot(x, y, z) * NT_PER_UT;
          if (Number.isFinite(totalIntensityNt)) onReading({ totalIntensityNt, timeMs: now() } satisfies FieldReading);
        });
        s.addEventListener('error', fail);
        s.start();
      } catch {
        fail();
      }
      return () => {
        try {
          sensor?.stop();
        } catch {
          /* already stopped */
        }
      };
    },
  };
}

export function realMagnetometer(): MagnetometerSensor {
  const ctor = (globalThis as unknown as { Magnetometer?: MagnetometerCtor }).Magnetometer;
  return createMagnetometer(typeof ctor === 'function' ? ctor : undefined, () => Date.now());
}
