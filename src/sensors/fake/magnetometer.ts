/** A magnetometer that tests drive. */
import type { FieldReading, MagnetometerSensor } from '../types.ts';

export class FakeMagnetometer implements MagnetometerSensor {
  private readonly sessions = new Set<{ onReading: (r: FieldReading) => void; onUnavailable: (m: string) => void }>();

  start(onReading: (r: FieldReading) => void, onUnavailable: (m: string) => void): () => void {
    const s = { onReading, onUnavailable };
    this.sessions.add(s);
    return () => this.sessions.delete(s);
  }

  push(totalIntensityNt: number, timeMs: number): void {
    this.sessions.forEach((s) => s.onReading({ totalIntensityNt, timeMs }));
  }

  unavailable(message = 'No field strength on this phone.'): void {
    this.sessions.forEach((s) => s.onUnavailable(message));
  }
}
