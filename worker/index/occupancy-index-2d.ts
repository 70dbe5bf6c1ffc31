/**
 * Multi-resolution occupancy index of a planar cluster of unit-diameter disks.
 * It answers one question fast: a lower bound on how far a walker's centre
 * can move in any direction before it touches a disk, i.e. on
 * (distance from the walker to the nearest particle centre) − 1.
 *
 * All cell sides are powers of two, so cell coordinates floor(x · 2^-(k+1))
 * are computed exactly in floating point (and kept as int32: `| 0`, which is
 * exact for |x| < 2^31 and keeps V8 from boxing them).
 *  - Lists (level 0, cells of side 2): each occupied cell holds (one plus)
 *    the arrival index of its newest centre, and next[i] is the arrival index
 *    of the centre inserted into the same cell before centre i (−1: none),
 *    so a cell's centres are listed newest first. The coordinates themselves
 *    live once, in arrival order, in an interleaved array (x0, y0, x1, y1, …)
 *    that the index reads: the growth kernel's own positions, or an array the
 *    index keeps when none is given. `next` takes 4 bytes per centre and is
 *    sized once for the expected number of particles, and the tiled grids
 *    are reserved for the tiles a cluster of that size uses (their pages
 *    become resident only when used), so a growing cluster's index is never
 *    copied: this is what keeps a giant cluster under 48 bytes per particle.
 *    The order in which a scan lists centres (changed from an earlier
 *    layout; every pinned state hash stayed the same) changes neither the
 *    free radius (a minimum) nor a straight step's contact distance
 *    (worker/walkers/segment-contact-2d.ts: the smallest one); only an exact
 *    tie between two disks, of probability zero, could name another disk.
 *    When the walker's level-0 cell is marked, the
 *    3 × 3 block of cells around it is scanned exactly, visiting only the
 *    cells that hold centres (a bit grid of them, worker/index/window-bit-grid.ts,
 *    gives a row of the block in one word). The centres found are kept until
 *    the next insert, and reused while the walker's exact scans stay in the
 *    same cell (about half of them in DLA growth).
 *  - Marks at every level k = 0 … MAX_LEVEL, cells of side 2^(k+1): a cell is
 *    *marked* when a particle centre lies in the (2·DILATION + 1)² block of
 *    cells centred on it. An unmarked cell also carries its *closeness*, a
 *    lower bound on the Euclidean gap between its square and the nearest
 *    cell holding a centre (between DILATION and GAP_RADIUS sides, in steps
 *    of 1/GAP_PER_SIDE side). If the walker's cell is unmarked, the nearest
 *    centre is at least that gap + (distance from the walker to its own
 *    cell's edge) away: a segment from the walker to a centre leaves the
 *    walker's cell after at least that distance and then crosses the gap.
 *    Marks are monotone in k (an unmarked cell's
 *    children are unmarked), so the largest unmarked level is unique and the
 *    query result does not depend on where the search starts — which keeps
 *    results independent of the order of queries, and so of checkpoints.
 *    Each level-k cell whose parent (level k + 1) is marked carries a PARENT
 *    bit, so a walker that stays at its level is answered by one lookup.
 * Every grid is sparse (worker/index/tiled-grids.ts): memory grows with the number
 * of particles, not with the area.
 */

import { TiledByteGrid, TiledInt32Grid, type SharedTiledGrid } from './tiled-grids.js';
import { CORE_MASK, WINDOW_RADIUS, WindowBitGrid } from './window-bit-grid.js';
import { sharedFloat64, sharedInt32 } from '../core/shared-arrays.js';

/**
 * A complete index in shared memory (OccupancyIndex2d.shared): what a
 * read-only index in another thread needs, every array a SharedArrayBuffer.
 */
export interface SharedOccupancyIndex2d {
  count: number;
  xy: Float64Array;
  next: Int32Array;
  heads: SharedTiledGrid<Int32Array>;
  marks: SharedTiledGrid<Uint8Array>[];
  held0: SharedTiledGrid<Int32Array>;
}

const clz32 = Math.clz32;

/** Mark levels 0..MAX_LEVEL; the coarsest cell has side 2^(MAX_LEVEL+1) = 2^25 diameters. */
const MAX_LEVEL = 24;
/** Bit in a mark cell: a centre lies in the block centred on the cell. */
const MARKED = 1;
/** Bit in a mark cell: the cell itself holds a centre. */
const HOLDS = 2;
/** Bit in a mark cell at level k: its parent cell at level k + 1 is marked. */
const PARENT = 4;
/**
 * Marks extend this many cells around a centre's cell at every level (a
 * 5 × 5 block). Wider marks give longer jumps per query but send more
 * queries to the exact scan; 2 was fastest when measured against 1 and 3,
 * before the closeness field and again with it (GAP_RADIUS 5 did not pay
 * either: its longer jumps were too rare for the wider updates).
 */
const DILATION = 2;
/**
 * Bits GAP_SHIFT.. of a mark cell hold its *closeness* c in 0 .. GAP_STEPS:
 * the square of an unmarked level-k cell is at Euclidean distance at least
 * (DILATION + (GAP_STEPS − c) / GAP_PER_SIDE) · side from every level-k cell
 * that holds a centre. It is kept for the cells within GAP_RADIUS cells of
 * each holding cell; a cell further from all of them (c = 0, the blank
 * value) is at least GAP_RADIUS · side = (DILATION + GAP_STEPS / GAP_PER_SIDE) · side
 * from them.
 */
const GAP_SHIFT = 3;
const GAP_PER_SIDE = 8;
const GAP_RADIUS = 4;
const GAP_STEPS = (GAP_RADIUS - DILATION) * GAP_PER_SIDE;
/**
 * CLOSENESS[(dy + GAP_RADIUS)·(2·GAP_RADIUS + 1) + dx + GAP_RADIUS]: the
 * closeness a holding cell gives the cell (dx, dy) cells away, from the exact
 * gap between the two squares, sqrt(a² + b²) sides with a = max(|dx| − 1, 0),
 * b = max(|dy| − 1, 0): GAP_STEPS − u for the largest u in 0 .. GAP_STEPS with
 * DILATION + u / GAP_PER_SIDE <= that gap (integer arithmetic, no rounding);
 * GAP_STEPS when the gap is below DILATION sides (such cells are marked).
 */
const CLOSENESS = new Uint8Array((2 * GAP_RADIUS + 1) ** 2);
for (let dy = -GAP_RADIUS; dy <= GAP_RADIUS; dy++)
  for (let dx = -GAP_RADIUS; dx <= GAP_RADIUS; dx++) {
    const a = Math.max(Math.abs(dx) - 1, 0);
    const b = Math.max(Math.abs(dy) - 1, 0);
    const gap2 = GAP_PER_SIDE * GAP_PER_SIDE * (a * a + b * b); // gap², in (sides / GAP_PER_SIDE)²
    let u = -1;
    while (u < GAP_STEPS && (DILATION * GAP_PER_SIDE + u + 1) ** 2 <= gap2) u++;
    CLOSENESS[(dy + GAP_RADIUS) * (2 * GAP_RADIUS + 1) + dx + GAP_RADIUS] = u < 0 ? GAP_STEPS : GAP_STEPS - u;
  }
/**
 * Tiles reserved per expected particle in each grid (see the constructor):
 * about twice the tiles per particle of a 10^6-particle off-lattice DLA
 * cluster (seed 7: 0.0256 list tiles, 0.0330 level-0 and 0.0103 level-1
 * mark tiles, 0.0089 bit-grid tiles per particle; measured on 2026-12-03).
 * A reservation costs address space only; a denser cluster grows the grid.
 */
const RESERVE_HEADS = 0.05;
const RESERVE_MARKS = 0.066;
const RESERVE_HELD = 0.018;
/** At most this many centres are returned by a scan (a 6 × 6 block holds far fewer unit disks). */
const MAX_NEAR = 256;
/** A cell coordinate no centre can have (cell coordinates are int32 of |x| < 2^31 / 2). */
const NO_CELL = -2147483648;
/** SCALES[k] = 1 / (cell side at level k) = 2^-(k+1); SIDES[k] = 2^(k+1). */
const SCALES = new Float64Array(MAX_LEVEL + 2);
const SIDES = new Float64Array(MAX_LEVEL + 2);
for (let k = 0; k <= MAX_LEVEL + 1; k++) {
  SIDES[k] = 2 ** (k + 1);
  SCALES[k] = 2 ** -(k + 1);
}

export class OccupancyIndex2d {
  /** Centres found by the last exact scan (valid when nearCount >= 0): every centre within 2 of the walker. */
  readonly nearX = new Float64Array(MAX_NEAR);
  readonly nearY = new Float64Array(MAX_NEAR);
  /** Arrival index (insertion order, from 0) of each centre in nearX/nearY. */
  readonly nearId = new Int32Array(MAX_NEAR);
  /** Number of entries in nearX/nearY, or -1 when the last query did not scan exactly. */
  nearCount = -1;
  /** Result of the last `query`: a lower bound on (nearest centre distance) − 1. */
  free = 0;
  /**
   * Work counters for benchmarks (one increment each, never read in a run):
   * exact scans; among them the scans that gathered their 3 × 3 block afresh
   * (the others reused the last one); and the reads of the ring around it.
   */
  exactScans = 0;
  blockGathers = 0;
  ringGathers = 0;

  /**
   * The last exact scan's 3 × 3 block (level-0 cell of its centre; NO_CELL
   * when none or after an insert): nearX/nearY[0 .. scanCount) still hold its
   * centres. A walker that stays in one cell reuses them: the same centres
   * in the same order, so the same answers. (The ring around the block is
   * read from the lists each time it is needed: see ringMinimum.)
   */
  private scanCx = NO_CELL;
  private scanCy = NO_CELL;
  private scanCount = 0;

  /** Level-0 cell → 1 + arrival index of its newest centre (0: none). */
  private heads: TiledInt32Grid;
  /** Centres in arrival order, interleaved (x0, y0, x1, y1, …): the owner's array, or the index's own (ownsXy). */
  private xy: Float64Array;
  private readonly ownsXy: boolean;
  /** Made from a shared index (`from`): its arrays are read by other threads too, so insert refuses. */
  private readonly readOnly: boolean;
  /** next[i]: arrival index of the centre inserted into centre i's cell before it (−1: none). */
  private next: Int32Array;
  /** marks[k]: mark cells of side 2^(k+1), k = 0..MAX_LEVEL. */
  private marks: TiledByteGrid[] = [];
  /** One bit per level-0 cell, set when the cell holds a centre (the HOLDS bits of marks[0], laid out for window reads). */
  private held0: WindowBitGrid;
  /** Cells newly marked by an insert's raiseBlock, as (x, y) pairs (scratch). */
  private readonly freshMarks = new Int32Array(2 * (2 * DILATION + 1) ** 2);
  /** Level at which the next search starts (a speed hint only). */
  private guess = 1;
  private count = 0;

  /**
   * `positions`: the interleaved centres in arrival order that the owner
   * keeps anyway (a growth kernel's array, with room for every particle it
   * will insert); the index reads centre i at positions[2i], positions[2i + 1]
   * and never writes them. Without it the index keeps its own copy.
   */
  constructor(expectedParticles: number, positions?: Float64Array, from?: SharedOccupancyIndex2d) {
    this.readOnly = from !== undefined;
    if (from) {
      // the same cells, lists and tile numbers as the index `from` was made of: the same answers
      this.ownsXy = false;
      this.xy = from.xy;
      this.next = from.next;
      this.count = from.count;
      this.heads = new TiledInt32Grid(0, 4, 4, from.heads);
      this.held0 = new WindowBitGrid(4, 4, from.held0);
      for (const m of from.marks) this.marks.push(new TiledByteGrid(4, 4, m));
      return;
    }
    const n = Math.max(16, expectedParticles);
    this.ownsXy = positions === undefined;
    this.xy = positions ?? new Float64Array(2 * Math.min(n, 1 << 20));
    // zero-filled and written in arrival order: only the pages in use are resident; in shared
    // memory, as the owner's positions are, so that `shared` passes both on without a copy
    const onShared = positions !== undefined && positions.buffer instanceof SharedArrayBuffer;
    this.next = onShared ? new Int32Array(new SharedArrayBuffer(4 * n)) : new Int32Array(n);
    // directories sized for about as many tiles as a DLA cluster uses, pools
    // reserved for about twice that (address space only until used)
    this.heads = new TiledInt32Grid(0, Math.max(16, n >> 5), Math.ceil(n * RESERVE_HEADS));
    this.held0 = new WindowBitGrid(Math.max(16, n >> 7), Math.ceil(n * RESERVE_HELD));
    let expect = Math.max(16, n >> 5);
    let reserve = n * RESERVE_MARKS;
    for (let k = 0; k <= MAX_LEVEL; k++) {
      this.marks.push(new TiledByteGrid(Math.max(4, expect), Math.ceil(reserve)));
      expect = expect >> 2;
      reserve = reserve / 3;
    }
  }

  /**
   * Give back the index's memory (all but a few bytes) when it will not be
   * asked again, e.g. once a cluster is complete, so that writing a giant
   * cluster's outputs does not hold it too. Afterwards the index is empty:
   * `size` is 0 and queries answer as for no centres.
   */
  release(): void {
    if (this.readOnly) throw new Error('occupancy index: a shared index is read only');
    this.heads = new TiledInt32Grid(0, 4);
    this.held0 = new WindowBitGrid(4);
    this.marks = this.marks.map(() => new TiledByteGrid(4));
    this.next = new Int32Array(0);
    this.count = 0;
    this.scanCx = NO_CELL;
    if (this.ownsXy) this.xy = new Float64Array(0);
  }

  /**
   * A copy of the whole index in shared memory (only the parts in use), for
   * probe threads that each read the same index instead of building their
   * own (`new OccupancyIndex2d(0, undefined, shared)`).
   */
  shared(): SharedOccupancyIndex2d {
    return {
      count: this.count,
      // arrays already in shared memory (the owner's shared positions and the lists kept beside them) are passed as they are
      xy: this.xy.buffer instanceof SharedArrayBuffer ? this.xy : sharedFloat64(this.xy, 2 * this.count),
      next: this.next.buffer instanceof SharedArrayBuffer ? this.next : sharedInt32(this.next, this.count),
      heads: this.heads.shared(),
      marks: this.marks.map((m) => m.shared()),
      held0: this.held0.shared(),
    };
  }

  /** Number of centres inserted. */
  get size(): number {
    return this.count;
  }

  /** Bytes the index has allocated, reservations included (pages of a reservation no tile uses never become resident). */
  get bytes(): number {
    let b = this.heads.bytes + this.next.byteLength + (this.ownsXy ? this.xy.byteLength : 0);
    for (const t of this.marks) b += t.bytes;
    b += this.held0.bytes;
    return b;
  }

  /**
   * Add a centre. Insert in arrival order: scans return centres in that
   * order. With an owner's positions array, (px, py) must already be its
   * entry number `size`.
   */
  insert(px: number, py: number): void {
    if (this.readOnly) throw new Error('occupancy index: a shared index is read only');
    const id = this.count;
    if (this.ownsXy) {
      if (2 * id + 2 > this.xy.length) this.xy = grownFloat64(this.xy, 2 * id + 2);
      this.xy[2 * id] = px;
      this.xy[2 * id + 1] = py;
    }
    this.count++;
    this.scanCx = NO_CELL;
    const cx = Math.floor(px * 0.5) | 0;
    const cy = Math.floor(py * 0.5) | 0;
    if (id >= this.next.length) this.next = grownInt32(this.next, id + 1);
    const cell = this.heads.cellIndex(cx, cy);
    const pool = this.heads.pool;
    this.next[id] = pool[cell] - 1;
    pool[cell] = id + 1;

    let scale = 0.5;
    for (let k = 0; k <= MAX_LEVEL; k++, scale *= 0.5) {
      const t = this.marks[k];
      const ix = Math.floor(px * scale) | 0;
      const iy = Math.floor(py * scale) | 0;
      const old = t.orBits(ix, iy, MARKED | HOLDS);
      // A cell that already holds a centre has its block marked, and so does
      // every coarser cell containing it: nothing left to do.
      if ((old & HOLDS) !== 0) break;
      if (k === 0) this.held0.set(ix, iy);
      // closeness around the cell, and MARKED on its block (the cell itself has it already)
      const fresh = this.freshMarks;
      const m = t.raiseBlock(ix, iy, GAP_RADIUS, CLOSENESS, GAP_SHIFT, DILATION, MARKED, fresh);
      if (k === 0) continue;
      // Newly marked cells (the centre cell when `old` lacked MARKED) tell
      // their four children, so that a query can stop at the largest
      // unmarked level with one lookup.
      const below = this.marks[k - 1];
      if ((old & MARKED) === 0) markChildren(below, ix, iy);
      for (let j = 0; j < m; j++) markChildren(below, fresh[2 * j], fresh[2 * j + 1]);
    }
  }

  /** Lower bound on (distance from (wx, wy) to the nearest centre) − 1; see `query`. */
  freeRadius(wx: number, wy: number): number {
    this.query(wx, wy);
    return this.free;
  }

  /**
   * Sets `free` to a lower bound on (distance from (wx, wy) to the nearest
   * centre) − 1, exact when that distance is below 2 + (distance to the edge
   * of the walker's level-0 cell); when no centre is that close it is exact
   * up to 4 + that edge distance. When the answer comes from the exact
   * scan, the centres of the scanned 3 × 3 block of level-0 cells (which
   * include every centre within distance 2 of the walker) are left in
   * nearX/nearY[0 .. nearCount); otherwise nearCount = -1.
   */
  query(wx: number, wy: number): void {
    let k = this.guess;
    let v = this.cellMarks(k, wx, wy);
    if ((v & MARKED) !== 0) {
      // go down to the first unmarked level (its parent is marked)
      do {
        if (k === 0) {
          this.guess = 0;
          this.exactScan(wx, wy);
          return;
        }
        k--;
        v = this.cellMarks(k, wx, wy);
      } while ((v & MARKED) !== 0);
    } else {
      // unmarked: go up while the parent is unmarked too
      while ((v & PARENT) === 0 && k < MAX_LEVEL) {
        k++;
        v = this.cellMarks(k, wx, wy);
      }
    }
    this.guess = k;
    this.nearCount = -1;
    // the cell is unmarked: its closeness bounds the distance to every centre
    const side = SIDES[k];
    const inv = SCALES[k];
    const ex = wx - Math.floor(wx * inv) * side;
    const ey = wy - Math.floor(wy * inv) * side;
    const edge = Math.min(ex, side - ex, ey, side - ey);
    this.free = (DILATION + (GAP_STEPS - (v >>> GAP_SHIFT)) * (1 / GAP_PER_SIDE)) * side + edge - 1;
  }

  /** Mark bits of the level-k cell holding (wx, wy). */
  private cellMarks(k: number, wx: number, wy: number): number {
    const scale = SCALES[k];
    return this.marks[k].get(Math.floor(wx * scale) | 0, Math.floor(wy * scale) | 0);
  }

  private exactScan(wx: number, wy: number): void {
    const cx = Math.floor(wx * 0.5) | 0;
    const cy = Math.floor(wy * 0.5) | 0;
    const nearX = this.nearX;
    const nearY = this.nearY;
    let best = Infinity;
    let n: number;
    this.exactScans++;
    if (cx === this.scanCx && cy === this.scanCy) {
      // same block as the last scan, no insert since: its centres are still in nearX/nearY
      n = this.scanCount;
      for (let j = 0; j < n; j++) {
        const ddx = nearX[j] - wx;
        const ddy = nearY[j] - wy;
        const d2 = ddx * ddx + ddy * ddy;
        if (d2 < best) best = d2;
      }
    } else {
      const heads = this.heads;
      const xy = this.xy;
      const next = this.next;
      const nearId = this.nearId;
      n = 0;
      this.blockGathers++;
      let complete = true;
      // only the cells that hold centres (their bits in held0), row by row
      const row0 = this.heldRow0(cx, cy);
      const words = this.held0.words;
      const shift = (cx & CORE_MASK) + WINDOW_RADIUS - 1; // bit 0: column cx - 1
      for (let dy = -1; dy <= 1; dy++) {
        let cells = row0 < 0 ? 0 : (words[row0 + dy] >>> shift) & 7;
        while (cells !== 0) {
          const ix = cx - 1 + (31 - clz32(cells & -cells));
          cells &= cells - 1;
          for (let id = heads.get(ix, cy + dy) - 1; id >= 0; id = next[id]) {
            const px = xy[2 * id];
            const py = xy[2 * id + 1];
            const ddx = px - wx;
            const ddy = py - wy;
            const d2 = ddx * ddx + ddy * ddy;
            if (d2 < best) best = d2;
            if (n < MAX_NEAR) {
              nearX[n] = px;
              nearY[n] = py;
              nearId[n] = id;
              n++;
            } else complete = false;
          }
        }
      }
      // a truncated list cannot stand for the block: do not reuse it
      this.scanCx = complete ? cx : NO_CELL;
      this.scanCy = cy;
      this.scanCount = n;
    }
    this.nearCount = n;
    const ex = wx - cx * 2;
    const ey = wy - cy * 2;
    const edge = Math.min(ex, 2 - ex, ey, 2 - ey);
    let reach = 2 + edge;
    if (best >= reach * reach) {
      // Nothing within the 3 × 3 block is closer than its edge: take the ring
      // of 16 cells around it too (the mark that sent us here may come from
      // there), so that the answer can reach 4 + edge. The near list does not
      // need them (the answer is at least 1 >= minStep).
      reach = 4 + edge;
      best = this.ringMinimum(cx, cy, wx, wy, best);
    }
    const nearest = Math.sqrt(best);
    this.free = (nearest < reach ? nearest : reach) - 1;
  }

  /**
   * The smaller of `best` and the least squared distance from (wx, wy) to a
   * centre of the ring of 16 level-0 cells around the 3 × 3 block at
   * (cx, cy). Read straight from the lists: a walker rarely needs the same
   * ring twice (about 5 % of the rings in DLA growth), so keeping a copy
   * did not pay.
   */
  private ringMinimum(cx: number, cy: number, wx: number, wy: number, best: number): number {
    const heads = this.heads;
    const xy = this.xy;
    const next = this.next;
    this.ringGathers++;
    const row0 = this.heldRow0(cx, cy);
    if (row0 < 0) return best;
    const words = this.held0.words;
    const shift = (cx & CORE_MASK) + WINDOW_RADIUS - 2; // bit 0: column cx - 2
    for (let dy = -2; dy <= 2; dy++) {
      // all five columns in the outer rows, the two outer ones in the others
      let cells = (words[row0 + dy] >>> shift) & (dy === -2 || dy === 2 ? 0x1f : 0x11);
      while (cells !== 0) {
        const ix = cx - 2 + (31 - clz32(cells & -cells));
        cells &= cells - 1;
        for (let id = heads.get(ix, cy + dy) - 1; id >= 0; id = next[id]) {
          const ddx = xy[2 * id] - wx;
          const ddy = xy[2 * id + 1] - wy;
          const d2 = ddx * ddx + ddy * ddy;
          if (d2 < best) best = d2;
        }
      }
    }
    return best;
  }

  /** Offset in held[0].words of the row of level-0 cell row cy, in the tile owning cell (cx, cy); -1: no centre within 4 cells. */
  private heldRow0(cx: number, cy: number): number {
    const base = this.held0.tileOffset(cx, cy);
    return base < 0 ? -1 : base + (cy & CORE_MASK) + WINDOW_RADIUS;
  }
}

/** Set the PARENT bit of the four children (in the finer grid `below`) of cell (x, y). */
function markChildren(below: TiledByteGrid, x: number, y: number): void {
  const jx = 2 * x;
  const jy = 2 * y;
  below.orBits(jx, jy, PARENT);
  below.orBits(jx + 1, jy, PARENT);
  below.orBits(jx, jy + 1, PARENT);
  below.orBits(jx + 1, jy + 1, PARENT);
}

/** A copy of `a` with room for at least `need` entries (a quarter more at a time, so that the slack stays small). */
function grownFloat64(a: Float64Array, need: number): Float64Array {
  const b = new Float64Array(Math.max(need, Math.ceil(a.length * 1.25)));
  b.set(a);
  return b;
}

/** A copy of `a` with room for at least `need` entries (a quarter more at a time). */
function grownInt32(a: Int32Array, need: number): Int32Array {
  const b = new Int32Array(Math.max(need, Math.ceil(a.length * 1.25)));
  b.set(a);
  return b;
}
