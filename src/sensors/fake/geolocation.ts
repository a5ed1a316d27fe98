/** A geolocation sensor that tests drive: set what the next read returns, push fixes or errors to watchers. */
import { err, ok } from '../../core/result.ts';
import type { Fix, FixErrorKind, FixOptions, FixResult, GeolocationSensor } from '../types.ts';
import { classifyFixError } from '../geolocation.ts';

export class FakeGeolocation implements GeolocationSensor {
  /** What the next `currentFix` resolves with. */
  next: FixResult = err({ kind: 'unavailable', message: 'No fix set in the fake.' });
  readonly requests: FixOptions[] = [];
  private readonly watchers = new Set<(r: FixResult) => void>();

  setFix(fix: Fix): void {
    this.next = ok(fix);
  }

  /** Make the next read fail with the same plain message the real adapter gives for this kind. */
  setError(kind: FixErrorKind): void {
    this.next = err(classifyFixError({ code: kind === 'permission-denied' ? 1 : kind === 'timeout' ? 3 : 2 }));
  }

  async currentFix(opts: FixOptions): Promise<FixResult> {
    if (this.requests.length < 100) this.requests.push(opts);
    return this.next;
  }

  watchFix(cb: (r: FixResult) => void): () => void {
    this.watchers.add(cb);
    return () => this.watchers.delete(cb);
  }

  /** Deliver a fix (or error) to every watcher. */
  push(r: Fix | FixResult): void {
    const res: FixResult = 'ok' in r ? r : ok(r);
    this.watchers.forEach((w) => w(res));
  }

  get watching(): number {
    return this.watchers.size;
  }
}
