/**
 * A position in one ITRF realisation at one epoch → another realisation, optionally at another epoch.
 *
 * Order of operations (each step is returned so a report can show it):
 *   1. Move the position within the source frame from `epochYear` to `toEpochYear`: X(t₂) = X(t₁) + V·(t₂ − t₁),
 *      with V either a site velocity given as east, north, up (m/yr, turned into ECEF with the local axes at the
 *      point: v = vE·ê + vN·n̂ + vU·û, e.g. Hofmann-Wellenhof et al., "GNSS", 2008, eq. 10.7) or a plate-motion
 *      model of the source realisation (plates.ts). Linear motion only: no seasonal, post-seismic or episodic terms.
 *   2. Transform between realisations with the published 14-parameter Helmert transformation evaluated at the
 *      new epoch (itrf.ts).
 * Without a second epoch, only step 2 runs and the epoch is unchanged.
 */
import { requireFinite, requireInRange } from '../validate.ts';
import type { Vec3 } from '../vec3.ts';
import { ecefToGrs80, grs80ToEcefM } from './ellipsoid.ts';
import { transformItrf, type ItrfFrame, type TransformLeg } from './itrf.ts';
import { plateModelFor, plateVelocityEcefMPerYr } from './plates.ts';

export type EpochMotion = { kind: 'velocity'; enuMPerYr: Vec3 } | { kind: 'plate'; plate: string };

export interface FrameTransformRequest {
  xyzM: Vec3;
  from: ItrfFrame;
  to: ItrfFrame;
  epochYear: number;
  toEpochYear?: number;
  motion?: EpochMotion;
}

export interface FrameTransformResult {
  xM: number;
  yM: number;
  zM: number;
  latDeg: number;
  lonDeg: number;
  heightEllM: number;
  frame: ItrfFrame;
  epoch: number;
  /** The velocity used to change epoch, ECEF m/yr, when one was. */
  velocityEcefMPerYr?: Vec3;
  /** Displacement from the epoch change, ECEF m. */
  epochShiftM?: Vec3;
  /** Plate-motion model used, when one was. */
  plateModel?: string;
  legs: TransformLeg[];
}

/** Epochs the planner accepts: decimal years 1980–2100 (outside, the linear models are not meant to be used). */
export const requireEpochYear = (name: string, v: number) => requireInRange(name, v, { min: 1980, max: 2100 });

/** Velocity ENU (m/yr) at the point → ECEF (m/yr). */
export function enuVelocityToEcef(xyzM: Vec3, enu: Vec3): Vec3 {
  enu.forEach((v, i) => requireFinite(`velocity[${i}]`, v));
  const g = ecefToGrs80(xyzM);
  const phi = (g.latDeg * Math.PI) / 180, lam = (g.lonDeg * Math.PI) / 180;
  const sp = Math.sin(phi), cp = Math.cos(phi), sl = Math.sin(lam), cl = Math.cos(lam);
  const [e, n, u] = enu;
  return [-sl * e - sp * cl * n + cp * cl * u, cl * e - sp * sl * n + cp * sl * u, cp * n + sp * u];
}

export function transformFrameAndEpoch(req: FrameTransformRequest): FrameTransformResult {
  requireEpochYear('epoch', req.epochYear);
  let x = req.xyzM;
  let epoch = req.epochYear;
  let velocity: Vec3 | undefined;
  let shift: Vec3 | undefined;
  let plateModel: string | undefined;
  if (req.toEpochYear !== undefined) {
    requireEpochYear('to-epoch', req.toEpochYear);
    if (!req.motion) throw new RangeError('moving to another epoch needs a site velocity or a plate name');
    if (req.motion.kind === 'velocity') velocity = enuVelocityToEcef(x, req.motion.enuMPerYr);
    else {
      const model = plateModelFor(req.from);
      if (!model) throw new RangeError(`no plate-motion model is carried for ${req.from}; give a site velocity, or use ITRF2014 or ITRF2020`);
      velocity = plateVelocityEcefMPerYr(model, req.motion.plate, x);
      plateModel = model.name;
    }
    const dt = req.toEpochYear - req.epochYear;
    shift = [velocity[0] * dt, velocity[1] * dt, velocity[2] * dt];
    x = [x[0] + shift[0], x[1] + shift[1], x[2] + shift[2]];
    epoch = req.toEpochYear;
  } else if (req.motion) {
    throw new RangeError('a site velocity or plate moves a position to another epoch: give the to-epoch too');
  }
  const t = transformItrf(x, req.from, req.to, epoch);
  const g = ecefToGrs80(t.xyzM);
  return {
    xM: t.xyzM[0],
    yM: t.xyzM[1],
    zM: t.xyzM[2],
    latDeg: g.latDeg,
    lonDeg: g.lonDeg,
    heightEllM: g.heightEllM,
    frame: req.to,
    epoch,
    ...(velocity ? { velocityEcefMPerYr: velocity, epochShiftM: shift } : {}),
    ...(plateModel ? { plateModel } : {}),
    legs: t.legs,
  };
}

export { grs80ToEcefM };
