/**
 * Sparse 2D grids on a TileDirectory (worker/index/tile-directory.ts): int32 cell
 * values (list heads) and byte cell values (occupancy marks). Each pool is
 * one typed array with 64 cells per tile, grown by poolGrowth (a quarter at
 * a time once large, so a giant cluster carries little slack).
 *
 * A pool can also be *reserved* for more tiles than expected (`reserveTiles`)
 * when its blank value is 0: a large zero-filled typed array is mapped by
 * the allocator without touching its pages (measured on Node 20 / Linux:
 * allocating a 1 GB Int32Array left the resident size unchanged), and tiles
 * are numbered in allocation order, so only the pages of the tiles in use
 * become resident. A pool reserved for every tile a run will need never
 * grows, so it is never copied: no old and new copies side by side, no
 * discarded array waiting for the garbage collector.
 */

import { TILE_CELLS, TILE_MASK, TILE_SHIFT, TileDirectory, cellInTile, type SharedTileDirectory } from './tile-directory.js';
import { sharedInt32, sharedUint8 } from '../core/shared-arrays.js';
import { poolGrowth, reservedArray } from './pool-growth.js';

/** A tiled grid in shared memory (the grids' `shared()`): the directory and the pool of the tiles in use. */
export interface SharedTiledGrid<P> {
  dir: SharedTileDirectory;
  pool: P;
}

export class TiledInt32Grid {
  readonly dir: TileDirectory;
  /** Cell values, 64 per tile (re-read after a write: it may be reallocated). */
  pool: Int32Array;

  /**
   * `blank` is the value of a cell never written. With blank 0 the pool is
   * reserved for `reserveTiles` tiles (default `expectedTiles`) without
   * becoming resident (see the file's comment); the directory is sized for
   * `expectedTiles`.
   */
  constructor(
    private readonly blank: number,
    expectedTiles: number,
    reserveTiles = expectedTiles,
    from?: SharedTiledGrid<Int32Array>,
  ) {
    this.dir = new TileDirectory(expectedTiles, from?.dir);
    if (from) {
      this.pool = from.pool;
      return;
    }
    const tiles = Math.max(4, expectedTiles);
    this.pool = reservedArray((n) => new Int32Array(n), tiles * TILE_CELLS, blank === 0 ? reserveTiles * TILE_CELLS : 0);
    if (blank !== 0) this.pool.fill(blank);
  }

  get bytes(): number {
    return this.pool.byteLength + this.dir.bytes + this.around.byteLength;
  }

  /** A copy in shared memory of the tiles in use (for reading only: a grid made from it must not be written). */
  shared(): SharedTiledGrid<Int32Array> {
    return { dir: this.dir.shared(), pool: sharedInt32(this.pool, this.dir.count * TILE_CELLS) };
  }

  get(ix: number, iy: number): number {
    const t = this.dir.find(ix >> TILE_SHIFT, iy >> TILE_SHIFT);
    return t < 0 ? this.blank : this.pool[t * TILE_CELLS + cellInTile(ix, iy)];
  }

  set(ix: number, iy: number, value: number): void {
    // cellIndex may reallocate the pool: take the index before reading `pool`
    const cell = this.cellIndex(ix, iy);
    this.pool[cell] = value;
  }

  /**
   * Index in `pool` of cell (ix, iy), allocating its tile (all cells blank)
   * when absent. The index stays valid when the pool grows (tiles keep their
   * numbers); re-read `pool` after this call.
   */
  cellIndex(ix: number, iy: number): number {
    const t = this.dir.findOrAdd(ix >> TILE_SHIFT, iy >> TILE_SHIFT);
    if ((t + 1) * TILE_CELLS > this.pool.length) {
      const bigger = new Int32Array(poolGrowth(this.pool.length, t, TILE_CELLS));
      if (this.blank !== 0) bigger.fill(this.blank);
      bigger.set(this.pool);
      this.pool = bigger;
    }
    return t * TILE_CELLS + cellInTile(ix, iy);
  }

  /**
   * cellIndex(nx, ny) for a cell (nx, ny) in the tile of cell (ix, iy), whose
   * pool index is `cell`, or in one of the 8 tiles around it. The tile
   * numbers of the 3 × 3 block around each tile are cached (9 int32 per
   * tile, −1 until first asked), so stepping to a neighbouring cell rarely
   * hashes. Same index as cellIndex(nx, ny), and allocates the same tiles.
   */
  cellIndexNear(cell: number, ix: number, iy: number, nx: number, ny: number): number {
    const dtx = (nx >> TILE_SHIFT) - (ix >> TILE_SHIFT);
    const dty = (ny >> TILE_SHIFT) - (iy >> TILE_SHIFT);
    const t = cell >> (2 * TILE_SHIFT);
    if (dtx === 0 && dty === 0) return (t << (2 * TILE_SHIFT)) + cellInTile(nx, ny);
    const k = 9 * t + 3 * (dtx + 1) + dty + 1;
    if (k >= this.around.length) this.growAround(k);
    let nt = this.around[k];
    if (nt < 0) {
      nt = this.cellIndex(nx, ny) >> (2 * TILE_SHIFT);
      this.around[k] = nt;
    }
    return (nt << (2 * TILE_SHIFT)) + cellInTile(nx, ny);
  }

  /** Tile numbers around each tile (see cellIndexNear). */
  private around = new Int32Array(0);

  private growAround(k: number): void {
    let size = Math.max(9 * 64, this.around.length);
    while (size <= k) size *= 2;
    const bigger = new Int32Array(size).fill(-1);
    bigger.set(this.around);
    this.around = bigger;
  }
}

export class TiledByteGrid {
  readonly dir: TileDirectory;
  /** Cell values, 64 per tile (one cache line); never-written cells are 0. */
  pool: Uint8Array;

  /** The pool is reserved for `reserveTiles` tiles (default `expectedTiles`; see the file's comment), the directory sized for `expectedTiles`. */
  constructor(expectedTiles: number, reserveTiles = expectedTiles, from?: SharedTiledGrid<Uint8Array>) {
    this.dir = new TileDirectory(expectedTiles, from?.dir);
    this.pool = from ? from.pool : reservedArray((n) => new Uint8Array(n), Math.max(4, expectedTiles) * TILE_CELLS, reserveTiles * TILE_CELLS);
  }

  get bytes(): number {
    return this.pool.byteLength + this.dir.bytes;
  }

  /** A copy in shared memory of the tiles in use (for reading only: a grid made from it must not be written). */
  shared(): SharedTiledGrid<Uint8Array> {
    return { dir: this.dir.shared(), pool: sharedUint8(this.pool, this.dir.count * TILE_CELLS) };
  }

  get tileCount(): number {
    return this.dir.count;
  }

  get(ix: number, iy: number): number {
    const t = this.dir.find(ix >> TILE_SHIFT, iy >> TILE_SHIFT);
    return t < 0 ? 0 : this.pool[t * TILE_CELLS + cellInTile(ix, iy)];
  }

  /**
   * For every cell of the (2r + 1)² block centred on (ix, iy): raise the
   * field in bits `shift`.. of the cell to at least values[(dy + r)·(2r + 1) + dx + r]
   * (bits below `shift` are kept). Tiles are visited one at a time.
   * With `orRadius` m >= 0, the cells of the inner (2m + 1)² block (m <= r)
   * also get `bits` (below `shift`) or-ed in, and those that had none of
   * them are listed as (x, y) pairs in `fresh`; the count of such cells is
   * returned (0 when m < 0).
   */
  raiseBlock(ix: number, iy: number, r: number, values: Uint8Array, shift: number, orRadius = -1, bits = 0, fresh: Int32Array | null = null): number {
    const low = (1 << shift) - 1;
    const w = 2 * r + 1;
    let count = 0;
    for (let ty = (iy - r) >> TILE_SHIFT; ty <= (iy + r) >> TILE_SHIFT; ty++) {
      const y0 = Math.max(iy - r, ty << TILE_SHIFT);
      const y1 = Math.min(iy + r, (ty << TILE_SHIFT) + TILE_MASK);
      for (let tx = (ix - r) >> TILE_SHIFT; tx <= (ix + r) >> TILE_SHIFT; tx++) {
        const x0 = Math.max(ix - r, tx << TILE_SHIFT);
        const x1 = Math.min(ix + r, (tx << TILE_SHIFT) + TILE_MASK);
        const t = this.dir.findOrAdd(tx, ty);
        if ((t + 1) * TILE_CELLS > this.pool.length) {
          const bigger = new Uint8Array(poolGrowth(this.pool.length, t, TILE_CELLS));
          bigger.set(this.pool);
          this.pool = bigger;
        }
        const pool = this.pool;
        for (let y = y0; y <= y1; y++) {
          const row = t * TILE_CELLS + ((y & TILE_MASK) << TILE_SHIFT);
          const vrow = (y - iy + r) * w + r - ix;
          const inner = y >= iy - orRadius && y <= iy + orRadius;
          for (let x = x0; x <= x1; x++) {
            const v = values[vrow + x];
            const o = row + (x & TILE_MASK);
            const old = pool[o];
            let now = v > old >>> shift ? (old & low) | (v << shift) : old;
            if (inner && x >= ix - orRadius && x <= ix + orRadius) {
              if ((old & bits) === 0 && fresh !== null) {
                fresh[2 * count] = x;
                fresh[2 * count + 1] = y;
                count++;
              }
              now |= bits;
            }
            if (now !== old) pool[o] = now;
          }
        }
      }
    }
    return count;
  }

  /** Or `bits` into cell (ix, iy); returns the old value. */
  orBits(ix: number, iy: number, bits: number): number {
    const t = this.dir.findOrAdd(ix >> TILE_SHIFT, iy >> TILE_SHIFT);
    if ((t + 1) * TILE_CELLS > this.pool.length) {
      const bigger = new Uint8Array(poolGrowth(this.pool.length, t, TILE_CELLS));
      bigger.set(this.pool);
      this.pool = bigger;
    }
    const o = t * TILE_CELLS + cellInTile(ix, iy);
    const old = this.pool[o];
    this.pool[o] = old | bits;
    return old;
  }
}
