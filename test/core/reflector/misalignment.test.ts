import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { aimForPass, type PassGeometry } from '../../../src/core/geometry/pointing.ts';
import { misalignment } from '../../../src/core/reflector/misalignment.ts';
import { rcsInReflectorFrame } from '../../../src/core/reflector/pattern.ts';
import { peakRcsM2, type Reflector } from '../../../src/core/reflector/trihedral.ts';
import { wrapSignedDeg } from '../../../src/core/units.ts';

const TOL_DB = 1e-9;
const TOL_DEG = 1e-7;
const r: Reflector = { shape: 'triangular', edgeM: 0.9, wavelengthM: 0.0555 };

const geometryArb = fc.record({
  incidenceDeg: fc.double({ min: 15, max: 60, noNaN: true }),
  headingDeg: fc.double({ min: 0, max: 360, noNaN: true }),
  look: fc.constantFrom<'right' | 'left'>('right', 'left'),
});

describe('misalignment', () => {
  it('exact aim from aimForPass gives the peak, 0° off boresight (property)', () => {
    fc.assert(
      fc.property(geometryArb, fc.constantFrom<'triangular' | 'square'>('triangular', 'square'), (g, shape) => {
        const a = aimForPass(g);
        const m = misalignment({ ...r, shape }, { azimuthDeg: a.reflectorAzimuthDeg, tiltDeg: a.baseTiltDeg, rollDeg: 0 }, g);
        expect(m.offBoresightDeg).toBeLessThan(1e-5);
        expect(m.lossDb).toBeLessThan(1e-9);
        expect(m.rcsM2).toBeCloseTo(peakRcsM2({ ...r, shape }), 6);
      }),
    );
  });

  it('level plate: matches the reflector-frame pattern at elevation 90° − incidence, offset = LOS azimuth − plate azimuth (property)', () => {
    fc.assert(
      fc.property(geometryArb, fc.double({ min: 0, max: 359.99, noNaN: true }), (g: PassGeometry, plateAzDeg) => {
        const m = misalignment(r, { azimuthDeg: plateAzDeg, tiltDeg: 0, rollDeg: 0 }, g);
        const losAzDeg = aimForPass(g).reflectorAzimuthDeg;
        const ref = rcsInReflectorFrame(r, { elevationDeg: 90 - g.incidenceDeg, azimuthOffsetDeg: wrapSignedDeg(losAzDeg - plateAzDeg) });
        expect(Math.abs(m.rcsM2 - ref.rcsM2)).toBeLessThanOrEqual(1e-9 * peakRcsM2(r));
      }),
    );
  });

  it('a 10° azimuth error on a level-plate aim costs the loss of the 10° azimuth-offset direction', () => {
    // Incidence 54.735610° puts the LOS on the level plate's boresight (base tilt 0); REFERENCES.md §1.
    const g: PassGeometry = { incidenceDeg: 90 - 35.264389682754654, headingDeg: 190, look: 'right' };
    const m = misalignment(r, { azimuthDeg: 110, tiltDeg: 0, rollDeg: 0 }, g);
    const ref = rcsInReflectorFrame(r, { elevationDeg: 35.264389682754654, azimuthOffsetDeg: -10 });
    expect(Math.abs(m.lossDb - ref.lossDb)).toBeLessThan(TOL_DB);
    // Angle between two directions 10° apart in azimuth at elevation e: cos φ = sin²e + cos²e cos 10°.
    const e = Math.atan(Math.SQRT1_2);
    const phiDeg = (Math.acos(Math.sin(e) ** 2 + Math.cos(e) ** 2 * Math.cos((10 * Math.PI) / 180)) * 180) / Math.PI;
    expect(Math.abs(m.offBoresightDeg - phiDeg)).toBeLessThan(TOL_DEG);
  });

  it('rejects bad geometry and bad orientation', () => {
    const o = { azimuthDeg: 100, tiltDeg: 10, rollDeg: 0 };
    expect(() => misalignment(r, o, { incidenceDeg: 95, headingDeg: 0, look: 'right' })).toThrow(/incidenceDeg must be in \(0, 90\)/);
    expect(() => misalignment(r, { ...o, rollDeg: 200 }, { incidenceDeg: 40, headingDeg: 0, look: 'right' })).toThrow(/rollDeg/);
  });
});
