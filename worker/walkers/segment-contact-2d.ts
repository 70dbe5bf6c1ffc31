/**
 * First contact of a straight step with a set of disks: the smallest t in
 * [0, maxT] with |w + t·u − p_j| = r_j over the candidate disks j, where u is
 * a unit vector. Shared by the growth kernel's final approach (all r_j = 1)
 * and the probe walkers (a point walker and disks of their own radii).
 */

/** t of the last contact found by `firstContact` (valid when it returned >= 0). */
export const contact = { t: 0 };

/**
 * Index j (into nearX/nearY) of the disk the step from (wx, wy) along
 * (ux, uy) touches first within maxT, or -1 when it touches none. Radius of
 * disk j: radii[ids[j]] when `radii` is given, else 1. A walker already in
 * contact up to rounding gets t = 0.
 */
export function firstContact(
  nearX: Float64Array,
  nearY: Float64Array,
  count: number,
  wx: number,
  wy: number,
  ux: number,
  uy: number,
  maxT: number,
  radii: Float64Array | null,
  ids: Int32Array | null,
): number {
  let tHit = maxT;
  let hit = -1;
  for (let j = 0; j < count; j++) {
    const qx = wx - nearX[j];
    const qy = wy - nearY[j];
    const b = qx * ux + qy * uy;
    if (b >= 0) continue; // moving away from the disk's centre
    const rr = radii === null || ids === null ? 1 : radii[ids[j]];
    const c = qx * qx + qy * qy - rr * rr;
    const disc = b * b - c;
    if (disc < 0) continue;
    let t = -b - Math.sqrt(disc);
    if (t < 0) t = 0;
    if (t < tHit) {
      tHit = t;
      hit = j;
    }
  }
  contact.t = tHit;
  return hit;
}
