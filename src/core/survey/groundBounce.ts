/**
 * Ground bounce of a raised reflector (on a pole or a roof): besides the direct triple bounce, energy can reach the
 * reflector by way of the ground in front of it. Seen from a distant radar at incidence θ the ground image of a
 * reflector h above a flat surface lies h below it, so the bounced return arrives later by an extra two-way path of
 * about 2·h·cos θ (common practice, no source; flat, level, specular ground assumed). When that extra range is
 * shorter than one slant-range resolution cell the bounce lands in the reflector's own cell and can interfere with
 * it (a stable but biased phase, a fading amplitude); beyond one cell it is imaged apart.
 * Height that moves it out: h > δr / (2 cos θ).
 */
import { requireIncidenceDeg, requireInRange, requirePositive } from '../validate.ts';

export interface GroundBounce {
  extraRangeM: number;
  /** True when the extra range is shorter than one slant-range resolution cell. */
  insideCell: boolean;
  /** Smallest mount height whose bounce falls outside the cell, m. */
  heightToClearM: number;
  warning?: string;
}

export function groundBounce(mountHeightM: number, incidenceDeg: number, slantRangeResolutionM: number): GroundBounce {
  requireInRange('mount height', mountHeightM, { min: 0, max: 500, unit: 'm' });
  requireIncidenceDeg('incidence', incidenceDeg);
  requirePositive('slant-range resolution', slantRangeResolutionM, 'm');
  const c = Math.cos((incidenceDeg * Math.PI) / 180);
  const extraRangeM = 2 * mountHeightM * c;
  const heightToClearM = slantRangeResolutionM / (2 * c);
  const insideCell = extraRangeM < slantRangeResolutionM;
  return {
    extraRangeM,
    insideCell,
    heightToClearM,
    ...(insideCell && mountHeightM > 0
      ? {
          warning: `the ground bounce (extra range ${extraRangeM.toFixed(2)} m ≈ 2·h·cos θ) falls inside one ${slantRangeResolutionM} m range cell; mount above ${heightToClearM.toFixed(2)} m to move it out, or keep the reflector low on ground that scatters diffusely`,
        }
      : {}),
  };
}
