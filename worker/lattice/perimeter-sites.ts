/**
 * The cluster and its site perimeter on a planar lattice, as the Eden and
 * lattice DBM kernels keep them: one int32 per site in sparse 8 × 8 tiles
 * (worker/index/tiled-grids.ts): 0 = neither in the cluster nor on the
 * perimeter, −1 = in the cluster, k >= 1 = on the perimeter at slot k − 1
 * of the perimeter list. The list (three int32 arrays: i, j and the site's
 * index in the tile pool, so removal needs no directory lookup; grown by
 * doubling) gives O(1) access by slot and O(1) removal: a removed slot is
 * filled with the last entry, whose site value is updated. New perimeter sites are
 * appended in the lattice's fixed neighbour order, so the list's order is a
 * function of the arrival order alone.
 */
import { TiledInt32Grid } from '../index/tiled-grids.js';
import type { PlanarLattice } from './planar-lattice.js';

const OCCUPIED = -1;

export class PerimeterSites {
  readonly sites: TiledInt32Grid;
  /** Site coordinates of the perimeter slots (re-read after occupy: they may be reallocated). */
  perimI = new Int32Array(1024);
  perimJ = new Int32Array(1024);
  /** Pool index of each perimeter site in `sites` (stable while the pool grows). */
  perimCell = new Int32Array(1024);
  count = 0;

  constructor(
    private readonly lattice: PlanarLattice,
    expectedTiles: number,
  ) {
    this.sites = new TiledInt32Grid(0, expectedTiles);
  }

  /** The value of site (i, j): 0, −1 (cluster) or slot + 1 (perimeter). */
  valueAt(i: number, j: number): number {
    return this.sites.get(i, j);
  }

  /** Take slot `slot` out of the perimeter list (its site's value is left for the caller to set, e.g. by occupy). */
  removeSlot(slot: number): void {
    const last = --this.count;
    if (slot !== last) {
      const cell = this.perimCell[last];
      this.perimI[slot] = this.perimI[last];
      this.perimJ[slot] = this.perimJ[last];
      this.perimCell[slot] = cell;
      this.sites.pool[cell] = slot + 1;
    }
  }

  /** Mark (i, j) as a cluster site and append its empty, unlisted neighbours to the perimeter. */
  occupy(i: number, j: number): void {
    this.occupyCell(i, j, this.sites.cellIndex(i, j));
  }

  /**
   * occupy() for a site whose pool index is known (e.g. perimCell[slot] read
   * before removeSlot): its neighbours are addressed from it
   * (TiledInt32Grid.cellIndexNear), without hashing.
   */
  occupyCell(i: number, j: number, cell: number): void {
    const sites = this.sites;
    sites.pool[cell] = OCCUPIED;
    const di = this.lattice.di;
    const dj = this.lattice.dj;
    for (let k = 0; k < di.length; k++) {
      const ni = i + di[k];
      const nj = j + dj[k];
      const nc = sites.cellIndexNear(cell, i, j, ni, nj);
      if (sites.pool[nc] !== 0) continue;
      if (this.count === this.perimI.length) this.grow();
      this.perimI[this.count] = ni;
      this.perimJ[this.count] = nj;
      this.perimCell[this.count] = nc;
      this.count++;
      sites.pool[nc] = this.count;
    }
  }

  private grow(): void {
    const grow = (a: Int32Array<ArrayBuffer>): Int32Array<ArrayBuffer> => {
      const b = new Int32Array(2 * a.length);
      b.set(a);
      return b;
    };
    this.perimI = grow(this.perimI);
    this.perimJ = grow(this.perimJ);
    this.perimCell = grow(this.perimCell);
  }

  /** Bytes held by the site tiles and the list (for benchmarks). */
  get bytes(): number {
    return this.sites.bytes + this.perimI.byteLength + this.perimJ.byteLength + this.perimCell.byteLength;
  }
}
