/** All four fakes at once, ready for `setSensors(fakes.sensors)`. */
import type { Sensors } from '../types.ts';
import { FakeCues } from './cues.ts';
import { FakeGeolocation } from './geolocation.ts';
import { FakeMagnetometer } from './magnetometer.ts';
import { FakeOrientation } from './orientation.ts';

export { FakeCues, FakeGeolocation, FakeMagnetometer, FakeOrientation };

export function createFakeSensors() {
  const geolocation = new FakeGeolocation();
  const orientation = new FakeOrientation();
  const magnetometer = new FakeMagnetometer();
  const cues = new FakeCues();
  const sensors: Sensors = { geolocation, orientation, magnetometer, cues };
  return { sensors, geolocation, orientation, magnetometer, cues };
}
