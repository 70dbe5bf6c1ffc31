/**
 * Sparse storage of a 2D grid in tiles of 8 × 8 cells: this directory maps
 * tile coordinates (ix >> 3, iy >> 3) to tile numbers 0, 1, 2, ... in
 * allocation order, through a hash table (worker/index/cell-hash-table.ts). The
 * grids built on it (worker/index/tiled-grids.ts) keep 64 cell values per tile in
 * one typed array, so neighbouring cells share memory, and memory grows
 * with the number of tiles touched, never with the area spanned. The last
 * tile looked up is cached: a walker's successive queries rarely hash.
 */

import { CellHashTable, type SharedCellHashTable } from './cell-hash-table.js';

/** A directory in shared memory (TileDirectory.shared). */
export interface SharedTileDirectory {
  table: SharedCellHashTable;
  tiles: number;
}

export const TILE_SHIFT = 3;
export const TILE_MASK = (1 << TILE_SHIFT) - 1;
export const TILE_CELLS = 1 << (2 * TILE_SHIFT);

export class TileDirectory {
  private readonly table: CellHashTable;
  private tiles = 0;
  private cacheTx = -2147483648;
  private cacheTy = -2147483648;
  private cacheTile = -1;

  /** With `from`, the directory reads that shared state (read only: no tile may be added). */
  constructor(expectedTiles: number, from?: SharedTileDirectory) {
    this.table = new CellHashTable(expectedTiles, from?.table);
    if (from) this.tiles = from.tiles;
  }

  /** A copy in shared memory: the same tile numbers. */
  shared(): SharedTileDirectory {
    return { table: this.table.shared(), tiles: this.tiles };
  }

  get count(): number {
    return this.tiles;
  }

  get bytes(): number {
    return this.table.bytes;
  }

  /** Tile number of tile (tx, ty), or -1 when it was never allocated. */
  find(tx: number, ty: number): number {
    if (tx === this.cacheTx && ty === this.cacheTy) return this.cacheTile;
    const t = this.table.get(tx, ty, -1);
    this.cacheTx = tx;
    this.cacheTy = ty;
    this.cacheTile = t;
    return t;
  }

  /** Tile number of tile (tx, ty), allocating the next number when absent. */
  findOrAdd(tx: number, ty: number): number {
    let t = this.find(tx, ty);
    if (t < 0) {
      t = this.tiles++;
      this.table.set(tx, ty, t);
      this.cacheTile = t;
    }
    return t;
  }
}

/** Offset of cell (ix, iy) inside its tile. */
export function cellInTile(ix: number, iy: number): number {
  return ((iy & TILE_MASK) << TILE_SHIFT) + (ix & TILE_MASK);
}
