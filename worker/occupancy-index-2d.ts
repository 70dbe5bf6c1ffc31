/**
 * Multi-resolution occupancy index of a planar cluster of unit-diameter disks.
 * It answers one question fast: a lower bound on how far a walker's centre
 * can move in any direction before it touches a disk, i.e. on
 * (distance from the walker to the nearest particle centre) − 1.
 *
 * Levels (all cell sizes are powers of two, so cell coordinates
 * floor(x · 2^-k) are computed exactly in floating point):
 *  - level 0 lists: cells of side 2; each stored cell holds a linked list of
 *    the particles whose centres lie in it (newest first). When the walker's
 *    level-0 cell is marked (a centre within the 3×3 block around it), that
 *    block is scanned exactly.
 *  - marks at every level k ≥ 0: cells of side 2^(k+1) (level 0's cells are
 *    the same as the lists' cells); a cell is *marked* when a particle
 *    centre lies in it or in one of its 8 neighbours. If the walker's cell is
 *    unmarked, no centre lies within the 3×3 block, so the nearest centre is
 *    at least (side + distance from the walker to its own cell's edge) away.
 *    Marks are monotone in k (an unmarked cell's children are unmarked), so
 *    the largest unmarked level is unique and the query result does not
 *    depend on where the search starts.
 * Every level is a sparse tiled grid (worker/tiled-grid.ts): memory grows
 * with the number of particles, not with the area.
 */

import { TiledGrid } from './tiled-grid.js';

/** Mark levels 0..MAX_LEVEL; the coarsest cell has side 2^(MAX_LEVEL+1) = 2^25 diameters. */
const MAX_LEVEL = 24;
/** Bit in a level-k cell value: the cell or a neighbour holds a centre. */
const MARKED = 1;
/** Bit in a level-k cell value: the cell itself holds a centre. */
const HOLDS = 2;
const MAX_NEAR = 512;
/** SCALES[k] = 1 / (cell side at level k) = 2^-(k+1); SIDES[k] = 2^(k+1). */
const SCALES = new Float64Array(MAX_LEVEL + 2);
const SIDES = new Float64Array(MAX_LEVEL + 2);
for (let k = 0; k <= MAX_LEVEL + 1; k++) {
  SIDES[k] = 2 ** (k + 1);
  SCALES[k] = 2 ** -(k + 1);
}

export class OccupancyIndex2d {
  /** Particles gathered by the last exact scan (valid when nearCount >= 0). */
  readonly near = new Int32Array(MAX_NEAR);
  /** Number of entries in `near`, or -1 when the last query did not scan exactly. */
  nearCount = -1;

  private readonly fine: TiledGrid;
  /** marks[k]: marked cells of side 2^(k+1), k = 0..MAX_LEVEL. */
  private readonly marks: TiledGrid[] = [];
  private next: Int32Array;
  /** Level at which the next search starts (a speed hint only). */
  private guess = 1;

  constructor(
    private x: Float64Array,
    private y: Float64Array,
    expectedParticles: number,
  ) {
    this.next = new Int32Array(Math.max(16, expectedParticles));
    this.fine = new TiledGrid(-1, Math.max(64, expectedParticles >> 5));
    let expect = Math.max(64, expectedParticles >> 3);
    for (let k = 0; k <= MAX_LEVEL; k++) {
      this.marks.push(new TiledGrid(0, Math.max(4, expect)));
      expect = expect >> 2;
    }
  }

  /** Bytes held by the index. */
  get bytes(): number {
    let b = this.fine.bytes + this.next.byteLength;
    for (const t of this.marks) b += t.bytes;
    return b;
  }

  /** Point the index at (possibly reallocated) coordinate arrays holding the same particles. */
  rebind(x: Float64Array, y: Float64Array): void {
    this.x = x;
    this.y = y;
  }

  /** Add particle i (centre x[i], y[i]). Particles must be inserted in arrival order. */
  insert(i: number): void {
    if (i >= this.next.length) {
      const bigger = new Int32Array(Math.max(i + 1, this.next.length * 2));
      bigger.set(this.next);
      this.next = bigger;
    }
    const px = this.x[i];
    const py = this.y[i];
    const cx = Math.floor(px * 0.5);
    const cy = Math.floor(py * 0.5);
    this.next[i] = this.fine.get(cx, cy);
    this.fine.set(cx, cy, i);
    let scale = 0.5;
    for (let k = 0; k <= MAX_LEVEL; k++, scale *= 0.5) {
      const t = this.marks[k];
      const ix = Math.floor(px * scale);
      const iy = Math.floor(py * scale);
      const old = t.orBits(ix, iy, MARKED | HOLDS);
      // A cell that already holds a centre has its neighbours marked, and so
      // does every coarser cell containing it: nothing left to do.
      if ((old & HOLDS) !== 0) break;
      t.orBits(ix - 1, iy - 1, MARKED);
      t.orBits(ix, iy - 1, MARKED);
      t.orBits(ix + 1, iy - 1, MARKED);
      t.orBits(ix - 1, iy, MARKED);
      t.orBits(ix + 1, iy, MARKED);
      t.orBits(ix - 1, iy + 1, MARKED);
      t.orBits(ix, iy + 1, MARKED);
      t.orBits(ix + 1, iy + 1, MARKED);
    }
  }

  /**
   * Lower bound on (distance from (wx, wy) to the nearest particle centre) − 1,
   * exact when that distance is below 2 + (distance to the level-0 cell edge).
   * When the answer comes from the exact scan, the particles of the scanned
   * 3×3 level-0 block (every centre within distance 2 of the walker) are left
   * in `near[0 .. nearCount)`; otherwise nearCount = -1.
   */
  freeRadius(wx: number, wy: number): number {
    let k = this.guess;
    if (this.isMarked(k, wx, wy)) {
      while (k > 0 && this.isMarked(k - 1, wx, wy)) k--;
      if (k === 0) {
        this.guess = 0;
        return this.exactScan(wx, wy);
      }
      k--; // level k-1 is the largest unmarked one
    } else {
      while (k < MAX_LEVEL && !this.isMarked(k + 1, wx, wy)) k++;
    }
    this.guess = k;
    this.nearCount = -1;
    const side = SIDES[k];
    const inv = SCALES[k];
    const ex = wx - Math.floor(wx * inv) * side;
    const ey = wy - Math.floor(wy * inv) * side;
    const edge = Math.min(ex, side - ex, ey, side - ey);
    return side + edge - 1;
  }

  private isMarked(k: number, wx: number, wy: number): boolean {
    const scale = SCALES[k];
    return (this.marks[k].get(Math.floor(wx * scale), Math.floor(wy * scale)) & MARKED) !== 0;
  }

  private exactScan(wx: number, wy: number): number {
    const cx = Math.floor(wx * 0.5);
    const cy = Math.floor(wy * 0.5);
    const xs = this.x;
    const ys = this.y;
    const next = this.next;
    const near = this.near;
    const fine = this.fine;
    const pool = fine.pool;
    let n = 0;
    let best = Infinity;
    // three rows of three cells; a row's cells share a tile unless cx−1 and
    // cx+1 straddle a tile edge
    for (let iy = cy - 1; iy <= cy + 1; iy++) {
      const ty = iy >> 3;
      const rowOffset = (iy & 7) << 3;
      let tx = (cx - 1) >> 3;
      let base = fine.tileBase(tx, ty);
      for (let ix = cx - 1; ix <= cx + 1; ix++) {
        if (ix >> 3 !== tx) {
          tx = ix >> 3;
          base = fine.tileBase(tx, ty);
        }
        if (base < 0) continue;
        let p = pool[base + rowOffset + (ix & 7)];
        while (p >= 0) {
          const ddx = xs[p] - wx;
          const ddy = ys[p] - wy;
          const d2 = ddx * ddx + ddy * ddy;
          if (d2 < best) best = d2;
          if (n < MAX_NEAR) near[n++] = p;
          p = next[p];
        }
      }
    }
    this.nearCount = n;
    const ex = wx - cx * 2;
    const ey = wy - cy * 2;
    const reach = 2 + Math.min(ex, 2 - ex, ey, 2 - ey);
    const nearest = Math.sqrt(best);
    return (nearest < reach ? nearest : reach) - 1;
  }
}
