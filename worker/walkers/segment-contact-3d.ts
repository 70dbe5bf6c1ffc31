/**
 * First contact of a straight step with a set of balls in three dimensions:
 * the smallest t in [0, maxT] with |w + t·u − p_j| = radius over the
 * candidate centres p_j, where u is a unit vector (exact ray–sphere
 * intersection: t = −b − sqrt(b² − c), b = (w − p)·u, c = |w − p|² − radius²).
 */

/** t of the last contact found by `firstContact3d` (valid when it returned >= 0). */
export const contact3 = { t: 0 };

/**
 * Index j of the ball the step from (wx, wy, wz) along (ux, uy, uz) touches
 * first within maxT, or -1 when it touches none. A walker already in contact
 * up to rounding gets t = 0.
 */
export function firstContact3d(
  nearX: Float64Array,
  nearY: Float64Array,
  nearZ: Float64Array,
  count: number,
  wx: number,
  wy: number,
  wz: number,
  ux: number,
  uy: number,
  uz: number,
  maxT: number,
  radius: number,
): number {
  let tHit = maxT;
  let hit = -1;
  const r2 = radius * radius;
  for (let j = 0; j < count; j++) {
    const qx = wx - nearX[j];
    const qy = wy - nearY[j];
    const qz = wz - nearZ[j];
    const b = qx * ux + qy * uy + qz * uz;
    if (b >= 0) continue; // moving away from the ball's centre
    const c = qx * qx + qy * qy + qz * qz - r2;
    const disc = b * b - c;
    if (disc < 0) continue;
    let t = -b - Math.sqrt(disc);
    if (t < 0) t = 0;
    if (t < tHit) {
      tHit = t;
      hit = j;
    }
  }
  contact3.t = tHit;
  return hit;
}
