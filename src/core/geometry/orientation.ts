/**
 * Reflector orientation: three angles ↔ the reflector's axes in local east-north-up (ENU).
 *
 * Reflector body axes (see CONVENTIONS.md, "Reflector frame"):
 *   forward  f: the base-plate bisector, from the inner corner out through the middle of the open side;
 *   right    r: in the base plate, 90° clockwise from f seen from above the plate;
 *   up       u: the base-plate normal, along the third (vertical) edge. (r, f, u) is right-handed like (E, N, U).
 * Edges of the corner: e₁ = (f − r)/√2 (left base edge), e₂ = (f + r)/√2 (right base edge), e₃ = u.
 * Boresight (the symmetry axis) b = (e₁ + e₂ + e₃)/√3 = (√2 f + u)/√3, atan(1/√2) = 35.26° above the plate.
 *
 * Angles (all degrees):
 *   azimuthDeg: azimuth of f projected on the horizontal, clockwise from true north, [0, 360);
 *   tiltDeg:    elevation of f above the horizontal (open side raised is positive), [−90, 90];
 *   rollDeg:    rotation of the plate about f, positive raising the right-hand side as seen facing along f, (−180, 180].
 * Construction: f = (sin A cos t, cos A cos t, sin t); r₀ = (cos A, −sin A, 0); u₀ = r₀ × f = (−sin A sin t, −cos A sin t, cos t);
 *   r = r₀ cos ρ + u₀ sin ρ, u = u₀ cos ρ − r₀ sin ρ. This is an intrinsic Z(−A)·X(t)·Y(ρ) rotation of ENU.
 * Source: elementary rotation algebra (e.g. Diebel, "Representing Attitude: Euler Angles, Unit Quaternions and
 *   Rotation Vectors", Stanford 2006, §2 and §5); the angle names follow the Glintmark issue #2 definitions.
 */
import { normalizeAzimuthDeg, toDeg, toRad } from '../units.ts';
import { requireFinite, requireInRange } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

export interface ReflectorOrientation {
  /** True azimuth of the base-plate bisector, degrees clockwise from north, [0, 360). */
  azimuthDeg: number;
  /** Elevation of the bisector, degrees; positive = open side raised. */
  tiltDeg: number;
  /** Rotation about the bisector, degrees; positive = right-hand side raised (facing along the bisector). */
  rollDeg: number;
}

export interface ReflectorAxesEnu {
  forward: Vec3;
  right: Vec3;
  up: Vec3;
  /** The three corner edges e₁ (left base), e₂ (right base), e₃ (= up). */
  edges: readonly [Vec3, Vec3, Vec3];
  /** Unit boresight (e₁ + e₂ + e₃)/√3. */
  boresight: Vec3;
}

export function validateOrientation(o: ReflectorOrientation): ReflectorOrientation {
  requireFinite('azimuthDeg', o.azimuthDeg);
  requireInRange('tiltDeg', o.tiltDeg, { min: -90, max: 90, unit: '°' });
  requireInRange('rollDeg', o.rollDeg, { min: -180, max: 180, unit: '°' });
  return o;
}

/** The reflector's axes in ENU for an orientation. */
export function reflectorAxesEnu(o: ReflectorOrientation): ReflectorAxesEnu {
  validateOrientation(o);
  const A = toRad(o.azimuthDeg);
  const t = toRad(o.tiltDeg);
  const p = toRad(o.rollDeg);
  const sA = Math.sin(A), cA = Math.cos(A), st = Math.sin(t), ct = Math.cos(t), sp = Math.sin(p), cp = Math.cos(p);
  const f: Vec3 = [sA * ct, cA * ct, st];
  const r0: Vec3 = [cA, -sA, 0];
  const u0: Vec3 = [-sA * st, -cA * st, ct];
  const r: Vec3 = [r0[0] * cp + u0[0] * sp, r0[1] * cp + u0[1] * sp, r0[2] * cp + u0[2] * sp];
  const u: Vec3 = [u0[0] * cp - r0[0] * sp, u0[1] * cp - r0[1] * sp, u0[2] * cp - r0[2] * sp];
  const k = Math.SQRT1_2;
  const e1: Vec3 = [(f[0] - r[0]) * k, (f[1] - r[1]) * k, (f[2] - r[2]) * k];
  const e2: Vec3 = [(f[0] + r[0]) * k, (f[1] + r[1]) * k, (f[2] + r[2]) * k];
  const s3 = 1 / Math.sqrt(3);
  const b: Vec3 = [(e1[0] + e2[0] + u[0]) * s3, (e1[1] + e2[1] + u[1]) * s3, (e1[2] + e2[2] + u[2]) * s3];
  return { forward: f, right: r, up: u, edges: [e1, e2, u], boresight: b };
}

/**
 * Orientation from the reflector's forward and up axes in ENU (inverse of reflectorAxesEnu).
 * Returns null when the bisector is within `minCosTilt` of vertical, where azimuth and roll are undefined.
 */
export function orientationFromAxes(forward: Vec3, up: Vec3, minCosTilt = 1e-6): ReflectorOrientation | null {
  forward.forEach((x, i) => requireFinite(`forward[${i}]`, x));
  up.forEach((x, i) => requireFinite(`up[${i}]`, x));
  const horiz = Math.hypot(forward[0], forward[1]);
  if (horiz < minCosTilt) return null;
  const azimuthDeg = normalizeAzimuthDeg(toDeg(Math.atan2(forward[0], forward[1])));
  const tiltDeg = toDeg(Math.atan2(forward[2], horiz));
  // right = forward × up… with (r, f, u) right-handed, r = f × u.
  const right: Vec3 = [
    forward[1] * up[2] - forward[2] * up[1],
    forward[2] * up[0] - forward[0] * up[2],
    forward[0] * up[1] - forward[1] * up[0],
  ];
  const rollDeg = toDeg(Math.atan2(right[2], up[2]));
  return { azimuthDeg, tiltDeg, rollDeg: rollDeg === -180 ? 180 : rollDeg };
}

/**
 * Direction to the radar expressed in the reflector's own frame:
 *   elevationDeg above the base plate, azimuthOffsetDeg from the bisector (clockwise seen from above the plate).
 * k = cos(el)cos(az)·f + cos(el)sin(az)·r + sin(el)·u.
 */
export interface ReflectorFrameDirection {
  elevationDeg: number;
  azimuthOffsetDeg: number;
}

/** Unit vector in reflector body coordinates (right, forward, up) for a reflector-frame direction. */
export function bodyVectorFromDirection(d: ReflectorFrameDirection): Vec3 {
  requireInRange('elevationDeg', d.elevationDeg, { min: -90, max: 90, unit: '°' });
  requireFinite('azimuthOffsetDeg', d.azimuthOffsetDeg);
  const el = toRad(d.elevationDeg);
  const az = toRad(d.azimuthOffsetDeg);
  return [Math.cos(el) * Math.sin(az), Math.cos(el) * Math.cos(az), Math.sin(el)];
}

/** Body coordinates (right, forward, up) of an ENU vector for the given axes. */
export function enuToBody(axes: ReflectorAxesEnu, v: Vec3): Vec3 {
  const d = (a: Vec3) => a[0] * v[0] + a[1] * v[1] + a[2] * v[2];
  return [d(axes.right), d(axes.forward), d(axes.up)];
}

/** Direction cosines of a body-frame unit vector (right, forward, up) against the edges e₁, e₂, e₃. */
export function edgeCosinesFromBody(v: Vec3): [number, number, number] {
  const k = Math.SQRT1_2;
  return [(v[1] - v[0]) * k, (v[1] + v[0]) * k, v[2]];
}
