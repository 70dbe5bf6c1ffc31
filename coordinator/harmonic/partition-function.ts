/**
 * Box statistics of a discrete measure in the plane: for each box side ε,
 * the measure μ(B) of every box B of the grid of side ε anchored at
 * (originX, originY), and from them
 *   Z(q, ε) = Σ_{B: μ(B) > 0} μ(B)^q   (the partition function),
 *   S(ε)    = Σ_B μ(B) log μ(B)        (dZ/dq at q = 1),
 *   M(ε)    = max_B μ(B)               (maximum concentration).
 * The measure is given as weighted points (weights need not be normalised;
 * they are divided by their sum). Four grids are laid, at offsets (0, 0),
 * (ε/2, ε/2), (ε/4, 3ε/4), (3ε/4, ε/4) from the anchor. To damp the lattice
 * noise of a single grid, Z and S are averaged over the four (common
 * practice, no source). M is NOT averaged: it is the maximum over all boxes
 * of all four grids, i.e. over the union of the four families of boxes.
 * Why the maximum is the right choice: the quantity the maximum-concentration
 * exponent is about (and that Beurling's estimate bounds) is the
 * translation-free M*(ε) = sup over all positions x of μ(x + [0, ε)²), which
 * does not depend on where a grid happens to cut. Each grid's maximum is a
 * lower bound on M*(ε) and M*(ε) ≤ 4 × (any one grid's maximum), since a box
 * of side ε at any position meets at most four boxes of a grid. The maximum
 * over more box positions is the closer lower bound, and it is never worse
 * than any one grid; the average of per-grid maxima is pulled down by
 * whichever grid splits the concentration (a point cluster on a grid corner
 * counts 1/4 in that grid), which varies with ε and adds lattice noise to
 * the log–log slope. Both give the same exponent as ε → 0 (they differ by a
 * bounded factor); the maximum is the one with the smaller finite-size noise.
 * test/harmonic-measures.test.ts checks M on a cluster placed on a corner of
 * one grid.
 *
 * In 3D (points with a z axis) the boxes are cubes of side ε; four grids at
 * offsets (0, 0, 0), (ε/2, ε/2, ε/2), (ε/4, 3ε/4, ε/4), (3ε/4, ε/4, 3ε/4),
 * the same averaging and the same maximum (a cube at any position meets at
 * most eight cubes of a grid). Box indices must stay below 2^17 per axis
 * (at most 131072 boxes across the set): a smaller box side is refused.
 */
const OFFSETS = [[0, 0], [0.5, 0.5], [0.25, 0.75], [0.75, 0.25]];
const OFFSETS_3D = [[0, 0, 0], [0.5, 0.5, 0.5], [0.25, 0.75, 0.25], [0.75, 0.25, 0.75]];
const AXIS_3D = 131072;

export interface WeightedPoints {
  count: number;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** Third axis of points in 3D; absent in the plane. */
  z?: ArrayLike<number>;
  /** Non-negative weights; null = weight 1 each. */
  w: ArrayLike<number> | null;
}

export interface BoxStatistics {
  /** Box sides ε, ascending. */
  eps: number[];
  q: number[];
  /** z[s][k] = Z(q[k], eps[s]). */
  z: number[][];
  entropy: number[];
  maxMeasure: number[];
  /** Number of occupied boxes per scale. */
  occupied: number[];
}

export function boxStatistics(p: WeightedPoints, eps: readonly number[], q: readonly number[], originX: number, originY: number, originZ = 0): BoxStatistics {
  let total = 0;
  for (let i = 0; i < p.count; i++) {
    const wi = p.w === null ? 1 : p.w[i];
    if (!(wi >= 0)) throw new RangeError(`measure weight ${i} must be >= 0, got ${wi}`);
    total += wi;
  }
  if (!(total > 0)) throw new RangeError('measure has zero total weight');
  const out: BoxStatistics = { eps: [...eps], q: [...q], z: [], entropy: [], maxMeasure: [], occupied: [] };
  const pz = p.z;
  const offsets = pz ? OFFSETS_3D : OFFSETS;
  const no = offsets.length;
  for (const e of eps) {
    const zq = new Array<number>(q.length).fill(0);
    let s = 0;
    let m = 0;
    let occ = 0;
    for (const [fx, fy, fz] of offsets) {
      const boxes = new Map<number, number>();
      const inv = 1 / e;
      const ax = originX - fx * e;
      const ay = originY - fy * e;
      const az = originZ - (fz ?? 0) * e;
      for (let i = 0; i < p.count; i++) {
        const wi = p.w === null ? 1 : p.w[i];
        if (wi === 0) continue;
        const ix = Math.floor((p.x[i] - ax) * inv);
        const iy = Math.floor((p.y[i] - ay) * inv);
        let key: number;
        if (pz) {
          const iz = Math.floor((pz[i] - az) * inv);
          if (ix < 0 || iy < 0 || iz < 0 || ix >= AXIS_3D || iy >= AXIS_3D || iz >= AXIS_3D)
            throw new RangeError(`box side ${e.toPrecision(3)} is too small for this set: at most ${AXIS_3D} boxes across each axis in 3D`);
          key = (ix * AXIS_3D + iy) * AXIS_3D + iz;
        } else key = ix * 4194304 + iy; // 0 <= ix, iy < 2^21 for the scales used
        boxes.set(key, (boxes.get(key) ?? 0) + wi);
      }
      for (const v of boxes.values()) {
        const mu = v / total;
        const lm = Math.log(mu);
        for (let k = 0; k < q.length; k++) zq[k] += Math.exp(q[k] * lm) / no;
        s += (mu * lm) / no;
        if (mu > m) m = mu;
      }
      occ += boxes.size / no;
    }
    out.z.push(zq);
    out.entropy.push(s);
    out.maxMeasure.push(m);
    out.occupied.push(occ);
  }
  return out;
}

/** n log-spaced values from lo to hi inclusive. */
export function logSpaced(lo: number, hi: number, n: number): number[] {
  if (!(lo > 0 && hi > lo && n >= 2)) throw new RangeError(`log-spaced scales need 0 < lo < hi and n >= 2, got ${lo}, ${hi}, ${n}`);
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(lo * Math.pow(hi / lo, i / (n - 1)));
  return out;
}

