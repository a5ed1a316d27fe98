/** An orientation sensor that tests drive: push readings and status changes to whoever has started it. */
import type { OrientationReading, OrientationSensor, OrientationStatus } from '../types.ts';
import { ORIENTATION_MESSAGES } from '../orientation.ts';

interface Session {
  onReading: (r: OrientationReading) => void;
  onStatus: (s: OrientationStatus) => void;
}

export class FakeOrientation implements OrientationSensor {
  needsPermission = false;
  permissionAnswer: 'granted' | 'denied' = 'granted';
  private readonly sessions = new Set<Session>();
  private status: OrientationStatus = { kind: 'starting', message: ORIENTATION_MESSAGES.starting };

  start(onReading: (r: OrientationReading) => void, onStatus: (s: OrientationStatus) => void): () => void {
    const s = { onReading, onStatus };
    this.sessions.add(s);
    onStatus(this.status);
    return () => this.sessions.delete(s);
  }

  permissionNeeded(): boolean {
    return this.needsPermission;
  }

  async requestPermission(): Promise<'granted' | 'denied'> {
    if (this.permissionAnswer === 'granted') this.needsPermission = false;
    return this.permissionAnswer;
  }

  /** Deliver a reading; missing fields default to an absolute, level phone pointing at magnetic north. */
  push(r: Partial<OrientationReading> & { timeMs: number }): void {
    const reading: OrientationReading = { alphaDeg: 0, betaDeg: 0, gammaDeg: 0, absolute: true, source: 'deviceorientationabsolute', ...r };
    if (reading.absolute && this.status.kind !== 'absolute') this.setStatus('absolute');
    this.sessions.forEach((s) => s.onReading(reading));
  }

  setStatus(kind: OrientationStatus['kind']): void {
    this.status =
      kind === 'absolute'
        ? { kind, source: 'deviceorientationabsolute', message: ORIENTATION_MESSAGES.absolute.deviceorientationabsolute }
        : kind === 'relative-only'
          ? { kind, source: 'relative', message: ORIENTATION_MESSAGES['relative-only'] }
          : { kind, message: ORIENTATION_MESSAGES[kind] };
    this.sessions.forEach((s) => s.onStatus(this.status));
  }

  get listening(): number {
    return this.sessions.size;
  }
}
