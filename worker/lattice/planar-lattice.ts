/**
 * The two planar lattices of the lattice models, with spacing 1: integer site
 * coordinates (i, j), their nearest neighbours, and the map to the plane.
 *
 *  - square: site (i, j) sits at (x, y) = (i, j); 4 neighbours
 *    (±1, 0), (0, ±1).
 *  - triangular: site (i, j) sits at (x, y) = (i + j/2, j·√3/2) (basis
 *    vectors (1, 0) and (1/2, √3/2)); 6 neighbours (±1, 0), (0, ±1),
 *    (1, −1), (−1, 1), all at distance 1.
 *
 * `siteOf` inverts the map exactly for points that are lattice sites (it
 * rounds), so positions emitted in the plane rebuild the lattice state on
 * resume.
 */

export interface PlanarLattice {
  name: 'square' | 'triangular';
  /** Number of nearest neighbours (coordination number). */
  neighbours: number;
  /** Neighbour offsets: site (i + DI[k], j + DJ[k]) for k < neighbours. */
  di: Int32Array;
  dj: Int32Array;
  /** Lattice-axis fold of the anisotropy measures (4 square, 6 triangular). */
  fold: 4 | 6;
}

export const SQUARE: PlanarLattice = {
  name: 'square',
  neighbours: 4,
  di: Int32Array.of(1, -1, 0, 0),
  dj: Int32Array.of(0, 0, 1, -1),
  fold: 4,
};

export const TRIANGULAR: PlanarLattice = {
  name: 'triangular',
  neighbours: 6,
  di: Int32Array.of(1, -1, 0, 0, 1, -1),
  dj: Int32Array.of(0, 0, 1, -1, -1, 1),
  fold: 6,
};

export const HALF_SQRT3 = Math.sqrt(3) / 2;

/** Plane coordinates of site (i, j). */
export const planeOf = { x: 0, y: 0 };
export function toPlane(lattice: PlanarLattice, i: number, j: number): void {
  if (lattice.name === 'square') {
    planeOf.x = i;
    planeOf.y = j;
  } else {
    planeOf.x = i + 0.5 * j;
    planeOf.y = j * HALF_SQRT3;
  }
}

/** Site coordinates of a plane point that is a lattice site (nearest site otherwise, by rounding in lattice coordinates). */
export const siteOf = { i: 0, j: 0 };
export function toSite(lattice: PlanarLattice, x: number, y: number): void {
  if (lattice.name === 'square') {
    siteOf.i = Math.round(x);
    siteOf.j = Math.round(y);
  } else {
    const j = Math.round(y / HALF_SQRT3);
    siteOf.j = j;
    siteOf.i = Math.round(x - 0.5 * j);
  }
}
