/** Counts cues instead of vibrating and beeping. */
import type { CueSensor } from '../types.ts';

export class FakeCues implements CueSensor {
  count = 0;
  withinTolerance(): void {
    this.count++;
  }
}
