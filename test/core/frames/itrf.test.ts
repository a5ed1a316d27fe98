import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ecefToGrs80, grs80ToEcefM } from '../../../src/core/frames/ellipsoid.ts';
import { applyHelmert7, helmertAtEpoch, invertHelmert7 } from '../../../src/core/frames/helmert.ts';
import { FROM_ITRF2014, FROM_ITRF2020, transformItrf, type ItrfFrame } from '../../../src/core/frames/itrf.ts';
import { ITRF2014_PMM, ITRF2020_PMM, plateVelocityEcefMPerYr } from '../../../src/core/frames/plates.ts';
import { enuVelocityToEcef, transformFrameAndEpoch } from '../../../src/core/frames/transform.ts';
import type { Vec3 } from '../../../src/core/vec3.ts';

/** cct prints micrometres; our code and PROJ's must agree to 10 µm. */
const PROJ_TOL_M = 1e-5;

interface Section {
  command: string;
  rows: number[][];
}
function readProjOutput(): Section[] {
  const text = readFileSync(new URL('../../fixtures/frames/proj-output.txt', import.meta.url), 'utf8');
  const out: Section[] = [];
  for (const line of text.split('\n')) {
    if (line.startsWith('## ')) out.push({ command: line.slice(3), rows: [] });
    else if (line.trim()) out[out.length - 1].rows.push(line.trim().split(/\s+/).map(Number));
  }
  return out;
}
const sections = readProjOutput();
const section = (cmd: string) => {
  const s = sections.find((x) => x.command === cmd);
  if (!s) throw new Error(`fixture has no section "${cmd}"`);
  return s.rows;
};
/** The input points of run-proj.sh (X, Y, Z m, epoch). */
const INPUTS: [Vec3, number][] = [
  [[4027894.0, 307046.0, 4919475.0], 2025.5],
  [[-4646000.0, 2553000.0, -3534000.0], 2021.0],
  [[-1288000.0, -4720000.0, 4080000.0], 2030.25],
];
const expectClose = (got: Vec3, want: number[], tol: number) => {
  for (let i = 0; i < 3; i++) expect(Math.abs(got[i] - want[i])).toBeLessThan(tol);
};

describe('published ITRF transformation parameters', () => {
  // IGN Transfo-ITRF2020_TRFs.txt (Altamimi et al. 2023, J. Geodesy 97:47), epoch 2015.0, written out here
  // from the table: T mm, D ppb, R mas (all zero), rates per year.
  it('ITRF2020 → past ITRFs match the published table', () => {
    const table: Record<string, [number[], number, number[], number]> = {
      ITRF2014: [[-1.4, -0.9, 1.4], -0.42, [0.0, -0.1, 0.2], 0.0],
      ITRF2008: [[0.2, 1.0, 3.3], -0.29, [0.0, -0.1, 0.1], 0.03],
      ITRF2005: [[2.7, 0.1, -1.4], 0.65, [0.3, -0.1, 0.1], 0.03],
      ITRF2000: [[-0.2, 0.8, -34.2], 2.25, [0.1, 0.0, -1.7], 0.11],
    };
    for (const [frame, [t, d, tr, dr]] of Object.entries(table)) {
      const p = FROM_ITRF2020[frame as keyof typeof FROM_ITRF2020];
      expect([...p.tMm, p.dPpb, ...p.tRateMmPerYr, p.dRatePpbPerYr, p.epochYear]).toEqual([...t, d, ...tr, dr, 2015.0]);
      expect([...p.rMas, ...p.rRateMasPerYr]).toEqual([0, 0, 0, 0, 0, 0]);
    }
  });
  // IGN Transfo-ITRF2014_ITRFs.txt (Altamimi et al. 2016, JGR Solid Earth 121, Table 4), epoch 2010.0.
  it('ITRF2014 → ITRF2008/2005/2000 match the published table', () => {
    const table: Record<string, [number[], number, number[], number]> = {
      ITRF2008: [[1.6, 1.9, 2.4], -0.02, [0.0, 0.0, -0.1], 0.03],
      ITRF2005: [[2.6, 1.0, -2.3], 0.92, [0.3, 0.0, -0.1], 0.03],
      ITRF2000: [[0.7, 1.2, -26.1], 2.12, [0.1, 0.1, -1.9], 0.11],
    };
    for (const [frame, [t, d, tr, dr]] of Object.entries(table)) {
      const p = FROM_ITRF2014[frame as keyof typeof FROM_ITRF2014];
      expect([...p.tMm, p.dPpb, ...p.tRateMmPerYr, p.dRatePpbPerYr, p.epochYear]).toEqual([...t, d, ...tr, dr, 2010.0]);
    }
  });
});

describe('ITRF transformations against PROJ (cct 9.1.1, test/fixtures/frames/proj-output.txt)', () => {
  const direct: [string, ItrfFrame, ItrfFrame][] = [
    ['+init=ITRF2014:ITRF2008', 'ITRF2014', 'ITRF2008'],
    ['+init=ITRF2014:ITRF2005', 'ITRF2014', 'ITRF2005'],
    ['+init=ITRF2014:ITRF2000', 'ITRF2014', 'ITRF2000'],
    ['+init=ITRF2020:ITRF2014', 'ITRF2020', 'ITRF2014'],
    ['+init=ITRF2020:ITRF2008', 'ITRF2020', 'ITRF2008'],
    ['+init=ITRF2020:ITRF2005', 'ITRF2020', 'ITRF2005'],
    ['+init=ITRF2020:ITRF2000', 'ITRF2020', 'ITRF2000'],
    ['-I +init=ITRF2020:ITRF2014', 'ITRF2014', 'ITRF2020'],
    ['+proj=pipeline +step +inv +init=ITRF2020:ITRF2008 +step +init=ITRF2020:ITRF2005', 'ITRF2008', 'ITRF2005'],
  ];
  for (const [cmd, from, to] of direct) {
    it(`${from} → ${to} (cct -d 6 ${cmd})`, () => {
      const want = section(`cct -d 6 ${cmd}`);
      INPUTS.forEach(([x, t], i) => expectClose(transformItrf(x, from, to, t).xyzM, want[i], PROJ_TOL_M));
    });
  }

  it('a round trip through every pair returns the input to 1 µm', () => {
    const frames: ItrfFrame[] = ['ITRF2000', 'ITRF2005', 'ITRF2008', 'ITRF2014', 'ITRF2020'];
    for (const a of frames)
      for (const b of frames) {
        const [x, t] = INPUTS[0];
        const there = transformItrf(x, a, b, t).xyzM;
        expectClose(transformItrf(there, b, a, t).xyzM, [...x], 1e-6);
      }
  });

  it('the exact inverse undoes a transformation with rotations (independent matrix written here)', () => {
    const p = { ...FROM_ITRF2014.ITRF2000, rMas: [0.5, -0.3, 0.2] as Vec3 };
    const h = helmertAtEpoch(p, 2020);
    const x: Vec3 = [4027894, 307046, 4919475];
    const mas = Math.PI / 648e6;
    const [r1, r2, r3] = [0.5 * mas, -0.3 * mas, 0.2 * mas];
    const d = (2.12 + 0.11 * 10) * 1e-9;
    const t = [0.0007 + 0.0001 * 10, 0.0012 + 0.0001 * 10, -0.0261 - 0.0019 * 10];
    const want = [
      x[0] + t[0] + d * x[0] - r3 * x[1] + r2 * x[2],
      x[1] + t[1] + r3 * x[0] + d * x[1] - r1 * x[2],
      x[2] + t[2] - r2 * x[0] + r1 * x[1] + d * x[2],
    ];
    expectClose(applyHelmert7(h, x), want, 1e-9);
    expectClose(invertHelmert7(h, applyHelmert7(h, x)), [...x], 1e-9);
  });
});

describe('plate-motion models against PROJ (cct 9.1.1)', () => {
  const cases: [string, 'ITRF2020' | 'ITRF2014', string, number, boolean][] = [
    ['+init=ITRF2020:EURA_T +t_epoch=2015', 'ITRF2020', 'EURA', 2015, true],
    ['+init=ITRF2020:NOAM_T +t_epoch=2015', 'ITRF2020', 'NOAM', 2015, true],
    ['+init=ITRF2020:AUST_T +t_epoch=2015', 'ITRF2020', 'AUST', 2015, true],
    // PROJ's ITRF2014 file carries ω only, so compare our ω × X without the origin rate bias.
    ['+init=ITRF2014:EURA +t_epoch=2010', 'ITRF2014', 'EURA', 2010, false],
    ['+init=ITRF2014:NOAM +t_epoch=2010', 'ITRF2014', 'NOAM', 2010, false],
    ['+init=ITRF2014:AUST +t_epoch=2010', 'ITRF2014', 'AUST', 2010, false],
  ];
  for (const [cmd, frame, plate, t0, orb] of cases) {
    it(`${frame} ${plate} (cct -d 6 ${cmd})`, () => {
      const want = section(`cct -d 6 ${cmd}`);
      const model = frame === 'ITRF2020' ? ITRF2020_PMM : ITRF2014_PMM;
      INPUTS.forEach(([x, t], i) => {
        const v = plateVelocityEcefMPerYr(model, plate, x, orb);
        const dt = t - t0;
        expectClose([x[0] + v[0] * dt, x[1] + v[1] * dt, x[2] + v[2] * dt], want[i], PROJ_TOL_M);
      });
    });
  }

  it('transformFrameAndEpoch moves a position with the plate model of the --from realisation', () => {
    const [x] = INPUTS[0];
    const want = section('cct -d 6 +init=ITRF2020:EURA_T +t_epoch=2015')[0];
    // From 2015.0 to 2025.5 in ITRF2020 on EURA, same frame: exactly what cct did.
    const r = transformFrameAndEpoch({ xyzM: x, from: 'ITRF2020', to: 'ITRF2020', epochYear: 2015, toEpochYear: 2025.5, motion: { kind: 'plate', plate: 'eura' } });
    expectClose([r.xM, r.yM, r.zM], want, PROJ_TOL_M);
    expect(r.epoch).toBe(2025.5);
    expect(r.plateModel).toBe('ITRF2020-PMM');
  });

  it('refuses a plate model for a realisation that carries none, and an unknown plate', () => {
    const [x] = INPUTS[0];
    expect(() => transformFrameAndEpoch({ xyzM: x, from: 'ITRF2008', to: 'ITRF2020', epochYear: 2010, toEpochYear: 2020, motion: { kind: 'plate', plate: 'EURA' } })).toThrow(/ITRF2008/);
    expect(() => plateVelocityEcefMPerYr(ITRF2014_PMM, 'CARB', x)).toThrow(/CARB/);
  });
});

describe('GRS80 geodetic ↔ ECEF against PROJ (cct -d 9 +proj=cart +ellps=GRS80)', () => {
  const geo = [
    { latDeg: 52.0, lonDeg: 5.0, heightEllM: 100 },
    { latDeg: -33.9, lonDeg: 151.2, heightEllM: 50 },
    { latDeg: 40.0, lonDeg: -105.0, heightEllM: 1600 },
  ];
  it('forward to 1 µm and back to 1e-10° and 1 µm', () => {
    const want = section('cct -d 9 +proj=cart +ellps=GRS80 (input lon lat h)');
    geo.forEach((g, i) => {
      const x = grs80ToEcefM(g);
      expectClose(x, want[i], 1e-6);
      const back = ecefToGrs80(x);
      expect(Math.abs(back.latDeg - g.latDeg)).toBeLessThan(1e-10);
      expect(Math.abs(back.lonDeg - g.lonDeg)).toBeLessThan(1e-10);
      expect(Math.abs(back.heightEllM - g.heightEllM)).toBeLessThan(1e-6);
    });
  });
});

describe('site velocity', () => {
  it('east, north and up at (0°, 0°) are +Y, +Z and +X (ENU axes written out here)', () => {
    const x = grs80ToEcefM({ latDeg: 0, lonDeg: 0, heightEllM: 0 });
    expectClose(enuVelocityToEcef(x, [0.01, 0.02, 0.03]), [0.03, 0.01, 0.02], 1e-12);
  });
  it('10 years at 20 mm/yr north moves the point 0.2 m north', () => {
    const g = { latDeg: 45, lonDeg: 10, heightEllM: 0 };
    const r = transformFrameAndEpoch({ xyzM: grs80ToEcefM(g), from: 'ITRF2014', to: 'ITRF2014', epochYear: 2010, toEpochYear: 2020, motion: { kind: 'velocity', enuMPerYr: [0, 0.02, 0] } });
    // Meridian radius of curvature M = a(1−e²)/(1−e² sin²φ)^{3/2} (GRS80), so Δφ = 0.2 m / M.
    const a = 6378137, f = 1 / 298.257222101, e2 = f * (2 - f);
    const m = (a * (1 - e2)) / (1 - e2 * 0.5) ** 1.5;
    expect(r.latDeg - 45).toBeCloseTo(((0.2 / m) * 180) / Math.PI, 11);
    expect(Math.abs(r.lonDeg - 10)).toBeLessThan(1e-12);
  });
  it('a velocity without a second epoch is refused', () => {
    expect(() => transformFrameAndEpoch({ xyzM: INPUTS[0][0], from: 'ITRF2014', to: 'ITRF2020', epochYear: 2010, motion: { kind: 'velocity', enuMPerYr: [0, 0, 0] } })).toThrow(/to-epoch/);
  });
});
