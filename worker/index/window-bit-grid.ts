/**
 * Sparse grid of one bit per cell, laid out for reading the 5 × 5 window of
 * cells around any cell with one tile lookup: each tile owns a core of
 * 16 × 16 cells and also keeps a copy of the 2 cells around its core on
 * every side (its apron), 20 × 20 bits in all, one int32 word per row. The
 * window of Chebyshev radius WINDOW_RADIUS around a cell of a tile's core
 * lies inside that tile. Setting a bit writes it into the owning tile and
 * into every neighbour whose apron covers the cell (at most four tiles).
 * Tiles live on a TileDirectory (worker/index/tile-directory.ts), so memory grows
 * with the number of tiles touched, never with the area spanned.
 */

import { TileDirectory } from './tile-directory.js';
import { type SharedTiledGrid } from './tiled-grids.js';
import { poolGrowth, reservedArray } from './pool-growth.js';
import { sharedInt32 } from '../core/shared-arrays.js';

/** Cells of a window on each side of its centre cell. */
export const WINDOW_RADIUS = 2;
/** log2 of the core's side in cells. */
export const CORE_SHIFT = 4;
/** Core side − 1: the cell's column (row) in its tile's core is ix & CORE_MASK. */
export const CORE_MASK = (1 << CORE_SHIFT) - 1;
/** Words (rows) per tile: core plus both aprons. */
export const TILE_ROWS = (1 << CORE_SHIFT) + 2 * WINDOW_RADIUS;

export class WindowBitGrid {
  private readonly dir: TileDirectory;
  /** Tile t's rows are words[t·TILE_ROWS ..]; row r, bit c is cell (16·tx − WINDOW_RADIUS + c, 16·ty − WINDOW_RADIUS + r). Re-read after a set. */
  words: Int32Array;

  /**
   * The directory is sized for `expectedTiles`; the words are reserved for
   * `reserveTiles` (default `expectedTiles`) tiles: zero-filled, they become
   * resident only as tiles are used (worker/index/tiled-grids.ts explains).
   */
  constructor(expectedTiles: number, reserveTiles = expectedTiles, from?: SharedTiledGrid<Int32Array>) {
    this.dir = new TileDirectory(expectedTiles, from?.dir);
    this.words = from ? from.pool : reservedArray((n) => new Int32Array(n), Math.max(4, expectedTiles) * TILE_ROWS, reserveTiles * TILE_ROWS);
  }

  get bytes(): number {
    return this.words.byteLength + this.dir.bytes;
  }

  /** A copy in shared memory of the tiles in use (for reading only: a grid made from it must not be written). */
  shared(): SharedTiledGrid<Int32Array> {
    return { dir: this.dir.shared(), pool: sharedInt32(this.words, this.dir.count * TILE_ROWS) };
  }

  /**
   * Offset in `words` of the first row of the tile owning cell (ix, iy), or
   * -1 when that tile was never written (then no bit is set within the
   * window of any cell of its core). The row of cell (ix, iy + dy) is at
   * offset + (iy & CORE_MASK) + WINDOW_RADIUS + dy, and its bit for column
   * ix + dx is bit (ix & CORE_MASK) + WINDOW_RADIUS + dx.
   */
  tileOffset(ix: number, iy: number): number {
    const t = this.dir.find(ix >> CORE_SHIFT, iy >> CORE_SHIFT);
    return t < 0 ? -1 : t * TILE_ROWS;
  }

  /** Set the bit of cell (ix, iy). */
  set(ix: number, iy: number): void {
    const tx = ix >> CORE_SHIFT;
    const ty = iy >> CORE_SHIFT;
    const cx = ix & CORE_MASK;
    const cy = iy & CORE_MASK;
    // neighbours whose apron covers the cell
    const x0 = cx < WINDOW_RADIUS ? -1 : 0;
    const x1 = cx >= CORE_MASK + 1 - WINDOW_RADIUS ? 1 : 0;
    const y0 = cy < WINDOW_RADIUS ? -1 : 0;
    const y1 = cy >= CORE_MASK + 1 - WINDOW_RADIUS ? 1 : 0;
    for (let dy = y0; dy <= y1; dy++)
      for (let dx = x0; dx <= x1; dx++) {
        const t = this.dir.findOrAdd(tx + dx, ty + dy);
        if ((t + 1) * TILE_ROWS > this.words.length) {
          const bigger = new Int32Array(poolGrowth(this.words.length, t, TILE_ROWS));
          bigger.set(this.words);
          this.words = bigger;
        }
        const row = cy + WINDOW_RADIUS - (dy << CORE_SHIFT);
        const col = cx + WINDOW_RADIUS - (dx << CORE_SHIFT);
        this.words[t * TILE_ROWS + row] |= 1 << col;
      }
  }

  /** Whether the bit of cell (ix, iy) is set (for tests). */
  get(ix: number, iy: number): boolean {
    const o = this.tileOffset(ix, iy);
    if (o < 0) return false;
    return ((this.words[o + (iy & CORE_MASK) + WINDOW_RADIUS] >>> ((ix & CORE_MASK) + WINDOW_RADIUS)) & 1) === 1;
  }
}
