/** Display formatting. Numbers are stored in SI/degrees; these only shape what the crew reads. */
export const fmtNum = (x: number, digits: number): string => (Number.isFinite(x) ? x.toFixed(digits) : '—');

/** Degrees, decimal or degrees-minutes per the crew's setting. */
export function fmtDeg(x: number, digits = 1, style: 'decimal' | 'dm' = 'decimal'): string {
  if (!Number.isFinite(x)) return '—';
  if (style === 'decimal') return `${x.toFixed(digits)}°`;
  const sign = x < 0 ? '−' : '';
  const a = Math.abs(x);
  let d = Math.floor(a);
  let m = (a - d) * 60;
  if (Number(m.toFixed(3)) >= 60) {
    d += 1;
    m = 0;
  }
  return `${sign}${d}° ${m.toFixed(3)}′`;
}

export type LengthUnit = 'm' | 'ft';
/** International foot, exactly 0.3048 m (International Yard and Pound Agreement, 1959). */
export const M_PER_FT = 0.3048;

/** A length stored in metres, shown in the crew's unit. */
export function fmtLength(m: number, unit: LengthUnit, digits = 2): string {
  if (!Number.isFinite(m)) return '—';
  return unit === 'ft' ? `${(m / M_PER_FT).toFixed(digits)} ft` : `${m.toFixed(digits)} m`;
}

/** A length typed in the crew's unit, in metres. */
export const lengthToM = (value: number, unit: LengthUnit): number => (unit === 'ft' ? value * M_PER_FT : value);
