/**
 * Plate-motion models: the horizontal velocity of a point on a rigid plate, v = ω × X (+ the origin rate bias).
 *
 * - ITRF2020 plate-motion model: Altamimi, Métivier, Rebischung, Collilieux, Chanard & Barnéoud, "ITRF2020 plate
 *   motion model", Geophys. Res. Lett. 50, e2023GL106373, 2023, Table 1 (ω, mas/yr) and Table 2 (origin rate bias
 *   ORB = 0.37, 0.35, 0.74 mm/yr). Values cross-checked against PROJ's data file `ITRF2020` (entries <EURA> …
 *   and <EURA_T> … with the ORB, PROJ 9.x).
 * - ITRF2014 plate-motion model: Altamimi, Métivier, Rebischung, Rouby & Collilieux, "ITRF2014 plate motion model",
 *   Geophys. J. Int. 209:1906–1912, 2017, Table 1 (ω, mas/yr). Values cross-checked against PROJ's data file
 *   `ITRF2014` (Debian proj-data 9.1.1, which carries ω only). The model's ORB, 0.41, 0.22, 0.41 mm/yr, is
 *   **from memory** (not verified against the paper here); it changes a velocity by under 0.6 mm/yr.
 * v = ω × X with ω in rad/yr (1 mas = π/648 000 000 rad), X in metres, v in m/yr; plus ORB.
 * Validity: stable plate interiors only (rigid-plate residuals about 0.3–1 mm/yr at the model's sites); near plate
 * boundaries and in deforming zones a measured site velocity is needed instead.
 */
import { requireFinite, requireOneOf } from '../validate.ts';
import { cross, type Vec3 } from '../vec3.ts';
import { MAS_TO_RAD } from './helmert.ts';
import type { ItrfFrame } from './itrf.ts';

export interface PlateModel {
  name: string;
  frame: ItrfFrame;
  /** Origin rate bias added to ω × X, mm/yr. */
  orbMmPerYr: Vec3;
  /** Whether the ORB value is verified against a second source. */
  orbVerified: boolean;
  /** ω per plate, mas/yr, ECEF components. */
  plates: Readonly<Record<string, Vec3>>;
}

export const ITRF2020_PMM: PlateModel = {
  name: 'ITRF2020-PMM',
  frame: 'ITRF2020',
  orbMmPerYr: [0.37, 0.35, 0.74],
  orbVerified: true,
  plates: {
    AMUR: [-0.131, -0.551, 0.837],
    ANTA: [-0.269, -0.312, 0.678],
    ARAB: [1.129, -0.146, 1.438],
    AUST: [1.487, 1.175, 1.223],
    CARB: [0.207, -1.422, 0.726],
    EURA: [-0.085, -0.519, 0.753],
    INDI: [1.137, 0.013, 1.444],
    NAZC: [-0.327, -1.561, 1.605],
    NOAM: [0.045, -0.666, -0.098],
    NUBI: [0.09, -0.585, 0.717],
    PCFC: [-0.404, 1.021, -2.154],
    SOAM: [-0.261, -0.282, -0.157],
    SOMA: [-0.081, -0.719, 0.864],
  },
};

export const ITRF2014_PMM: PlateModel = {
  name: 'ITRF2014-PMM',
  frame: 'ITRF2014',
  orbMmPerYr: [0.41, 0.22, 0.41],
  orbVerified: false,
  plates: {
    ANTA: [-0.248, -0.324, 0.675],
    ARAB: [1.154, -0.136, 1.444],
    AUST: [1.51, 1.182, 1.215],
    EURA: [-0.085, -0.531, 0.77],
    INDI: [1.154, -0.005, 1.454],
    NAZC: [-0.333, -1.544, 1.623],
    NOAM: [0.024, -0.694, -0.063],
    NUBI: [0.099, -0.614, 0.733],
    PCFC: [-0.409, 1.047, -2.169],
    SOAM: [-0.27, -0.301, -0.14],
    SOMA: [-0.121, -0.794, 0.884],
  },
};

/** The plate-motion model of a realisation, or null when none is carried (ITRF2000–2008). */
export function plateModelFor(frame: ItrfFrame): PlateModel | null {
  if (frame === 'ITRF2020') return ITRF2020_PMM;
  if (frame === 'ITRF2014') return ITRF2014_PMM;
  return null;
}

/** Velocity (m/yr, ECEF) of a point on `plate` under `model`: ω × X + ORB. */
export function plateVelocityEcefMPerYr(model: PlateModel, plate: string, xyzM: Vec3, includeOrb = true): Vec3 {
  xyzM.forEach((v, i) => requireFinite(`xyz[${i}]`, v));
  const name = requireOneOf(`plate (${model.name})`, plate.trim().toUpperCase(), Object.keys(model.plates));
  const w = model.plates[name];
  const omegaRadPerYr: Vec3 = [w[0] * MAS_TO_RAD, w[1] * MAS_TO_RAD, w[2] * MAS_TO_RAD];
  const v = cross(omegaRadPerYr, xyzM);
  const orb = includeOrb ? model.orbMmPerYr : ([0, 0, 0] as Vec3);
  return [v[0] + orb[0] / 1000, v[1] + orb[1] / 1000, v[2] + orb[2] / 1000];
}
