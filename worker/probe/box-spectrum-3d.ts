/**
 * Multifractal spectrum of a measure on points in 3D from boxes (pure).
 *
 * Boxes of side ε on a grid anchored at the lowest corner of the points'
 * bounding box; μ_B is the measure in box B. The partition function
 * Z(q, ε) = Σ_{μ_B > 0} μ_B^q scales as ε^{τ(q)}, with the convention
 * τ(q) = (q − 1) D_q (Halsey et al. 1986, Phys. Rev. A 33, 1141; from
 * memory): τ(1) = 0 for a normalised measure and τ(0) = −D_0, minus the
 * box-counting dimension of the support. τ(q) is the least-squares slope of
 * ln Z against ln ε over the given box sides.
 */

/** ln Z(q, ε) for each q (rows) and box side ε (columns), and the slopes τ(q). */
export function boxSpectrum3d(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  z: ArrayLike<number>,
  measure: ArrayLike<number>,
  q: readonly number[],
  sides: readonly number[],
): { tau: number[]; lnZ: number[][] } {
  const n = measure.length;
  if (x.length < n || y.length < n || z.length < n) throw new RangeError('box spectrum: fewer coordinates than measure values');
  if (sides.length < 2) throw new RangeError('box spectrum: at least two box sides are needed');
  let total = 0;
  for (let i = 0; i < n; i++) {
    if (!(measure[i] >= 0)) throw new RangeError(`box spectrum: measure of point ${i} must be >= 0, got ${measure[i]}`);
    total += measure[i];
  }
  if (!(total > 0)) throw new RangeError('box spectrum: the measure is zero');
  let lx = Infinity, ly = Infinity, lz = Infinity;
  for (let i = 0; i < n; i++) {
    if (x[i] < lx) lx = x[i];
    if (y[i] < ly) ly = y[i];
    if (z[i] < lz) lz = z[i];
  }
  const lnZ = q.map(() => [] as number[]);
  for (const eps of sides) {
    if (!(eps > 0)) throw new RangeError(`box spectrum: box side must be > 0, got ${eps}`);
    const boxes = new Map<string, number>();
    for (let i = 0; i < n; i++) {
      if (measure[i] === 0) continue;
      const key = `${Math.floor((x[i] - lx) / eps)},${Math.floor((y[i] - ly) / eps)},${Math.floor((z[i] - lz) / eps)}`;
      boxes.set(key, (boxes.get(key) ?? 0) + measure[i] / total);
    }
    q.forEach((qq, k) => {
      let s = 0;
      for (const m of boxes.values()) s += Math.pow(m, qq);
      lnZ[k].push(Math.log(s));
    });
  }
  const lx2 = sides.map(Math.log);
  const mean = lx2.reduce((a, b) => a + b, 0) / lx2.length;
  const sxx = lx2.reduce((a, b) => a + (b - mean) ** 2, 0);
  const tau = lnZ.map((row) => {
    const my = row.reduce((a, b) => a + b, 0) / row.length;
    let sxy = 0;
    for (let j = 0; j < row.length; j++) sxy += (lx2[j] - mean) * (row[j] - my);
    return sxy / sxx;
  });
  return { tau, lnZ };
}
