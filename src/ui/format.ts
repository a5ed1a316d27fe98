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
