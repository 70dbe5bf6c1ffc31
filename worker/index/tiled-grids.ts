/**
 * Sparse 2D grids on a TileDirectory (worker/index/tile-directory.ts): int32 cell
 * values (list heads) and byte cell values (occupancy marks). Each pool is
 * one typed array with 64 cells per tile, grown by poolGrowth (a quarter at
 * a time once large, so a giant cluster carries little slack).
 */

import { TILE_CELLS, TILE_MASK, TILE_SHIFT, TileDirectory, cellInTile } from './tile-directory.js';

/**
 * Length of a pool of `unit`-sized tiles grown from `length` to hold tile
 * `tile`: doubled while small (fewer copies), a quarter more once past
 * 2^20 entries (the slack stays under 25 % of what is used).
 */
export function poolGrowth(length: number, tile: number, unit: number): number {
  const factor = length < 1 << 20 ? 2 : 1.25;
  const tiles = Math.max(tile + 1, Math.ceil((length / unit) * factor));
  return tiles * unit;
}

export class TiledInt32Grid {
  readonly dir: TileDirectory;
  /** Cell values, 64 per tile (re-read after a write: it may be reallocated). */
  pool: Int32Array;

  /** `blank` is the value of a cell never written. */
  constructor(
    private readonly blank: number,
    expectedTiles: number,
  ) {
    this.dir = new TileDirectory(expectedTiles);
    this.pool = new Int32Array(Math.max(4, expectedTiles) * TILE_CELLS).fill(blank);
  }

  get bytes(): number {
    return this.pool.byteLength + this.dir.bytes;
  }

  get(ix: number, iy: number): number {
    const t = this.dir.find(ix >> TILE_SHIFT, iy >> TILE_SHIFT);
    return t < 0 ? this.blank : this.pool[t * TILE_CELLS + cellInTile(ix, iy)];
  }

  set(ix: number, iy: number, value: number): void {
    const t = this.dir.findOrAdd(ix >> TILE_SHIFT, iy >> TILE_SHIFT);
    if ((t + 1) * TILE_CELLS > this.pool.length) {
      const bigger = new Int32Array(poolGrowth(this.pool.length, t, TILE_CELLS)).fill(this.blank);
      bigger.set(this.pool);
      this.pool = bigger;
    }
    this.pool[t * TILE_CELLS + cellInTile(ix, iy)] = value;
  }
}

export class TiledByteGrid {
  readonly dir: TileDirectory;
  /** Cell values, 64 per tile (one cache line); never-written cells are 0. */
  pool: Uint8Array;

  constructor(expectedTiles: number) {
    this.dir = new TileDirectory(expectedTiles);
    this.pool = new Uint8Array(Math.max(4, expectedTiles) * TILE_CELLS);
  }

  get bytes(): number {
    return this.pool.byteLength + this.dir.bytes;
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
   */
  raiseBlock(ix: number, iy: number, r: number, values: Uint8Array, shift: number): void {
    const low = (1 << shift) - 1;
    const w = 2 * r + 1;
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
          for (let x = x0; x <= x1; x++) {
            const v = values[vrow + x];
            const o = row + (x & TILE_MASK);
            const old = pool[o];
            if (v > old >>> shift) pool[o] = (old & low) | (v << shift);
          }
        }
      }
    }
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
