/**
 * Phone sensors emulated in Chromium over the DevTools protocol (see test/e2e/align.e2e.ts for what this Chromium
 * was seen to do): a quaternion override drives deviceorientation / deviceorientationabsolute.
 */
import type { CDPSession } from 'playwright-core';
import { deviceAnglesFromPlateOrientation } from '../../src/core/alignment/deviceOrientation.ts';
import { normalizeAzimuthDeg, toRad } from '../../src/core/units.ts';

export type Quaternion = { x: number; y: number; z: number; w: number };
export type SensorType = 'absolute-orientation' | 'relative-orientation';

const mul = (p: Quaternion, q: Quaternion): Quaternion => ({
  x: p.w * q.x + p.x * q.w + p.y * q.z - p.z * q.y,
  y: p.w * q.y - p.x * q.z + p.y * q.w + p.z * q.x,
  z: p.w * q.z + p.x * q.y - p.y * q.x + p.z * q.w,
  w: p.w * q.w - p.x * q.x - p.y * q.y - p.z * q.z,
});

/** Quaternion of the W3C rotation Rz(α)·Rx(β)·Ry(γ) (intrinsic Z-X'-Y''), as Chromium's sensor override takes it. */
export function quaternionFromW3c(alphaDeg: number, betaDeg: number, gammaDeg: number): Quaternion {
  const h = (d: number) => toRad(d) / 2;
  const qz = { x: 0, y: 0, z: Math.sin(h(alphaDeg)), w: Math.cos(h(alphaDeg)) };
  const qx = { x: Math.sin(h(betaDeg)), y: 0, z: 0, w: Math.cos(h(betaDeg)) };
  const qy = { x: 0, y: Math.sin(h(gammaDeg)), z: 0, w: Math.cos(h(gammaDeg)) };
  return mul(mul(qz, qx), qy);
}

/** The quaternion a phone on a plate at this TRUE orientation reports: its compass reads true − declination. */
export function plateQuaternion(o: { azimuthDeg: number; tiltDeg: number; rollDeg: number }, declinationDeg: number): Quaternion {
  const a = deviceAnglesFromPlateOrientation({ ...o, azimuthDeg: normalizeAzimuthDeg(o.azimuthDeg - declinationDeg) });
  return quaternionFromW3c(a.alphaDeg, a.betaDeg, a.gammaDeg);
}

export async function setOrientation(cdp: CDPSession, type: SensorType, q: Quaternion): Promise<void> {
  await cdp.send('Emulation.setSensorOverrideReadings', { type, reading: { quaternion: q } });
}

/** Turn on an orientation sensor override and give it a first reading (send before page.goto). */
export async function emulateOrientation(cdp: CDPSession, type: SensorType, q: Quaternion): Promise<void> {
  await cdp.send('Emulation.setSensorOverrideEnabled', { enabled: true, type });
  await setOrientation(cdp, type, q);
}
