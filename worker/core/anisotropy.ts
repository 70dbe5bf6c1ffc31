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

/** Append the four planar anisotropy observables of the first `count` centres to a series' extra records. */
export function recordPlanarAnisotropy(extra: Record<string, number[]>, coords: Float64Array, stride: number, count: number, rMax: number, seedX = 0, seedY = 0): void {
  for (const k of [4, 6]) {
    anisotropyOf(coords, stride, count, k, rMax, seedX, seedY);
    (extra[`fold_amplitude_${k}`] ??= []).push(anisotropy.amplitude);
    (extra[`axis_ratio_${k}`] ??= []).push(anisotropy.axisRatio);
  }
}
