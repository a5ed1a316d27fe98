/**
 * Exact physical-optics effective aperture of the square-panel trihedral by polygon clipping.
 *
 * Seen along the line of sight k (all three edge cosines positive), the three square panels of edge a fill the
 * hexagon with vertices a·e₁, a(e₁+e₂), a·e₂, a(e₂+e₃), a·e₃, a(e₃+e₁) projected on the plane normal to k (the
 * outline of the cube [0, a]³ without its two vertices extreme along k). Triple-bounce rays leave through the
 * point reflection of their entry point in the projected apex (the origin), so the effective aperture is the
 * area of H ∩ (−H), two convex hexagons; we clip one by the other (Sutherland & Hodgman, "Reentrant Polygon
 * Clipping", Communications of the ACM 17(1):32–42, 1974) and take the shoelace area.
 * Derivation of the overlap rule: Robertson 1947 (BSTJ 26:852–869); the same rule applied to the triangular
 * aperture reproduces the published closed form of trihedral.ts to rounding (tested).
 * Validity: exact for the geometric model at every direction inside the octant; a = 1 (the result is A/a²).
 */
import { convexOverlapAreaFlat } from './polygon.ts';

const hex = new Float64Array(12);
const reflected = new Float64Array(12);

/** Square-panel A/a² for direction cosines c₁, c₂, c₃ > 0 (a unit vector in edge coordinates; not re-checked). */
export function squareOverlapAreaRatio(c1: number, c2: number, c3: number): number {
  // Orthonormal basis (u, v) of the plane normal to k = (c1, c2, c3): u = normalise(k × axis), v = k × u, with the
  // axis the edge k is least aligned with, so that the cross product is well conditioned. (u, v, k) is
  // right-handed, so e₁ → e₂ → e₃ (and the hexagon below) runs anticlockwise in the (u, v) plane.
  let ax = 0, ay = 0, az = 0;
  if (c1 <= c2 && c1 <= c3) ax = 1;
  else if (c2 <= c3) ay = 1;
  else az = 1;
  let ux = c2 * az - c3 * ay, uy = c3 * ax - c1 * az, uz = c1 * ay - c2 * ax;
  const un = Math.hypot(ux, uy, uz);
  ux /= un; uy /= un; uz /= un;
  const vx = c2 * uz - c3 * uy, vy = c3 * ux - c1 * uz, vz = c1 * uy - c2 * ux;
  // Projections of the edge unit vectors e₁ = (ux, vx), e₂ = (uy, vy), e₃ = (uz, vz); a vertex that is a sum of
  // edges projects to the sum of their projections.
  hex[0] = ux; hex[1] = vx;
  hex[2] = ux + uy; hex[3] = vx + vy;
  hex[4] = uy; hex[5] = vy;
  hex[6] = uy + uz; hex[7] = vy + vz;
  hex[8] = uz; hex[9] = vz;
  hex[10] = uz + ux; hex[11] = vz + vx;
  // A point reflection is a half-turn: it keeps the anticlockwise order.
  for (let i = 0; i < 12; i++) reflected[i] = -hex[i];
  return convexOverlapAreaFlat(hex, 6, reflected, 6);
}
