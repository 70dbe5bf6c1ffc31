/**
 * Resuming a planar lattice kernel that keeps its cluster in PerimeterSites
 * (lattice DBM, both samplers, and lattice Eden): the checkpoint's positions
 * are replayed in arrival order, each checked to be a site of the lattice
 * (its plane point maps back to itself exactly) and, after the first, a
 * perimeter site of the cluster before it; then the kernel's own `join`
 * adds it, which rebuilds the perimeter list in the same slot order as the
 * uninterrupted run. A position that fails either check is refused with a
 * RangeError naming its index.
 */
import type { PerimeterSites } from './perimeter-sites.js';
import { type PlanarLattice, planeOf, siteOf, toPlane, toSite } from './planar-lattice.js';

/** `join(i, j, k)` adds site (i, j), the checkpoint's k-th position, to the kernel's cluster. */
export function replayCheckpointSites(
  lattice: PlanarLattice,
  positions: Float64Array,
  count: number,
  perimeter: PerimeterSites,
  join: (i: number, j: number, k: number) => void,
): void {
  for (let k = 0; k < count; k++) {
    const x = positions[2 * k];
    const y = positions[2 * k + 1];
    toSite(lattice, x, y);
    const i = siteOf.i;
    const j = siteOf.j;
    toPlane(lattice, i, j);
    if (planeOf.x !== x || planeOf.y !== y) throw new RangeError(`checkpoint position ${k} is not a lattice site`);
    if (k > 0 && perimeter.valueAt(i, j) <= 0) throw new RangeError(`checkpoint position ${k} is not a perimeter site of the cluster before it`);
    join(i, j, k);
  }
}
