/**
 * What a probe geometry may be: limits set by float arithmetic and by the
 * probe's own grids. A probe walker works in units of the largest contact
 * radius (ProbeGeometry scales by it), so what matters is the set's extent in
 * those units and the smallest radius relative to the largest:
 *
 *  - extent (largest distance of a disk edge from the middle of the set, in
 *    largest contact radii) at most MAX_PROBE_EXTENT: the launch circle, the
 *    free-distance grid and the occupancy index all span the extent, and the
 *    float spacing there (extent × 2^-52) must stay far below the smallest
 *    step; x = [0, 1e300] with r = 1, or r = 1e-300, gave infinite grids;
 *  - smallest radius at least MIN_PROBE_RADIUS_RATIO of the largest: the
 *    straight final steps are min_step largest radii long and would step over
 *    far smaller disks;
 *  - min_step at least max(1e-6, extent × 2^-40): a step must move the
 *    walker by at least 2^12 float spacings anywhere in the set (exact
 *    arithmetic, no source needed).
 *
 * Every problem is one line naming the field the caller gives.
 */
import type { DiskSet } from './disk-set.js';

/** A set whose shape is checked: disks, or balls when z is given (their radius as r). */
export type SizedSet = DiskSet & { z?: ArrayLike<number> };

/** Largest extent of a probed set, in largest contact radii. */
export const MAX_PROBE_EXTENT = 1e7;
/** Smallest contact radius relative to the largest. */
export const MIN_PROBE_RADIUS_RATIO = 1e-6;

/** The smallest probe min_step for a set of this extent (rounded up to three significant digits). */
export function probeMinStepFloor(extent: number): number {
  const floor = Math.max(1e-6, extent * 2 ** -40);
  let shown = Number(floor.toPrecision(3));
  if (shown < floor) shown = Number((floor * 1.005).toPrecision(3));
  return shown;
}

/** Extent of the set in largest contact radii (Infinity when the arithmetic overflows), and the radius ratio; a set with z (balls in 3D) counts its z axis too. */
export function probeSetShape(set: SizedSet): { extent: number; radiusRatio: number } {
  const n = set.count;
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity, minZ = 0, maxZ = 0, rMax = 0, rMin = Infinity;
  const z = set.z;
  if (z !== undefined && n > 0) {
    minZ = Infinity;
    maxZ = -Infinity;
  }
  for (let i = 0; i < n; i++) {
    const x = set.x[i], y = set.y[i];
    const r = typeof set.r === 'number' ? set.r : set.r[i];
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
    if (z !== undefined) {
      if (z[i] < minZ) minZ = z[i];
      if (z[i] > maxZ) maxZ = z[i];
    }
    if (r > rMax) rMax = r;
    if (r < rMin) rMin = r;
  }
  // half the diagonal of the bounding box plus the largest radius bounds every disk (ball) edge from the middle
  const hx = 0.5 * maxX - 0.5 * minX;
  const hy = 0.5 * maxY - 0.5 * minY;
  const hz = 0.5 * maxZ - 0.5 * minZ;
  const extent = ((z === undefined ? Math.hypot(hx, hy) : Math.hypot(hx, hy, hz)) + rMax) / rMax;
  return { extent: Number.isFinite(extent) ? extent : Infinity, radiusRatio: rMin / rMax };
}

/**
 * The one-line problem of a set (and the probe step), or null. `field` names
 * the set as the caller knows it ("points", "csv", "INPUT file.csv").
 */
export function probeGeometryProblem(set: SizedSet, minStep: number | null, field: string, stepField = 'min_step'): string | null {
  if (set.count < 1) return null;
  const { extent, radiusRatio } = probeSetShape(set);
  if (!(extent <= MAX_PROBE_EXTENT)) {
    return `${field}: the set spans ${extent.toPrecision(3)} largest contact radii from its middle; allowed: at most ${MAX_PROBE_EXTENT} (coordinates and radii in one unit)`;
  }
  if (!(radiusRatio >= MIN_PROBE_RADIUS_RATIO)) {
    return `${field}: the smallest contact radius is ${radiusRatio.toPrecision(3)} of the largest; allowed: at least ${MIN_PROBE_RADIUS_RATIO}`;
  }
  if (minStep !== null) {
    const floor = probeMinStepFloor(extent);
    if (!(minStep >= floor)) return `${stepField}: ${minStep} is out of range; allowed: a number from ${floor} to 1 for this set (largest contact radii; a smaller step is lost in the float spacing)`;
  }
  return null;
}
