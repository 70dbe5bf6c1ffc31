/**
 * Multi-resolution occupancy index of a cluster of unit-diameter balls in
 * three dimensions. It answers one question: a lower bound on how far a
 * walker's centre can move in any direction before its ball touches a ball of
 * the cluster, i.e. on (distance from the walker to the nearest centre) − 1;
 * and, next to the cluster, the exact list of the centres around the walker.
 *
 * All cell sides are powers of two, so cell coordinates floor(x · 2^-(k+1))
 * are exact in floating point (kept as int32; exact for |x| < 2^31).
 *  - Chains (cells of side 2): each occupied cell holds the newest particle's
 *    arrival index; `next` links it to the previous particle of the same cell.
 *    The heads are stored 64 to a brick of 4 × 4 × 4 cells (one hash look-up
 *    per brick, not one per cell, in the exact scan).
 *  - Marks at every level k = 0 … MAX_LEVEL, cells of side s = 2^(k+1): a cell
 *    is *marked* when a centre lies in the 3 × 3 × 3 block of cells centred
 *    on it. If the walker's cell is unmarked, every centre is outside that
 *    block, so at least s + m away, where m is the walker's distance to the
 *    nearest face of its own cell. Marks are monotone in k (an unmarked
 *    cell's level-(k − 1) sub-cells are unmarked: their blocks lie inside
 *    its block), so the largest unmarked level is unique and the answer
 *    does not depend on where the search starts (the previous query's
 *    level): results are independent of the order of queries, and so of
 *    checkpoints.
 *  - Wide marks at every level: a cell is *widely marked* when a centre lies
 *    in the 5 × 5 × 5 block of cells centred on it. At the largest unmarked
 *    level, a cell that is not widely marked has every centre at least
 *    2s + m away (twice the jump of a plain unmarked cell, so about a
 *    quarter of the jumps there). This is a refinement between levels k and
 *    k + 1, read once per query.
 *  - When even level 0 is marked, the 3 × 3 × 3 block of side-2 cells around
 *    the walker is scanned exactly: it holds every centre within 2 + m of
 *    the walker. The head bricks (at most eight) over the block give its
 *    cells' chains. The centres found are kept (in chain order, so the same
 *    set in the same order whatever came before) until the next insert, for
 *    the last SCAN_CACHE cells scanned, and reused whenever the walker is in
 *    one of those side-2 cells. When the near field shows a centre within 3
 *    of the centre of the walker's side-2 cell, level 0 is marked and the
 *    level search is skipped.
 *  - Near field (worker/index/near-distance-field-3d.ts): per cell of side 2,
 *    the distance from its centre to the nearest centre, up to 8. Asked
 *    first; its bound (stored value − walker's distance to the cell centre)
 *    is taken alone when it leaves at least FIELD_ACCEPT of free distance,
 *    else the marks and the exact scan are asked as well and the larger
 *    bound wins. Near the cluster it is about twice the marks' bound, which
 *    cut the walk-on-spheres jumps per ball from 171 to 92 at N = 10^5.
 * Marks are stored as bits in bricks of 4 × 4 × 4 cells (one hash slot:
 * two words of mark bits and two words of wide-mark bits, so a query finds
 * both in one slot; set a brick at a time by one OR of a mask per brick the
 * block overlaps); the "holds a centre" bits per level are a table of their own; every
 * table is a sparse hash (worker/index/cell-hash-table-3d.ts), so memory
 * grows with the number of particles, not with the volume. A particle whose
 * level-k cell already holds a centre needs no marks at levels >= k (they
 * were set by the earlier one), so inserts are cheap.
 */

import { CellHashTable3d } from './cell-hash-table-3d.js';
import { NearDistanceField3d } from './near-distance-field-3d.js';

/**
 * A near-field bound of at least this much free distance is taken as it is;
 * below it the marks and the exact scan (exact up to 2 + m) are asked too and
 * the larger bound wins. 1 was cheaper than 2 and than 0.3 at N = 10^4 (four
 * seeds; jumps per ball 62 against 65 and 68).
 */
const FIELD_ACCEPT = 1;

/** Mark levels 0..MAX_LEVEL; the coarsest cell has side 2^(MAX_LEVEL+1) = 2^23 diameters. */
const MAX_LEVEL = 22;
/** SCALES[k] = 2^-(k+1) (1 / cell side at level k); SIDES[k] = 2^(k+1). */
const SCALES = new Float64Array(MAX_LEVEL + 1);
const SIDES = new Float64Array(MAX_LEVEL + 1);
for (let k = 0; k <= MAX_LEVEL; k++) {
  SIDES[k] = 2 ** (k + 1);
  SCALES[k] = 2 ** -(k + 1);
}
/** Initial room for the centres of one exact scan (grown when a scan finds more). */
const NEAR_START = 64;
/**
 * Exact scans kept between inserts (least recently used replaced): a walker
 * next to the cluster steps back into a cell it just left about a third of
 * the times it enters one (measured at N = 3·10^4: 2.9 of 10.2 scans a
 * ball were of one of the last four cells scanned, 0.2 more of the four
 * before), and a kept scan is the same list a new one would give.
 */
const SCAN_CACHE = 4;
/** A cell coordinate no centre can have. */
const NO_CELL = -2147483648;

export class OccupancyIndex3d {
  /** Centres found by the last exact scan (valid when nearCount >= 0): every centre within 2 of the walker. */
  nearX: Float64Array = new Float64Array(NEAR_START);
  nearY: Float64Array = new Float64Array(NEAR_START);
  nearZ: Float64Array = new Float64Array(NEAR_START);
  /** Arrival indices of the centres in nearX/Y/Z. */
  nearId: Int32Array = new Int32Array(NEAR_START);
  /** Number of entries in nearX/Y/Z, or -1 when the last query did not scan exactly. */
  nearCount = -1;
  /** Result of the last `query`: a lower bound on (nearest centre distance) − 1. */
  free = 0;

  /** The centres in arrival order, interleaved x, y, z (the kernel's positions are this array). */
  readonly coords: Float64Array;
  private readonly next: Int32Array;
  /** Bricks of 4 × 4 × 4 side-2 cells that hold a centre: brick number in headPool. */
  private readonly headBricks: CellHashTable3d;
  /** Per brick, the newest arrival index of each of its 64 cells (-1: empty); `next` links the rest. */
  private headPool: Int32Array;
  private headBrickCount = 0;
  private readonly marks: CellHashTable3d[] = [];
  /**
   * Per level, the cells that hold a centre: bits in words v0, v1 of each brick (the marks' tables
   * hold the marks in v0, v1 and the wide marks in v2, v3, so that a query reads both from one slot).
   */
  private readonly holds: CellHashTable3d[] = [];
  private readonly field = new NearDistanceField3d();
  private n = 0;
  /** Level where the last query ended (a starting hint only). */
  private hint = 0;
  /** Kept exact scans: side-2 cell (cacheCx = NO_CELL: none), centres, count and last use. */
  private readonly cacheCx = new Int32Array(SCAN_CACHE).fill(NO_CELL);
  private readonly cacheCy = new Int32Array(SCAN_CACHE);
  private readonly cacheCz = new Int32Array(SCAN_CACHE);
  private readonly cacheCount = new Int32Array(SCAN_CACHE);
  private readonly cacheUse = new Float64Array(SCAN_CACHE);
  private readonly cacheX: Float64Array[] = [];
  private readonly cacheY: Float64Array[] = [];
  private readonly cacheZ: Float64Array[] = [];
  private readonly cacheId: Int32Array[] = [];
  /** Kept scan that nearX/Y/Z/Id are (its cell: scanCx, scanCy, scanCz; NO_CELL: none). */
  private scanSlot = 0;
  private scanCx = NO_CELL;
  private scanCy = NO_CELL;
  private scanCz = NO_CELL;
  private scanCount = 0;
  private uses = 0;

  constructor(capacity: number) {
    this.coords = new Float64Array(3 * capacity);
    this.next = new Int32Array(capacity);
    const expected = Math.min(capacity, 1 << 20);
    this.headBricks = new CellHashTable3d(expected >> 4, 1);
    this.headPool = new Int32Array(64 * Math.max(16, expected >> 4)).fill(-1);
    for (let k = 0; k <= MAX_LEVEL; k++) {
      // mark bricks are few (each covers 4 × 4 × 4 cells): start small and let them grow
      this.marks.push(new CellHashTable3d(256));
      this.holds.push(new CellHashTable3d(256));
    }
    for (let e = 0; e < SCAN_CACHE; e++) {
      this.cacheX.push(e === 0 ? this.nearX : new Float64Array(NEAR_START));
      this.cacheY.push(e === 0 ? this.nearY : new Float64Array(NEAR_START));
      this.cacheZ.push(e === 0 ? this.nearZ : new Float64Array(NEAR_START));
      this.cacheId.push(e === 0 ? this.nearId : new Int32Array(NEAR_START));
    }
  }

  /** Particles inserted. */
  get count(): number {
    return this.n;
  }

  /** Bytes held by the index. */
  get bytes(): number {
    let b = this.coords.byteLength + this.next.byteLength + this.headBricks.bytes + this.headPool.byteLength;
    for (let e = 0; e < SCAN_CACHE; e++) b += this.cacheX[e].byteLength * 3 + this.cacheId[e].byteLength;
    for (const t of this.marks) b += t.bytes;
    for (const t of this.holds) b += t.bytes;
    b += this.field.bytes;
    return b;
  }

  /** Add a centre (arrival index = number inserted before it). */
  insert(x: number, y: number, z: number): void {
    const i = this.n;
    if (i >= this.next.length) throw new RangeError(`occupancy index is full (${this.next.length} particles)`);
    this.coords[3 * i] = x;
    this.coords[3 * i + 1] = y;
    this.coords[3 * i + 2] = z;
    const cx0 = Math.floor(x * 0.5) | 0;
    const cy0 = Math.floor(y * 0.5) | 0;
    const cz0 = Math.floor(z * 0.5) | 0;
    const h = this.headBricks.slotFor(cx0 >> 2, cy0 >> 2, cz0 >> 2, -1);
    let brick = this.headBricks.slots[h + 3];
    if (brick < 0) {
      brick = this.headBrickCount++;
      this.headBricks.slots[h + 3] = brick;
      if (64 * (brick + 1) > this.headPool.length) {
        const grown = new Int32Array(2 * this.headPool.length).fill(-1);
        grown.set(this.headPool);
        this.headPool = grown;
      }
    }
    const cell = 64 * brick + ((cx0 & 3) | ((cy0 & 3) << 2) | ((cz0 & 3) << 4));
    this.next[i] = this.headPool[cell];
    this.headPool[cell] = i;
    this.n = i + 1;
    // the last exact scan lists earlier centres, which let the field skip cells they already bound
    this.field.insert(x, y, z, this.nearX, this.nearY, this.nearZ, this.scanCx === NO_CELL ? 0 : this.scanCount);
    this.scanCx = NO_CELL;
    this.cacheCx.fill(NO_CELL); // the new centre may belong to any kept scan

    for (let k = 0; k <= MAX_LEVEL; k++) {
      const h = this.holds[k];
      const sc = SCALES[k];
      const cx = Math.floor(x * sc) | 0;
      const cy = Math.floor(y * sc) | 0;
      const cz = Math.floor(z * sc) | 0;
      const b = (cx & 3) | ((cy & 3) << 2) | ((cz & 3) << 4);
      const o = h.slotFor(cx >> 2, cy >> 2, cz >> 2, 0);
      const w = o + 3 + (b >> 5);
      const bit = 1 << (b & 31);
      if ((h.slots[w] & bit) !== 0) break; // an earlier centre shares this cell: levels >= k are marked
      h.slots[w] |= bit;
      markBlock(this.marks[k], cx, cy, cz, 1, 3);
      markBlock(this.marks[k], cx, cy, cz, 2, 5);
    }
  }

  /** True when the level-k cell of (x, y, z) is marked. */
  private marked(k: number, x: number, y: number, z: number): boolean {
    return markedIn(this.marks[k], SCALES[k], x, y, z, 3);
  }

  /** True when the level-k cell of (x, y, z) is widely marked. */
  private widelyMarked(k: number, x: number, y: number, z: number): boolean {
    return markedIn(this.marks[k], SCALES[k], x, y, z, 5);
  }

  /**
   * Set `free` to reach + (distance from (x, y, z) to the nearest face of its
   * own cell of side s, sc = 1/s) − 1, or to min(that, cap − 1) when cap is
   * given (a method that stores rather than returns, so that V8 need not box
   * the double).
   */
  private setFree(reach: number, x: number, y: number, z: number, s: number, sc: number, cap: number): void {
    const fx = x - Math.floor(x * sc) * s;
    const fy = y - Math.floor(y * sc) * s;
    const fz = z - Math.floor(z * sc) * s;
    let m = fx < s - fx ? fx : s - fx;
    const my = fy < s - fy ? fy : s - fy;
    if (my < m) m = my;
    const mz = fz < s - fz ? fz : s - fz;
    if (mz < m) m = mz;
    const f = reach + m;
    this.free = (f < cap ? f : cap) - 1;
  }

  /**
   * Set `free` to a lower bound on (distance to the nearest centre) − 1 for a
   * walker at (x, y, z). When the walker is next to the cluster (level 0
   * marked) the bound is exact up to 2 + m and nearX/Y/Z hold every centre
   * within 2 of the walker (nearCount >= 0); otherwise nearCount is -1.
   */
  query(x: number, y: number, z: number): void {
    const field = this.field;
    field.lowerBound(x, y, z);
    const near = field.bound - 1;
    if (field.near && near >= FIELD_ACCEPT) {
      this.free = near;
      this.nearCount = -1;
      return;
    }
    // a centre within 3 of the centre of the walker's side-2 cell lies in the
    // 3 × 3 × 3 block of side-2 cells around it: level 0 is marked, so the
    // level search would end in the exact scan
    if (field.near && field.cellAbove <= 3) this.queryExact(x, y, z);
    else this.queryMarks(x, y, z);
    if (near > this.free) this.free = near;
  }

  private queryMarks(x: number, y: number, z: number): void {
    let k = this.hint;
    if (!this.marked(k, x, y, z)) {
      while (k < MAX_LEVEL && !this.marked(k + 1, x, y, z)) k++;
    } else {
      k--;
      while (k >= 0 && this.marked(k, x, y, z)) k--;
    }
    if (k >= 0) {
      this.hint = k;
      const s = SIDES[k];
      const sc = SCALES[k];
      this.nearCount = -1;
      this.setFree(this.widelyMarked(k, x, y, z) ? s : 2 * s, x, y, z, s, sc, Infinity);
      return;
    }
    this.queryExact(x, y, z);
  }

  /** The answer when level 0 is marked: exact up to 2 + m from the centres of the 3 × 3 × 3 block of side-2 cells. */
  private queryExact(x: number, y: number, z: number): void {
    this.hint = 0;
    const cx = Math.floor(x * 0.5) | 0;
    const cy = Math.floor(y * 0.5) | 0;
    const cz = Math.floor(z * 0.5) | 0;
    if (cx !== this.scanCx || cy !== this.scanCy || cz !== this.scanCz) this.useScanOf(cx, cy, cz);
    const nx = this.nearX;
    const ny = this.nearY;
    const nz = this.nearZ;
    let best2 = Infinity;
    for (let j = 0; j < this.scanCount; j++) {
      const dx = nx[j] - x;
      const dy = ny[j] - y;
      const dz = nz[j] - z;
      const d2 = dx * dx + dy * dy + dz * dz;
      if (d2 < best2) best2 = d2;
    }
    this.nearCount = this.scanCount;
    // the scanned block holds every centre within 2 + m of the walker
    this.setFree(2, x, y, z, 2, 0.5, Math.sqrt(best2));
  }

  /** Make nearX/Y/Z/Id the scan of side-2 cell (cx, cy, cz): a kept one, or a new one in the least recently used place. */
  private useScanOf(cx: number, cy: number, cz: number): void {
    let e = 0;
    while (e < SCAN_CACHE && !(this.cacheCx[e] === cx && this.cacheCy[e] === cy && this.cacheCz[e] === cz)) e++;
    const kept = e < SCAN_CACHE;
    if (!kept) {
      e = 0;
      for (let f = 1; f < SCAN_CACHE; f++) if (this.cacheUse[f] < this.cacheUse[e]) e = f;
    }
    this.scanSlot = e;
    this.cacheUse[e] = ++this.uses;
    this.nearX = this.cacheX[e];
    this.nearY = this.cacheY[e];
    this.nearZ = this.cacheZ[e];
    this.nearId = this.cacheId[e];
    if (kept) {
      this.scanCount = this.cacheCount[e];
      this.scanCx = cx;
      this.scanCy = cy;
      this.scanCz = cz;
      return;
    }
    this.scan(cx, cy, cz);
    this.cacheCx[e] = cx;
    this.cacheCy[e] = cy;
    this.cacheCz[e] = cz;
    this.cacheCount[e] = this.scanCount;
  }

  /**
   * Gather the centres of the 3 × 3 × 3 block of side-2 cells around
   * (cx, cy, cz), in a fixed order (bricks, then cells, then chains): the
   * level-0 hold bits of the bricks over the block pick the cells to look up.
   */
  private scan(cx: number, cy: number, cz: number): void {
    let c = 0;
    const xyz = this.coords;
    const next = this.next;
    const heads = this.headBricks;
    const pool = this.headPool;
    for (let bz = (cz - 1) >> 2; bz <= (cz + 1) >> 2; bz++)
      for (let by = (cy - 1) >> 2; by <= (cy + 1) >> 2; by++)
        for (let bx = (cx - 1) >> 2; bx <= (cx + 1) >> 2; bx++) {
          const o = heads.find(bx, by, bz);
          if (o < 0) continue;
          const base = heads.slots[o + 3] << 6;
          const z0 = Math.max(cz - 1, bz << 2), z1 = Math.min(cz + 1, (bz << 2) + 3);
          const y0 = Math.max(cy - 1, by << 2), y1 = Math.min(cy + 1, (by << 2) + 3);
          const x0 = Math.max(cx - 1, bx << 2), x1 = Math.min(cx + 1, (bx << 2) + 3);
          for (let z = z0; z <= z1; z++)
            for (let y = y0; y <= y1; y++)
              for (let x = x0; x <= x1; x++) {
                const b = (x & 3) | ((y & 3) << 2) | ((z & 3) << 4);
                for (let i = pool[base + b]; i >= 0; i = next[i]) {
                  if (c === this.nearX.length) this.growNear();
                  this.nearX[c] = xyz[3 * i];
                  this.nearY[c] = xyz[3 * i + 1];
                  this.nearZ[c] = xyz[3 * i + 2];
                  this.nearId[c] = i;
                  c++;
                }
              }
        }
    this.scanCount = c;
    this.scanCx = cx;
    this.scanCy = cy;
    this.scanCz = cz;
  }

  private growNear(): void {
    const m = 2 * this.nearX.length;
    const grow = (a: Float64Array): Float64Array => {
      const b = new Float64Array(m);
      b.set(a);
      return b;
    };
    this.nearX = grow(this.nearX);
    this.nearY = grow(this.nearY);
    this.nearZ = grow(this.nearZ);
    const id = new Int32Array(m);
    id.set(this.nearId);
    this.nearId = id;
    const e = this.scanSlot;
    this.cacheX[e] = this.nearX;
    this.cacheY[e] = this.nearY;
    this.cacheZ[e] = this.nearZ;
    this.cacheId[e] = id;
  }
}

/**
 * Set the mark bits of the (2r + 1)³ cells around cell (cx, cy, cz) in a
 * level's table (bits in words `word`, `word` + 1 of each brick of 4 × 4 × 4 cells):
 * one OR of a bit mask per brick the block overlaps, not one per cell.
 */
function markBlock(t: CellHashTable3d, cx: number, cy: number, cz: number, r: number, word: number): void {
  for (let bz = (cz - r) >> 2; bz <= (cz + r) >> 2; bz++) {
    const z0 = Math.max(cz - r, bz << 2) & 3;
    const z1 = Math.min(cz + r, (bz << 2) + 3) & 3;
    for (let by = (cy - r) >> 2; by <= (cy + r) >> 2; by++) {
      const y0 = Math.max(cy - r, by << 2) & 3;
      const y1 = Math.min(cy + r, (by << 2) + 3) & 3;
      for (let bx = (cx - r) >> 2; bx <= (cx + r) >> 2; bx++) {
        const x0 = Math.max(cx - r, bx << 2) & 3;
        const x1 = Math.min(cx + r, (bx << 2) + 3) & 3;
        // cell bit b = x + 4y + 16z: a row of x bits, a plane of rows, then z = 0, 1 in v0 and z = 2, 3 in v1
        const row = ((1 << (x1 - x0 + 1)) - 1) << x0;
        let plane = 0;
        for (let y = y0; y <= y1; y++) plane |= row << (4 * y);
        let lo = 0;
        let hi = 0;
        for (let z = z0; z <= z1; z++) {
          if (z < 2) lo |= plane << (16 * z);
          else hi |= plane << (16 * (z - 2));
        }
        const o = t.slotFor(bx, by, bz, 0);
        t.slots[o + word] |= lo;
        t.slots[o + word + 1] |= hi;
      }
    }
  }
}

/** True when the cell of (x, y, z) in a level's table (cells of side 1/sc) has its bit set in words `word`, `word` + 1. */
function markedIn(t: CellHashTable3d, sc: number, x: number, y: number, z: number, word: number): boolean {
  const cx = Math.floor(x * sc) | 0;
  const cy = Math.floor(y * sc) | 0;
  const cz = Math.floor(z * sc) | 0;
  const o = t.find(cx >> 2, cy >> 2, cz >> 2);
  if (o < 0) return false;
  const b = (cx & 3) | ((cy & 3) << 2) | ((cz & 3) << 4);
  return (t.slots[o + word + (b >> 5)] & (1 << (b & 31))) !== 0;
}
