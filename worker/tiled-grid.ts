/**
 * A sparse 2D grid of int32 cell values stored in tiles of 8 × 8 cells.
 * Tiles are allocated only when a cell in them is written, and found through
 * a hash table of tile coordinates (worker/cell-hash-table.ts), so memory
 * grows with the number of tiles touched, never with the area spanned.
 * Neighbouring cells share a tile (256 contiguous bytes), and the last tile
 * looked up is cached, so a walker's successive queries rarely hash at all.
 */

import { CellHashTable } from './cell-hash-table.js';

const SHIFT = 3;
const SIDE = 1 << SHIFT;
const MASK = SIDE - 1;
const TILE_CELLS = SIDE * SIDE;

export class TiledGrid {
  private readonly dir: CellHashTable;
  /** Cell values, 64 per tile; read directly by hot loops (re-read after any write: it may be reallocated). */
  pool: Int32Array;
  private tiles = 0;
  private cacheTx = -2147483648;
  private cacheTy = -2147483648;
  private cacheBase = -1;

  /** `blank` is the value of a cell never written. */
  constructor(
    private readonly blank: number,
    expectedTiles = 64,
  ) {
    this.dir = new CellHashTable(expectedTiles);
    this.pool = new Int32Array(Math.max(4, expectedTiles) * TILE_CELLS).fill(blank);
  }

  /** Number of tiles allocated. */
  get tileCount(): number {
    return this.tiles;
  }

  get bytes(): number {
    return this.pool.byteLength + this.dir.bytes;
  }

  /** Value of cell (ix, iy); `blank` when it was never written. */
  get(ix: number, iy: number): number {
    const tx = ix >> SHIFT;
    const ty = iy >> SHIFT;
    let base: number;
    if (tx === this.cacheTx && ty === this.cacheTy) base = this.cacheBase;
    else {
      base = this.dir.get(tx, ty, -1);
      this.cacheTx = tx;
      this.cacheTy = ty;
      this.cacheBase = base;
    }
    if (base < 0) return this.blank;
    return this.pool[base + ((iy & MASK) << SHIFT) + (ix & MASK)];
  }

  /**
   * Offset in `pool` of tile (tx, ty) = (ix >> 3, iy >> 3), or -1 when the
   * tile was never written. Cell (ix, iy) is at offset + ((iy & 7) << 3) + (ix & 7).
   */
  tileBase(tx: number, ty: number): number {
    if (tx === this.cacheTx && ty === this.cacheTy) return this.cacheBase;
    const base = this.dir.get(tx, ty, -1);
    this.cacheTx = tx;
    this.cacheTy = ty;
    this.cacheBase = base;
    return base;
  }

  /** Set cell (ix, iy) to value. */
  set(ix: number, iy: number, value: number): void {
    this.pool[this.cellOffset(ix, iy)] = value;
  }

  /** Or `bits` into cell (ix, iy); returns the old value. */
  orBits(ix: number, iy: number, bits: number): number {
    const o = this.cellOffset(ix, iy);
    const old = this.pool[o];
    this.pool[o] = old | bits;
    return old;
  }

  private cellOffset(ix: number, iy: number): number {
    const tx = ix >> SHIFT;
    const ty = iy >> SHIFT;
    let base = tx === this.cacheTx && ty === this.cacheTy ? this.cacheBase : this.dir.get(tx, ty, -1);
    if (base < 0) {
      base = this.tiles * TILE_CELLS;
      this.tiles++;
      if (base + TILE_CELLS > this.pool.length) {
        const bigger = new Int32Array(this.pool.length * 2).fill(this.blank);
        bigger.set(this.pool);
        this.pool = bigger;
      }
      this.dir.set(tx, ty, base);
    }
    this.cacheTx = tx;
    this.cacheTy = ty;
    this.cacheBase = base;
    return base + ((iy & MASK) << SHIFT) + (ix & MASK);
  }
}
