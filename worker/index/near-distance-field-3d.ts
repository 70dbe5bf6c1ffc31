/**
 * Near-distance field of a cluster of balls in three dimensions: for every
 * cell of side CELL around the cluster, the distance from the cell's centre
 * to the nearest ball centre, rounded down to a multiple of 1/STEPS and
 * capped at CAP. It gives the 3D occupancy index
 * (worker/index/occupancy-index-3d.ts) a tight lower bound on how far a
 * walker is from the cluster: the distance to the nearest centre is
 * 1-Lipschitz, so for a walker at x in a cell with centre c and stored value
 * v <= d(c),
 *     d(x) >= v − |x − c|        (triangle inequality; exact, derived here),
 * and since v >= d(c) − 1/STEPS and d(c) >= d(x) − |x − c|, the bound loses
 * at most 2|x − c| + 1/STEPS <= 2√3 + 1/16 against d(x) within the cap.
 * With cells of side 2 the loss |x − c| is at most √3 and about 0.96 on
 * average, against the multi-level marks' loss of up to a cell side (the
 * marks' bound averaged 2.5 diameters where the true free distance averaged
 * 5.9). Measured at N = 10^4 (seeds 2–5, jumps per ball): cells of side 1
 * took 52 jumps but cost 50–65 µs a ball to insert at CAP 12; cells of
 * side 2 took 62 at 8–10 µs; CAP 8, 10, 12, 15 gave 73, 78, 62, 58 jumps.
 * At N = 10^5 (seed 1, the three run side by side, CPU seconds): marks only
 * 5.79 s (171 jumps a ball), CAP 12 5.38 s (83), CAP 8 4.90 s (92) — the
 * insert's cost grows as CAP³ and outweighs the jumps CAP 12 saves.
 *
 * Stored values are min over centres of floor(|c − p| · STEPS · (1 − 2^-40))
 * (the factor keeps floor from rounding up when |c − p| · STEPS lies within
 * rounding of an integer), and CAP · STEPS (= "no centre nearer than CAP")
 * where no centre is within CAP. A minimum over centres does not depend on
 * the order of insertion, so the field is the same after a checkpoint
 * rebuild. Inserting a centre visits the cells within CAP of it (about
 * (4/3)π CAP³ / CELL³ of them) and lowers the values it beats.
 *
 * Storage: bricks of 8 × 8 × 8 cells, one byte a cell (8 × 8 × 8 cut the
 * hash look-ups of an insert to about a third of 4 × 4 × 4's), in a pool that grows
 * by doubling; a sparse hash (worker/index/cell-hash-table-3d.ts) maps a
 * brick's coordinates to its number in the pool. Only bricks with a cell
 * within CAP of a centre exist, so memory grows with the cluster's
 * CAP-neighbourhood (at most proportional to N), never with its hull.
 */

import { CellHashTable3d } from './cell-hash-table-3d.js';

/** Cell side (diameters); a power of two, so cell coordinates are exact. */
const CELL = 2;
const INV_CELL = 1 / CELL;
/** Distances are stored in steps of 1/STEPS diameters. */
const STEPS = 16;
/** Distances at or beyond CAP are not stored (the cell reads CAP). */
export const NEAR_FIELD_CAP = 8;
const FAR = NEAR_FIELD_CAP * STEPS;
/** 1 − 2^-40: keeps the rounded-down value below the true distance. */
const SHRINK = 1 - 2 ** -40;
/** ENTER[v] = ((v + 1) / STEPS)²: a squared distance below it may lower a cell holding v. */
const ENTER = new Float64Array(FAR + 1);
for (let v = 0; v <= FAR; v++) ENTER[v] = ((v + 1) / STEPS) ** 2;
const CAP2 = NEAR_FIELD_CAP * NEAR_FIELD_CAP;
/** At most this many earlier centres cut an insert's work. */
const MAX_CUTS = 6;
/** Relative margin on a cut's threshold (far above the rounding of c·u and of |p|² − |n|²). */
const CUT_MARGIN = 2 ** -30;
/** Bricks per axis over the cells within CAP of a point (2·CAP/CELL + 1 cells, any alignment). */
const NEAR_SPAN = ((2 * NEAR_FIELD_CAP / CELL + 1 + 7) >> 3) + 1;
const UNKNOWN = -2;
const ABSENT = -1;
/** Bricks in the pool at start. */
const POOL_START = 1024;

export class NearDistanceField3d {
  /** Result of `lowerBound`: a lower bound on the distance from the point to the nearest centre. */
  bound = 0;
  /** True when the last `lowerBound` found a centre within CAP of the cell's centre. */
  near = false;
  /**
   * After `lowerBound`, when `near`: a number above the distance from the
   * point's cell centre to the nearest centre ((stored value + 2)/STEPS: one
   * step for the rounding down, one to spare for SHRINK and the rounding of
   * the square root).
   */
  cellAbove = 0;
  private readonly bricks = new CellHashTable3d(1024, 1);
  private pool = new Uint8Array(POOL_START * 512).fill(FAR);
  private brickCount = 0;
  /** Half-spaces of the insert in progress: ux, uy, uz, t, 1/ux per cut. */
  private readonly cut = new Float64Array(5 * MAX_CUTS);
  /** Pool offsets of the bricks around the insert in progress (UNKNOWN, ABSENT or an offset). */
  private readonly nearBricks = new Int32Array(NEAR_SPAN ** 3);

  /** Bytes held by the field. */
  get bytes(): number {
    return this.bricks.bytes + this.pool.byteLength;
  }

  /** Bricks allocated (for tests and measurements). */
  get brickTotal(): number {
    return this.brickCount;
  }

  /**
   * Lower every cell within CAP of the new centre (px, py, pz) to its
   * distance from it. (nx, ny, nz)[0 … count) may list earlier centres (any,
   * e.g. the index's last exact scan): those within 2 of the new one cut the
   * work, since a cell at least as close to an earlier centre n as to the new
   * one already holds a value no larger than the new one would give (it was
   * lowered by n), so the half-space {c : (c − (p + n)/2)·(p − n) <= 0} is
   * skipped, row by row (about half the cells). The field does not depend on
   * which earlier centres are listed.
   */
  insert(px: number, py: number, pz: number, nx: Float64Array, ny: Float64Array, nz: Float64Array, count: number): void {
    // half-spaces to skip: c·u <= t, u = p − n, t = (|p|² − |n|²)/2 − margin
    const cut = this.cut;
    let cuts = 0;
    const p2 = px * px + py * py + pz * pz;
    for (let q = 0; q < count && cuts < MAX_CUTS; q++) {
      const ux = px - nx[q];
      const uy = py - ny[q];
      const uz = pz - nz[q];
      const u2 = ux * ux + uy * uy + uz * uz;
      if (u2 >= 4 || u2 < 0.25) continue;
      cut[5 * cuts] = ux;
      cut[5 * cuts + 1] = uy;
      cut[5 * cuts + 2] = uz;
      cut[5 * cuts + 4] = 1 / ux;
      // the margin covers rounding in c·u and in t (coordinates below 2^31 cells)
      cut[5 * cuts + 3] = (p2 - (nx[q] * nx[q] + ny[q] * ny[q] + nz[q] * nz[q])) * 0.5 - CUT_MARGIN * (1 + p2);
      cuts++;
    }
    // cell (i, j, k) covers [i·CELL, (i + 1)·CELL) per axis, centre (i + 0.5)·CELL
    const x0 = Math.ceil((px - NEAR_FIELD_CAP) * INV_CELL - 0.5) | 0;
    const x1 = Math.floor((px + NEAR_FIELD_CAP) * INV_CELL - 0.5) | 0;
    const y0 = Math.ceil((py - NEAR_FIELD_CAP) * INV_CELL - 0.5) | 0;
    const y1 = Math.floor((py + NEAR_FIELD_CAP) * INV_CELL - 0.5) | 0;
    const z0 = Math.ceil((pz - NEAR_FIELD_CAP) * INV_CELL - 0.5) | 0;
    const z1 = Math.floor((pz + NEAR_FIELD_CAP) * INV_CELL - 0.5) | 0;
    // pool offsets of the bricks over the box, looked up once: UNKNOWN, ABSENT or the offset
    const bx0 = x0 >> 3;
    const by0 = y0 >> 3;
    const bz0 = z0 >> 3;
    const near = this.nearBricks;
    near.fill(UNKNOWN);
    let pool = this.pool;
    for (let k = z0; k <= z1; k++) {
      const zc = (k + 0.5) * CELL;
      const dz = zc - pz;
      const dz2 = dz * dz;
      if (dz2 >= CAP2) continue;
      rows: for (let j = y0; j <= y1; j++) {
        const yc = (j + 0.5) * CELL;
        const dy = yc - py;
        const dyz2 = dz2 + dy * dy;
        if (dyz2 >= CAP2) continue;
        // the row's cells within CAP (one cell to spare each side; the value test below is exact)
        const half = Math.sqrt(CAP2 - dyz2);
        let ilo = Math.floor((px - half) * INV_CELL - 0.5);
        let ihi = Math.ceil((px + half) * INV_CELL - 0.5);
        if (ilo < x0) ilo = x0;
        if (ihi > x1) ihi = x1;
        for (let q = 0; q < cuts; q++) {
          // keep the cells with xc·ux > r; each bound spares a whole cell against rounding
          const ux = cut[5 * q];
          const r = cut[5 * q + 3] - yc * cut[5 * q + 1] - zc * cut[5 * q + 2];
          if (ux > 0) {
            const lo = Math.floor(r * cut[5 * q + 4] * INV_CELL - 0.5);
            if (lo > ilo) ilo = lo;
          } else if (ux < 0) {
            const hi = Math.ceil(r * cut[5 * q + 4] * INV_CELL - 0.5);
            if (hi < ihi) ihi = hi;
          } else if (r >= 0) continue rows;
        }
        const brickRow = (((k >> 3) - bz0) * NEAR_SPAN + ((j >> 3) - by0)) * NEAR_SPAN - bx0;
        const cellRow = ((k & 7) << 6) + ((j & 7) << 3);
        for (let i = ilo; i <= ihi; i++) {
          const dx = (i + 0.5) * CELL - px;
          const d2 = dyz2 + dx * dx;
          const nb = brickRow + (i >> 3);
          let base = near[nb];
          if (base === UNKNOWN) {
            const o = this.bricks.find(i >> 3, j >> 3, k >> 3);
            base = o < 0 ? ABSENT : this.bricks.slots[o + 3] << 9;
            near[nb] = base;
          }
          const v = base === ABSENT ? FAR : pool[base + cellRow + (i & 7)];
          if (d2 < ENTER[v]) {
            const w = Math.floor(Math.sqrt(d2) * STEPS * SHRINK);
            if (w < v) {
              if (base === ABSENT) {
                base = this.brick(i >> 3, j >> 3, k >> 3) << 9;
                near[nb] = base;
                pool = this.pool;
              }
              pool[base + cellRow + (i & 7)] = w;
            }
          }
        }
      }
    }
  }

  /**
   * Set `bound` to a lower bound on the distance from (x, y, z) to the
   * nearest centre: (stored value of the point's cell) − |point − cell centre|.
   * `near` says whether that value is below CAP (a centre within CAP of the
   * cell's centre); when it is not, the bound is CAP − |point − cell centre|.
   */
  lowerBound(x: number, y: number, z: number): void {
    const fx = Math.floor(x * INV_CELL);
    const fy = Math.floor(y * INV_CELL);
    const fz = Math.floor(z * INV_CELL);
    const i = fx | 0;
    const j = fy | 0;
    const k = fz | 0;
    const o = this.bricks.find(i >> 3, j >> 3, k >> 3);
    const v = o < 0 ? FAR : this.pool[(this.bricks.slots[o + 3] << 9) + ((k & 7) << 6) + ((j & 7) << 3) + (i & 7)];
    const dx = x - (fx + 0.5) * CELL;
    const dy = y - (fy + 0.5) * CELL;
    const dz = z - (fz + 0.5) * CELL;
    this.near = v < FAR;
    this.cellAbove = (v + 2) / STEPS;
    this.bound = v / STEPS - Math.sqrt(dx * dx + dy * dy + dz * dz);
  }

  /** Pool number of brick (bx, by, bz), allocating it (all cells FAR) when absent. */
  private brick(bx: number, by: number, bz: number): number {
    const t = this.bricks;
    const o = t.slotFor(bx, by, bz, -1);
    const s = t.slots;
    if (s[o + 3] >= 0) return s[o + 3];
    const b = this.brickCount++;
    if ((b + 1) << 9 > this.pool.length) {
      const grown = new Uint8Array(this.pool.length * 2).fill(FAR);
      grown.set(this.pool);
      this.pool = grown;
    }
    s[o + 3] = b;
    return b;
  }
}
