/**
 * Lattice anisotropy of a planar cluster, measured the same way for every
 * model (lattice clusters, and off-lattice ones as the isotropic baseline).
 *
 * k-fold amplitude (k = 4 for the square lattice, 6 for the triangular one):
 *   A_k = | Σ_j exp(i k θ_j) | / n
 * over the n particles j whose distance r_j from the seed lies in the outer
 * shell R_max/2 < r_j <= R_max, θ_j their polar angle about the seed. Growth
 * that prefers the k lattice directions (long arms along the axes) makes the
 * angles cluster at multiples of 2π/k and A_k grows toward 1; for n angles
 * drawn independently and uniformly, E[A_k²] = 1/n exactly (the n unit
 * vectors e^{ikθ_j} are independent with mean 0), so an isotropic cluster
 * shows A_k of order n^(−1/2). Only the outer shell is used because the
 * interior is frozen early: it describes the cluster when it was smaller.
 *
 * Axis-to-diagonal extent ratio, for the same k:
 *   Q_k = mean over the k axis directions u_m = angle 2πm/k of max_j (p_j · u_m)
 *         / mean over the k diagonal directions angle 2π(m + ½)/k of max_j (p_j · u)
 * with p_j the centres relative to the seed. Arms along the lattice axes
 * reach farther along the axes than along the diagonals, so Q_k > 1; a disk
 * gives exactly 1. (Common practice, no source: extents along chosen
 * directions; the k-fold Fourier amplitude of the mass distribution is the
 * measure used for lattice DLA by Grebenkov & Beliaev 2017, Phys. Rev. E 96,
 * 042159, with their own normalisation.)
 *
 * Both are O(n) per call, with no allocation; kernels record them at their
 * record sizes.
 */

/** Result fields of anisotropyOf (reused, to keep hot paths free of allocation). */
export const anisotropy = { amplitude: 0, shellCount: 0, axisRatio: 1 };

const MAX_FOLD = 12;
const AXIS_COS = new Float64Array(2 * MAX_FOLD);
const AXIS_SIN = new Float64Array(2 * MAX_FOLD);
const FAR = new Float64Array(2 * MAX_FOLD);

/**
 * Measure A_k and Q_k of the first `count` centres of dimension-strided
 * planar positions (x at coords[i·stride], y at coords[i·stride + 1]),
 * relative to the seed at (seedX, seedY), with rMax the largest distance of
 * a centre from the seed. Results go to `anisotropy`.
 */
export function anisotropyOf(coords: Float64Array, stride: number, count: number, k: number, rMax: number, seedX = 0, seedY = 0): void {
  if (!(Number.isInteger(k) && k >= 1 && k <= MAX_FOLD)) throw new RangeError(`fold k must be an integer from 1 to ${MAX_FOLD}, got ${k}`);
  for (let m = 0; m < 2 * k; m++) {
    // axis directions at even m, diagonals at odd m: angle π m / k
    const a = (Math.PI * m) / k;
    AXIS_COS[m] = Math.cos(a);
    AXIS_SIN[m] = Math.sin(a);
    FAR[m] = -Infinity;
  }
  const inner2 = 0.25 * rMax * rMax;
  const outer2 = rMax * rMax;
  let sc = 0;
  let ss = 0;
  let n = 0;
  // a centre at distance r cannot raise an extent that is already >= r: skip
  // the projections when r² < (smallest extent so far)² (with a margin of
  // 1e-12 for rounding in the projection), which leaves the result unchanged
  let skip2 = -1;
  for (let i = 0, j = 0; i < count; i++, j += stride) {
    const dx = coords[j] - seedX;
    const dy = coords[j + 1] - seedY;
    const r2 = dx * dx + dy * dy;
    if (!(r2 < skip2)) {
      let low = Infinity;
      for (let m = 0; m < 2 * k; m++) {
        const p = dx * AXIS_COS[m] + dy * AXIS_SIN[m];
        if (p > FAR[m]) FAR[m] = p;
        if (FAR[m] < low) low = FAR[m];
      }
      skip2 = low > 0 ? low * low * (1 - 1e-12) : -1;
    }
    if (r2 > inner2 && r2 <= outer2) {
      // cos(kθ) + i sin(kθ) from (dx, dy)/r by de Moivre (no trigonometry per particle)
      const r = Math.sqrt(r2);
      const c = dx / r;
      const s = dy / r;
      let re = 1;
      let im = 0;
      for (let t = 0; t < k; t++) {
        const nr = re * c - im * s;
        im = re * s + im * c;
        re = nr;
      }
      sc += re;
      ss += im;
      n++;
    }
  }
  let axis = 0;
  let diag = 0;
  for (let m = 0; m < 2 * k; m++) {
    if (m % 2 === 0) axis += FAR[m];
    else diag += FAR[m];
  }
  anisotropy.shellCount = n;
  anisotropy.amplitude = n > 0 ? Math.sqrt(sc * sc + ss * ss) / n : 0;
  anisotropy.axisRatio = diag > 0 ? axis / diag : 1;
}

/** The observables every planar model records (GrowthSeries.extra), for descriptors to declare. */
export const PLANAR_ANISOTROPY_OBSERVABLES = [
  { name: 'fold_amplitude_4', meaning: '4-fold amplitude |Σ exp(4iθ)|/n of the particles between R_max/2 and R_max (square-lattice anisotropy; about n^-1/2 when isotropic)' },
  { name: 'axis_ratio_4', meaning: 'mean extent along the 4 square-lattice axes over the mean extent along the 4 diagonals (1 for a disk)' },
  { name: 'fold_amplitude_6', meaning: '6-fold amplitude |Σ exp(6iθ)|/n of the particles between R_max/2 and R_max (triangular-lattice anisotropy)' },
  { name: 'axis_ratio_6', meaning: 'mean extent along the 6 triangular-lattice axes over the mean extent along the 6 diagonals' },
] as const;

const COS4 = new Float64Array(8);
const SIN4 = new Float64Array(8);
const COS6 = new Float64Array(12);
const SIN6 = new Float64Array(12);
for (let m = 0; m < 8; m++) {
  COS4[m] = Math.cos((Math.PI * m) / 4);
  SIN4[m] = Math.sin((Math.PI * m) / 4);
}
for (let m = 0; m < 12; m++) {
  COS6[m] = Math.cos((Math.PI * m) / 6);
  SIN6[m] = Math.sin((Math.PI * m) / 6);
}
const FAR4 = new Float64Array(8);
const FAR6 = new Float64Array(12);

/**
 * Append the four planar anisotropy observables (k = 4 and 6) of the first
 * `count` centres to a series' extra records. One pass computes both folds
 * with the same operations as anisotropyOf (the de Moivre powers of k = 4
 * are the first four of k = 6), so the values are bit for bit those of two
 * anisotropyOf calls.
 */
export function recordPlanarAnisotropy(extra: Record<string, number[]>, coords: Float64Array, stride: number, count: number, rMax: number, seedX = 0, seedY = 0): void {
  FAR4.fill(-Infinity);
  FAR6.fill(-Infinity);
  const inner2 = 0.25 * rMax * rMax;
  const outer2 = rMax * rMax;
  let sc4 = 0;
  let ss4 = 0;
  let sc6 = 0;
  let ss6 = 0;
  let n = 0;
  let skip2 = -1;
  for (let i = 0, j = 0; i < count; i++, j += stride) {
    const dx = coords[j] - seedX;
    const dy = coords[j + 1] - seedY;
    const r2 = dx * dx + dy * dy;
    if (!(r2 < skip2)) {
      let low = Infinity;
      for (let m = 0; m < 8; m++) {
        const p = dx * COS4[m] + dy * SIN4[m];
        if (p > FAR4[m]) FAR4[m] = p;
        if (FAR4[m] < low) low = FAR4[m];
      }
      for (let m = 0; m < 12; m++) {
        const p = dx * COS6[m] + dy * SIN6[m];
        if (p > FAR6[m]) FAR6[m] = p;
        if (FAR6[m] < low) low = FAR6[m];
      }
      skip2 = low > 0 ? low * low * (1 - 1e-12) : -1;
    }
    if (r2 > inner2 && r2 <= outer2) {
      const r = Math.sqrt(r2);
      const c = dx / r;
      const sn = dy / r;
      let re = 1;
      let im = 0;
      for (let t = 0; t < 6; t++) {
        const nr = re * c - im * sn;
        im = re * sn + im * c;
        re = nr;
        if (t === 3) {
          sc4 += re;
          ss4 += im;
        }
      }
      sc6 += re;
      ss6 += im;
      n++;
    }
  }
  let axis4 = 0;
  let diag4 = 0;
  for (let m = 0; m < 8; m++) {
    if (m % 2 === 0) axis4 += FAR4[m];
    else diag4 += FAR4[m];
  }
  let axis6 = 0;
  let diag6 = 0;
  for (let m = 0; m < 12; m++) {
    if (m % 2 === 0) axis6 += FAR6[m];
    else diag6 += FAR6[m];
  }
  (extra.fold_amplitude_4 ??= []).push(n > 0 ? Math.sqrt(sc4 * sc4 + ss4 * ss4) / n : 0);
  (extra.axis_ratio_4 ??= []).push(diag4 > 0 ? axis4 / diag4 : 1);
  (extra.fold_amplitude_6 ??= []).push(n > 0 ? Math.sqrt(sc6 * sc6 + ss6 * ss6) / n : 0);
  (extra.axis_ratio_6 ??= []).push(diag6 > 0 ? axis6 / diag6 : 1);
}
