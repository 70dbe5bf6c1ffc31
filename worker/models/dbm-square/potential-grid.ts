/**
 * The potential of the lattice dielectric breakdown model on the square
 * lattice, on a box grid that grows with the cluster, and its solver.
 *
 * The problem (worker/models/dbm-square/kernel.ts states the model): the
 * unknowns are the EMPTY sites strictly inside the disk |(i, j)| < R_far
 * centred on the seed; on each of them the discrete Laplace equation
 *   4 φ(i, j) = φ(i+1, j) + φ(i−1, j) + φ(i, j+1) + φ(i, j−1)
 * holds, with φ = 0 on cluster sites and on enclosed holes (their exact
 * value, see enclosed-regions.ts) and φ = 1 on every site outside the disk.
 * The matrix (4 on the diagonal, −1 between neighbouring unknowns) is
 * symmetric positive definite.
 *
 * The solver: conjugate gradients (Hestenes & Stiefel 1952, J. Res. NBS 49,
 * 409; from memory) preconditioned by symmetric successive over-relaxation
 * (SSOR, one forward and one backward sweep in row-major order; the
 * relaxation factor is a function of R_far alone) on the correction x with
 * A x = r0, r0 = b − A φ the residual of the stored potential, warm-started: φ is the previous
 * particle's potential with the new site set to 0, so r0 is small and
 * local. The solve stops when the largest residual of the averaged equation,
 * max |φ − mean of the four neighbours| = max |r| / 4, is at most the
 * tolerance, and adds x to φ. Nothing else is kept between solves: the
 * stored φ (and the cluster) is the whole state, so a checkpoint of φ
 * resumes to the same bits. Every loop runs over the disk's rows in
 * row-major order, whatever the box size, so the arithmetic is the same
 * whatever the box has grown to.
 *
 * The box: sites (i, j) with |i|, |j| <= half, stored row-major; it grows
 * (by a quarter, at least to what is needed) when the disk needs it. Sites
 * never inside the disk keep φ = 1.
 */
import { type StopSignal, WalkerStuck, stopRaised } from '../../core/stop-signal.js';

export const EMPTY = 0;
export const CLUSTER = 1;
export const HOLE = 2;

/** Most sites the box may hold (about 45 bytes each): a larger one is refused with a one-line message. */
export const MAX_GRID_SITES = 1 << 24;

/** Most conjugate-gradient iterations one solve may take before the run fails as stuck (a tolerance below the float resolution). */
export const MAX_ITERATIONS_PER_SOLVE = 200_000;

export class PotentialGrid {
  half = 0;
  side = 1;
  /** Disk radius R_far of the current problem (sites with i² + j² < R_far² are inside). */
  radius = 0;
  phi = new Float64Array(1);
  kind = new Uint8Array(1);
  /** rowWidth[j + half]: largest |i| inside the disk on row j, −1 when the row misses it. */
  rowWidth = new Int32Array(1);
  private x = new Float64Array(1);
  private r = new Float64Array(1);
  private p = new Float64Array(1);
  private q = new Float64Array(1);
  private z = new Float64Array(1);
  /** Iterations of the last solve. */
  iterations = 0;

  constructor(half: number) {
    this.allocate(half);
  }

  index(i: number, j: number): number {
    return (j + this.half) * this.side + (i + this.half);
  }

  /** Bytes held by the arrays (for benchmarks). */
  get bytes(): number {
    return this.side * this.side * (6 * 8 + 1) + this.rowWidth.byteLength;
  }

  /** Make the disk of radius `radius` (never smaller than the current one) the problem's domain, growing the box if needed. */
  setRadius(radius: number): void {
    if (radius < this.radius) throw new RangeError(`far boundary radius may only grow (${this.radius} to ${radius})`);
    const need = Math.floor(radius) + 2;
    if (need > this.half) this.allocate(Math.max(need, Math.ceil(1.25 * this.half)));
    this.radius = radius;
    const r2 = radius * radius;
    const h = this.half;
    for (let j = -h; j <= h; j++) {
      if (j * j >= r2) {
        this.rowWidth[j + h] = -1;
        continue;
      }
      let w = Math.floor(Math.sqrt(r2 - j * j));
      while (w > 0 && w * w + j * j >= r2) w--;
      while ((w + 1) * (w + 1) + j * j < r2) w++;
      this.rowWidth[j + h] = w;
    }
  }

  private allocate(half: number): void {
    const side = 2 * half + 1;
    if (side * side > MAX_GRID_SITES) {
      throw new RangeError(`dbm-square: the potential grid would need ${side} × ${side} sites (far boundary radius ${this.radius.toFixed(1)}), above the limit of ${MAX_GRID_SITES}; grow fewer particles or lower params.far_factor`);
    }
    const phi = new Float64Array(side * side).fill(1);
    const kind = new Uint8Array(side * side);
    const oldHalf = this.half;
    const oldSide = this.side;
    if (this.phi.length > 1) {
      const d = half - oldHalf;
      for (let row = 0; row < oldSide; row++) {
        const from = row * oldSide;
        const to = (row + d) * side + d;
        phi.set(this.phi.subarray(from, from + oldSide), to);
        kind.set(this.kind.subarray(from, from + oldSide), to);
      }
    }
    this.half = half;
    this.side = side;
    this.phi = phi;
    this.kind = kind;
    this.x = new Float64Array(side * side);
    this.r = new Float64Array(side * side);
    this.p = new Float64Array(side * side);
    this.q = new Float64Array(side * side);
    this.z = new Float64Array(side * side);
    this.rowWidth = new Int32Array(side).fill(-1);
  }

  /** Set site (i, j) to `k` (CLUSTER or HOLE) with φ = 0. */
  block(i: number, j: number, k: number): void {
    const idx = this.index(i, j);
    this.kind[idx] = k;
    this.phi[idx] = 0;
  }

  /**
   * Solve to the tolerance (largest residual of the averaged equation).
   * Returns false, leaving φ as it was, when `stop` is raised; reads it once
   * per iteration.
   */
  solve(tolerance: number, stop?: StopSignal): boolean {
    const { phi, kind, x, r, p, q, z, rowWidth, half, side } = this;
    const limit = 4 * tolerance;
    const omega = this.relaxation();
    // r = b − A φ on the unknowns (φ holds the boundary values), x = 0; r, z, p zero elsewhere in the disk
    let rmax = 0;
    for (let j = -half; j <= half; j++) {
      const w = rowWidth[j + half];
      if (w < 0) continue;
      const base = (j + half) * side + half;
      for (let idx = base - w, end = base + w; idx <= end; idx++) {
        x[idx] = 0;
        if (kind[idx] !== EMPTY) {
          r[idx] = 0;
          p[idx] = 0;
          z[idx] = 0;
          continue;
        }
        const v = phi[idx + 1] + phi[idx - 1] + phi[idx + side] + phi[idx - side] - 4 * phi[idx];
        r[idx] = v;
        const a = v < 0 ? -v : v;
        if (a > rmax) rmax = a;
      }
    }
    let rz = rmax > limit ? this.precondition(omega) : 0;
    if (rmax > limit) {
      for (let j = -half; j <= half; j++) {
        const w = rowWidth[j + half];
        if (w < 0) continue;
        const base = (j + half) * side + half;
        for (let idx = base - w, end = base + w; idx <= end; idx++) if (kind[idx] === EMPTY) p[idx] = z[idx];
      }
    }
    let it = 0;
    while (rmax > limit) {
      if (stopRaised(stop)) return false;
      if (++it > MAX_ITERATIONS_PER_SOLVE) throw new WalkerStuck(`dbm-square: the potential solve did not reach tolerance ${tolerance} in ${MAX_ITERATIONS_PER_SOLVE} iterations (residual ${(rmax / 4).toExponential(2)})`);
      // q = A p, pq = p · q
      let pq = 0;
      for (let j = -half; j <= half; j++) {
        const w = rowWidth[j + half];
        if (w < 0) continue;
        const base = (j + half) * side + half;
        for (let idx = base - w, end = base + w; idx <= end; idx++) {
          if (kind[idx] !== EMPTY) continue;
          const pi = p[idx];
          const v = 4 * pi - p[idx + 1] - p[idx - 1] - p[idx + side] - p[idx - side];
          q[idx] = v;
          pq += pi * v;
        }
      }
      const alpha = rz / pq;
      // x += α p, r −= α q, and in the same row-major pass the forward SSOR sweep on the new r
      const w4 = omega / 4;
      rmax = 0;
      for (let j = -half; j <= half; j++) {
        const w = rowWidth[j + half];
        if (w < 0) continue;
        const base = (j + half) * side + half;
        for (let idx = base - w, end = base + w; idx <= end; idx++) {
          if (kind[idx] !== EMPTY) continue;
          x[idx] += alpha * p[idx];
          const v = r[idx] - alpha * q[idx];
          r[idx] = v;
          const a = v < 0 ? -v : v;
          if (a > rmax) rmax = a;
          z[idx] = 0.25 * v + w4 * (z[idx - 1] + z[idx - side]);
        }
      }
      if (rmax <= limit) break;
      const rzNext = this.backwardSweep(omega);
      const beta = rzNext / rz;
      rz = rzNext;
      for (let j = -half; j <= half; j++) {
        const w = rowWidth[j + half];
        if (w < 0) continue;
        const base = (j + half) * side + half;
        for (let idx = base - w, end = base + w; idx <= end; idx++) {
          if (kind[idx] !== EMPTY) continue;
          p[idx] = z[idx] + beta * p[idx];
        }
      }
    }
    if (it > 0) {
      for (let j = -half; j <= half; j++) {
        const w = rowWidth[j + half];
        if (w < 0) continue;
        const base = (j + half) * side + half;
        for (let idx = base - w, end = base + w; idx <= end; idx++) if (kind[idx] === EMPTY) phi[idx] += x[idx];
      }
    }
    this.iterations = it;
    return true;
  }

  /**
   * SSOR relaxation factor for the current disk: 2 / (1 + sin(π / (2 R_far + 1))),
   * the optimal SOR factor of a square of the disk's width (Young 1971,
   * Iterative Solution of Large Linear Systems; from memory); any value in
   * (0, 2) keeps the preconditioner symmetric positive definite.
   */
  private relaxation(): number {
    return 2 / (1 + Math.sin(Math.PI / (2 * this.radius + 1)));
  }

  /**
   * z = M⁻¹ r for the SSOR preconditioner M ∝ (D + ωL) D⁻¹ (D + ωU) in
   * row-major order (a forward and a backward sweep over the disk); returns r · z.
   */
  private precondition(omega: number): number {
    const { kind, r, z, rowWidth, half, side } = this;
    const w4 = omega / 4;
    for (let j = -half; j <= half; j++) {
      const w = rowWidth[j + half];
      if (w < 0) continue;
      const base = (j + half) * side + half;
      for (let idx = base - w, end = base + w; idx <= end; idx++) {
        if (kind[idx] !== EMPTY) continue;
        z[idx] = 0.25 * r[idx] + w4 * (z[idx - 1] + z[idx - side]);
      }
    }
    return this.backwardSweep(omega);
  }

  /** The backward half of the SSOR sweep (z holds the forward sweep's result); returns r · z. */
  private backwardSweep(omega: number): number {
    const { kind, r, z, rowWidth, half, side } = this;
    const w4 = omega / 4;
    let rz = 0;
    for (let j = half; j >= -half; j--) {
      const w = rowWidth[j + half];
      if (w < 0) continue;
      const base = (j + half) * side + half;
      for (let idx = base + w, end = base - w; idx >= end; idx--) {
        if (kind[idx] !== EMPTY) continue;
        const v = z[idx] + w4 * (z[idx + 1] + z[idx + side]);
        z[idx] = v;
        rz += r[idx] * v;
      }
    }
    return rz;
  }

  /** φ of the unknowns (EMPTY sites inside the disk), row-major over the disk: the solver state a checkpoint keeps. */
  unknownValues(): Float64Array {
    let n = 0;
    this.forUnknowns(() => n++);
    const out = new Float64Array(n);
    let k = 0;
    this.forUnknowns((idx) => (out[k++] = this.phi[idx]));
    return out;
  }

  /** Put back what unknownValues gave (same disk, same blocked sites); throws when the count differs. */
  restoreUnknownValues(values: Float64Array): void {
    let n = 0;
    this.forUnknowns(() => n++);
    if (n !== values.length) throw new RangeError(`checkpoint modelState holds ${values.length} potential values, the cluster's grid has ${n} unknowns`);
    let k = 0;
    this.forUnknowns((idx) => (this.phi[idx] = values[k++]));
  }

  private forUnknowns(f: (idx: number) => void): void {
    const { kind, rowWidth, half, side } = this;
    for (let j = -half; j <= half; j++) {
      const w = rowWidth[j + half];
      if (w < 0) continue;
      const base = (j + half) * side + half;
      for (let idx = base - w, end = base + w; idx <= end; idx++) if (kind[idx] === EMPTY) f(idx);
    }
  }
}
