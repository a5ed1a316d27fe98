/** Small 3-vector helpers. Frames are named by the caller (ENU, reflector body, ECEF); these are frame-free. */
export type Vec3 = readonly [number, number, number];

export const dot = (a: Vec3, b: Vec3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
export const cross = (a: Vec3, b: Vec3): Vec3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];
export const scale = (a: Vec3, k: number): Vec3 => [a[0] * k, a[1] * k, a[2] * k];
export const add = (a: Vec3, b: Vec3): Vec3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
export const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
export const norm = (a: Vec3): number => Math.hypot(a[0], a[1], a[2]);
export function normalize(a: Vec3): Vec3 {
  const n = norm(a);
  if (!(n > 0)) throw new RangeError(`cannot normalise a zero-length vector`);
  return scale(a, 1 / n);
}

/** Angle between two vectors, radians, accurate near 0 and π (atan2 of |a×b| and a·b). */
export const angleBetweenRad = (a: Vec3, b: Vec3): number => Math.atan2(norm(cross(a, b)), dot(a, b));
