/**
 * Sparse storage of a 2D grid in tiles of 8 × 8 cells: this directory maps
 * tile coordinates (ix >> 3, iy >> 3) to tile numbers 0, 1, 2, ... in
 * allocation order. The grids built on it (worker/index/tiled-grids.ts) keep
 * 64 cell values per tile in one typed array, so neighbouring cells share
 * memory, and memory grows with the number of tiles touched, never with the
 * area spanned.
 *
 * Two levels, so that neighbouring tiles are found without hashing:
 * tiles are grouped in *blocks* of 4 × 4 tiles, a hash table
 * (worker/index/cell-hash-table.ts) maps block coordinates (tx >> 2, ty >> 2)
 * to block numbers in allocation order, and a block is 16 int32 entries
 * (one cache line) holding 1 + the tile number of each of its tiles (0:
 * none). The last block looked up is cached, so a walker moving among
 * neighbouring tiles reads one array entry per query and hashes only when
 * it crosses into another block; at 10^7 particles and more the hash table
 * is far larger than the processor's caches and each hash costs a memory
 * access. Tile numbers depend only on the order in which tiles are first
 * added, so every grid built on the directory holds the same values in the
 * same places as with a one-level directory (the state hashes are the same).
 *
 * Blocks near the origin (where every model's seed is) skip the hash table
 * too: a dense *window* of block entries, a square centred on the origin
 * sized from the expected tile count (WINDOW_AREA_PER_BLOCK entries per
 * expected block), holds 1 + the block number of each block inside it;
 * only blocks outside it go to the hash table. A growing cluster's walkers
 * roam over many blocks (at 10^6 particles a level-4 mark grid holds 30
 * blocks, yet the one-block cache missed 2.4 times per particle), so most
 * block look-ups now cost one array read. The window is zero-filled and
 * never written outside the blocks in use, so its untouched pages never
 * become resident; for a DLA cluster it takes about as much memory as a
 * hash table of the same blocks. A cluster of any shape is still stored
 * exactly: the window only decides where a block's number is kept.
 */

import { CellHashTable, type SharedCellHashTable } from './cell-hash-table.js';
import { reservedArray, poolGrowth } from './pool-growth.js';
import { sharedInt32 } from '../core/shared-arrays.js';

/** A directory in shared memory (TileDirectory.shared). */
export interface SharedTileDirectory {
  table: SharedCellHashTable;
  blocks: Int32Array;
  tiles: number;
  window: Int32Array;
  windowSide: number;
}

export const TILE_SHIFT = 3;
export const TILE_MASK = (1 << TILE_SHIFT) - 1;
export const TILE_CELLS = 1 << (2 * TILE_SHIFT);

/** A block is 2^BLOCK_SHIFT × 2^BLOCK_SHIFT = 4 × 4 tiles. */
const BLOCK_SHIFT = 2;
const BLOCK_MASK = (1 << BLOCK_SHIFT) - 1;
const BLOCK_ENTRIES = 1 << (2 * BLOCK_SHIFT);
/**
 * Blocks expected per expected tile, for sizing: a block holds up to 16
 * tiles; measured for dla-square at 10^6 (2026-12-03), 9.3 of them in use in
 * the site grid and 12.7 in the first mark grid. A quarter leaves room for
 * sparser patterns; a denser one just leaves the table emptier.
 */
const BLOCKS_PER_TILE = 0.25;
/**
 * Window entries per expected block: a DLA cluster's blocks cover about a
 * quarter of the square around it (measured at 10^6 particles, seed 1,
 * 2026-12-03: 2,595 list blocks against a window of 31,329), so 4 leaves
 * room for the launch circle around the cluster. The hash table then holds
 * only what falls outside and is sized for HASHED_PER_BLOCK of the blocks.
 */
const WINDOW_AREA_PER_BLOCK = 4;
const HASHED_PER_BLOCK = 1 / 8;
/** Smallest window side, in blocks. */
const MIN_WINDOW_SIDE = 8;
const NO_BLOCK = -2147483648;

export class TileDirectory {
  private readonly table: CellHashTable;
  /** 16 entries per block: 1 + tile number, 0 for none (re-read after an add: it may be reallocated). */
  private blocks: Int32Array;
  private blockCount = 0;
  private tiles = 0;
  private cacheBx = NO_BLOCK;
  private cacheBy = NO_BLOCK;
  /** Entry offset of the cached block in `blocks`, or -1 when that block does not exist. */
  private cacheBase = -1;
  /** Window entries (1 + block number, 0: none) of blocks (bx, by) with |bx|, |by| within half the side: row (by + half)·side + bx + half. */
  private readonly window: Int32Array;
  private readonly windowSide: number;
  /** windowSide >> 1: block (−half, −half) is the window's entry 0. */
  private readonly windowHalf: number;

  /** With `from`, the directory reads that shared state (read only: no tile may be added). */
  constructor(expectedTiles: number, from?: SharedTileDirectory) {
    const expectedBlocks = Math.ceil(expectedTiles * BLOCKS_PER_TILE);
    this.table = new CellHashTable(Math.max(16, Math.ceil(expectedBlocks * HASHED_PER_BLOCK)), from?.table);
    if (from) {
      this.blocks = from.blocks;
      this.blockCount = from.blocks.length / BLOCK_ENTRIES;
      this.tiles = from.tiles;
      this.window = from.window;
      this.windowSide = from.windowSide;
      this.windowHalf = from.windowSide >> 1;
      return;
    }
    this.windowSide = Math.max(MIN_WINDOW_SIDE, Math.ceil(Math.sqrt(expectedBlocks * WINDOW_AREA_PER_BLOCK)));
    this.windowHalf = this.windowSide >> 1;
    this.window = new Int32Array(this.windowSide * this.windowSide);
    // zero-filled and used in allocation order: pages of the reservation no block uses stay unmapped
    const need = Math.max(4, expectedBlocks) * BLOCK_ENTRIES;
    this.blocks = reservedArray((n) => new Int32Array(n), need, 2 * need);
  }

  /** A copy in shared memory: the same tile numbers. */
  shared(): SharedTileDirectory {
    return {
      table: this.table.shared(),
      blocks: sharedInt32(this.blocks, this.blockCount * BLOCK_ENTRIES),
      tiles: this.tiles,
      window: sharedInt32(this.window),
      windowSide: this.windowSide,
    };
  }

  get count(): number {
    return this.tiles;
  }

  get bytes(): number {
    return this.table.bytes + this.blocks.byteLength + this.window.byteLength;
  }

  /** Tile number of tile (tx, ty), or -1 when it was never allocated. */
  find(tx: number, ty: number): number {
    const bx = tx >> BLOCK_SHIFT;
    const by = ty >> BLOCK_SHIFT;
    let base = this.cacheBase;
    if (bx !== this.cacheBx || by !== this.cacheBy) {
      const b = this.blockNumber(bx, by);
      base = b < 0 ? -1 : b * BLOCK_ENTRIES;
      this.cacheBx = bx;
      this.cacheBy = by;
      this.cacheBase = base;
    }
    return base < 0 ? -1 : this.blocks[base + tileInBlock(tx, ty)] - 1;
  }

  /** Tile number of tile (tx, ty), allocating the next number when absent. */
  findOrAdd(tx: number, ty: number): number {
    const t = this.find(tx, ty);
    if (t >= 0) return t;
    let base = this.cacheBase;
    if (base < 0) {
      const b = this.blockCount++;
      base = b * BLOCK_ENTRIES;
      if (base + BLOCK_ENTRIES > this.blocks.length) {
        const bigger = new Int32Array(poolGrowth(this.blocks.length, b, BLOCK_ENTRIES));
        bigger.set(this.blocks);
        this.blocks = bigger;
      }
      const bx = tx >> BLOCK_SHIFT;
      const by = ty >> BLOCK_SHIFT;
      const w = this.windowEntry(bx, by);
      if (w >= 0) this.window[w] = b + 1;
      else this.table.set(bx, by, b);
      this.cacheBase = base;
    }
    const n = this.tiles++;
    this.blocks[base + tileInBlock(tx, ty)] = n + 1;
    return n;
  }

  /** Block number of block (bx, by), or -1 when it has none: from the window when the block lies in it, else from the hash table. */
  private blockNumber(bx: number, by: number): number {
    const w = this.windowEntry(bx, by);
    return w >= 0 ? this.window[w] - 1 : this.table.get(bx, by, -1);
  }

  /** Offset of block (bx, by) in the window, or -1 when it lies outside. */
  private windowEntry(bx: number, by: number): number {
    const side = this.windowSide;
    const x = bx + this.windowHalf;
    const y = by + this.windowHalf;
    // one unsigned comparison per axis: a negative x or y wraps to a large value
    return x >>> 0 < side && y >>> 0 < side ? y * side + x : -1;
  }

  /** Blocks in use (for memory accounting). */
  get blocksInUse(): number {
    return this.blockCount;
  }
}

/** Offset of tile (tx, ty)'s entry inside its block. */
function tileInBlock(tx: number, ty: number): number {
  return ((ty & BLOCK_MASK) << BLOCK_SHIFT) + (tx & BLOCK_MASK);
}

/** Offset of cell (ix, iy) inside its tile. */
export function cellInTile(ix: number, iy: number): number {
  return ((iy & TILE_MASK) << TILE_SHIFT) + (ix & TILE_MASK);
}
