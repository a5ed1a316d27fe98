/**
 * Phone on the base plate → reflector orientation, through the W3C DeviceOrientation angles.
 *
 * The phone lies screen-up on the base plate with its top edge pointing out of the open side along the
 * bisector: phone +y = forward, +x = right, +z (out of the screen) = up (CONVENTIONS.md, "Phone on the plate").
 *
 * W3C angles (alpha, beta, gamma) are intrinsic Z-X'-Y'' rotations of the earth frame east-north-up. The rotation
 * matrix that takes device coordinates to ENU is R = Rz(α)·Rx(β)·Ry(γ) with the right-handed elementary rotations
 *   Rz(α) = [[cα, −sα, 0], [sα, cα, 0], [0, 0, 1]], Rx(β) = [[1, 0, 0], [0, cβ, −sβ], [0, sβ, cβ]],
 *   Ry(γ) = [[cγ, 0, sγ], [0, 1, 0], [−sγ, 0, cγ]], so
 *   R = [[cα cγ − sα sβ sγ,  −sα cβ,  cα sγ + sα sβ cγ],
 *        [sα cγ + cα sβ sγ,   cα cβ,  sα sγ − cα sβ cγ],
 *        [−cβ sγ,             sβ,     cβ cγ          ]].
 * Source: W3C, "DeviceOrientation Event Specification" (Working Draft 2023-11-13), §"Device Orientation" and its
 *   worked example of the rotation matrix; the same matrix is in Chromium's orientation_util.cc.
 * The columns of R are the device axes in ENU. Reading the matrix off:
 *   - the top edge (column 2) is (−sα cβ, cα cβ, sβ): alpha turns it ANTICLOCKWISE seen from above (alpha 90° points
 *     the top west), so its azimuth is −α; beta > 0 raises the top edge (tilt = +β for |β| ≤ 90°);
 *   - the right edge (column 1) has up-component −cβ sγ: gamma > 0 LOWERS the right-hand side, so roll = −γ for a
 *     flat phone (roll is positive raising the right-hand side).
 * W3C ranges: alpha [0, 360), beta [−180, 180), gamma [−90, 90).
 */
import { orientationFromAxes, reflectorAxesEnu, type ReflectorOrientation } from '../geometry/orientation.ts';
import { err, ok, type Result } from '../result.ts';
import { normalizeAzimuthDeg, toDeg, toRad } from '../units.ts';
import { requireFinite, requireInRange } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';

export interface DeviceOrientationAngles {
  /** W3C alpha, degrees: rotation about the earth's up axis, anticlockwise seen from above. */
  alphaDeg: number;
  /** W3C beta, degrees: rotation about the device x axis; positive raises the top edge. */
  betaDeg: number;
  /** W3C gamma, degrees: rotation about the device y axis; positive lowers the right-hand side. */
  gammaDeg: number;
}

/** Rows of a 3×3 matrix. */
export type Mat3 = readonly [Vec3, Vec3, Vec3];

export interface PhoneNearVerticalError {
  kind: 'phone-near-vertical';
  /** Elevation of the phone's top edge (the bisector), degrees; beyond ±maxTiltDeg. */
  tiltDeg: number;
  message: string;
}

/** Largest |tilt| of the phone's top edge at which azimuth and roll are still read, degrees (common practice, no source). */
export const DEFAULT_MAX_TILT_DEG = 75;

/** R = Rz(α)·Rx(β)·Ry(γ), device → ENU (W3C DeviceOrientation Event Specification, rotation matrix). Rows. */
export function deviceRotationMatrixEnu(a: DeviceOrientationAngles): Mat3 {
  requireFinite('alphaDeg', a.alphaDeg);
  requireFinite('betaDeg', a.betaDeg);
  requireFinite('gammaDeg', a.gammaDeg);
  const al = toRad(a.alphaDeg), be = toRad(a.betaDeg), ga = toRad(a.gammaDeg);
  const cA = Math.cos(al), sA = Math.sin(al), cB = Math.cos(be), sB = Math.sin(be), cG = Math.cos(ga), sG = Math.sin(ga);
  return [
    [cA * cG - sA * sB * sG, -sA * cB, cA * sG + sA * sB * cG],
    [sA * cG + cA * sB * sG, cA * cB, sA * sG - cA * sB * cG],
    [-cB * sG, sB, cB * cG],
  ];
}

const column = (m: Mat3, j: 0 | 1 | 2): Vec3 => [m[0][j], m[1][j], m[2][j]];

/**
 * Plate orientation from the phone's W3C angles: forward = device y, up = device z, both in ENU, then
 * `orientationFromAxes`. With an absolute source (alpha 0 = top toward magnetic north) the azimuth returned is
 * MAGNETIC — add the declination with `magneticToTrueAzimuthDeg` before using it as a true azimuth.
 * When the top edge stands more than `maxTiltDeg` (default 75°) above or below the horizon, azimuth and roll are
 * ill-conditioned (they become undefined at 90°): returns a `phone-near-vertical` error instead of a number.
 * Any finite angles are accepted (not only the W3C ranges); non-finite ones throw RangeError.
 */
export function plateOrientationFromDeviceAngles(
  a: DeviceOrientationAngles,
  opts: { maxTiltDeg?: number } = {},
): Result<ReflectorOrientation, PhoneNearVerticalError> {
  const maxTiltDeg = requireInRange('maxTiltDeg', opts.maxTiltDeg ?? DEFAULT_MAX_TILT_DEG, {
    min: 0,
    max: 90,
    minInclusive: false,
    maxInclusive: false,
    unit: '°',
  });
  const R = deviceRotationMatrixEnu(a);
  const forward = column(R, 1);
  const up = column(R, 2);
  const tiltDeg = toDeg(Math.atan2(forward[2], Math.hypot(forward[0], forward[1])));
  if (Math.abs(tiltDeg) > maxTiltDeg) {
    const where = tiltDeg > 0 ? 'above' : 'below';
    return err({
      kind: 'phone-near-vertical',
      tiltDeg,
      message:
        `The phone is standing almost upright (its top edge is ${Math.abs(tiltDeg).toFixed(1)}° ${where} the horizon, ` +
        `more than ${maxTiltDeg}°), so the direction and side tilt cannot be read reliably: ` +
        `lay it flat on the base plate, screen up, top edge toward the open side.`,
    });
  }
  const o = orientationFromAxes(forward, up);
  // Unreachable while maxTiltDeg < 90, since the horizontal part of `forward` is then at least cos(maxTilt).
  if (!o) throw new RangeError(`orientation undefined for alphaDeg=${a.alphaDeg}, betaDeg=${a.betaDeg}, gammaDeg=${a.gammaDeg}`);
  return ok({ azimuthDeg: o.azimuthDeg, tiltDeg: o.tiltDeg + 0, rollDeg: o.rollDeg + 0 }); // `+ 0` turns −0 into +0
}

/**
 * W3C angles that a phone lying on the plate (top along the bisector) would report, for a plate orientation whose
 * azimuth is taken as measured from the same north as alpha. Inverse of `plateOrientationFromDeviceAngles`.
 * Decomposes R = [right | forward | up] as Rz(α)·Rx(β)·Ry(γ) with cos γ ≥ 0, as the W3C ranges require:
 *   γ = atan(−R₃₁ / R₃₃) folded into [−90, 90);  cβ = R₃₃ cγ − R₃₁ sγ,  β = atan2(R₃₂, cβ);
 *   (cα, sα) = (R₁₁ cγ + R₁₃ sγ, R₂₁ cγ + R₂₃ sγ) — the first row of Rz(−α)·R is (cγ, 0, sγ).
 * At β = ±90° (gimbal lock: the phone's top straight up or down) alpha and gamma are not separable; gamma = 0 is
 * returned. Output ranges: alpha [0, 360), beta [−180, 180), gamma [−90, 90).
 */
export function deviceAnglesFromPlateOrientation(o: ReflectorOrientation): DeviceOrientationAngles {
  const { right, forward, up } = reflectorAxesEnu(o);
  const r11 = right[0], r21 = right[1], r31 = right[2];
  const r32 = forward[2];
  const r13 = up[0], r23 = up[1], r33 = up[2];
  let gammaRad = Math.abs(r31) < 1e-15 && Math.abs(r33) < 1e-15 ? 0 : Math.atan2(-r31, r33);
  if (gammaRad >= Math.PI / 2) gammaRad -= Math.PI;
  else if (gammaRad < -Math.PI / 2) gammaRad += Math.PI;
  const cG = Math.cos(gammaRad), sG = Math.sin(gammaRad);
  const cB = r33 * cG - r31 * sG;
  let betaDeg = toDeg(Math.atan2(r32, cB));
  if (betaDeg >= 180) betaDeg -= 360;
  const alphaDeg = normalizeAzimuthDeg(toDeg(Math.atan2(r21 * cG + r23 * sG, r11 * cG + r13 * sG)));
  const gammaDeg = toDeg(gammaRad);
  return { alphaDeg, betaDeg, gammaDeg: Object.is(gammaDeg, -0) ? 0 : gammaDeg };
}

/**
 * True azimuth from a magnetic one: A_true = A_mag + D, declination D east-positive (CONVENTIONS.md), in [0, 360).
 * Source: definition of magnetic declination (Chulliat et al. 2025, "The US/UK World Magnetic Model for 2025-2030:
 *   Technical Report", NOAA NCEI, doi:10.25923/prbc-s316, §1: D is the angle from true north to the horizontal field,
 *   positive east).
 */
export function magneticToTrueAzimuthDeg(azMagDeg: number, declinationDeg: number): number {
  requireFinite('azMagDeg', azMagDeg);
  requireInRange('declinationDeg', declinationDeg, { min: -180, max: 180, unit: '°' });
  return normalizeAzimuthDeg(azMagDeg + declinationDeg);
}

/**
 * W3C alpha from an iOS `webkitCompassHeading`: the heading is the azimuth of the phone's top edge measured
 * CLOCKWISE from magnetic north, while alpha turns ANTICLOCKWISE, so α = (360 − heading) mod 360.
 * Valid for a phone lying roughly flat (the heading is the top edge's azimuth; Apple documents it for the device's
 * y axis); result in [0, 360). Source: W3C DeviceOrientation spec (alpha direction) and Apple's WebKit
 * `DeviceOrientationEvent.webkitCompassHeading` documentation (clockwise from magnetic north).
 */
export function compassHeadingToAlphaDeg(headingDeg: number): number {
  requireFinite('headingDeg', headingDeg);
  return normalizeAzimuthDeg(360 - headingDeg);
}
