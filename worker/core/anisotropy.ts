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
 * vectors e^{ikθ_j} are independent with mean 0) and A_k is asymptotically
 * Rayleigh distributed with mean √(π/(4n)) (coordinator/stats/fold-noise.ts).
 * The shell count n is recorded beside A_k (observable shell_count) so that
 * the summary can draw that noise level. Only the outer shell is used
 * because the interior is frozen early: it describes the cluster when it was
 * smaller.
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
 * Signed k-fold phase, over the same shell:
 *   P_k = (1/n) Σ_j cos(k θ_j)
 * with θ measured from the lattice's x axis (the square lattice's axes are at
 * θ = 0, π/2, π, 3π/2 where cos 4θ = 1; the triangular lattice of
 * worker/lattice/planar-lattice.ts has its neighbours at (1, 0) and
 * (½, √3/2), axes at multiples of π/3 where cos 6θ = 1). A_k is a modulus,
 * so it is positive even for an isotropic cluster, and by more than the
 * independent-angle level because angles along a branch are correlated;
 * P_k keeps the sign, and its expectation is exactly 0 for every N when the
 * model's law is invariant under rotations about the seed (off-lattice DLA,
 * Eden, DBM). Argument (exact, our own): let R_φ rotate by φ; invariance
 * means the cluster C and R_φ C have the same law for every φ, so
 * E P_k(C) = E P_k(R_φ C) = E[(1/n) Σ_j cos(k θ_j + k φ)] (the shell and n
 * are unchanged by a rotation). Averaging over φ uniform in [0, 2π),
 * ∫ cos(k θ + k φ) dφ / 2π = 0 for every θ and k ≥ 1, and the average is
 * bounded by 1, so E P_k(C) = 0. Lattice growth whose arms follow the axes
 * gives E P_k > 0, arms along the diagonals E P_k < 0. The ensemble mean of
 * P_k with its bootstrap band is therefore a test with the ensemble's own
 * noise (coordinator/stats/observable-bands.ts, foldPhase).
 *
 * All are O(n) per call, with no allocation; kernels record them at their
 * record sizes.
 */

/**
 * Result fields of anisotropyOf (reused, to keep hot paths free of
 * allocation): A_k, the shell count n, Q_k, and the shell means of cos kθ
 * and sin kθ (A_k = |meanCos + i meanSin|).
 */
export const anisotropy = { amplitude: 0, shellCount: 0, axisRatio: 1, meanCos: 0, meanSin: 0 };

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
  anisotropy.meanCos = n > 0 ? sc / n : 0;
  anisotropy.meanSin = n > 0 ? ss / n : 0;
  anisotropy.axisRatio = diag > 0 ? axis / diag : 1;
}

/** The observables every planar model records (GrowthSeries.extra), for descriptors to declare. */
export const PLANAR_ANISOTROPY_OBSERVABLES = [
  { name: 'fold_amplitude_4', meaning: '4-fold amplitude |Σ exp(4iθ)|/n of the particles between R_max/2 and R_max (square-lattice anisotropy; mean √(π/(4n)) for n independent uniform angles)' },
  { name: 'axis_ratio_4', meaning: 'mean extent along the 4 square-lattice axes over the mean extent along the 4 diagonals (1 for a disk)' },
  { name: 'fold_amplitude_6', meaning: '6-fold amplitude |Σ exp(6iθ)|/n of the particles between R_max/2 and R_max (triangular-lattice anisotropy)' },
  { name: 'axis_ratio_6', meaning: 'mean extent along the 6 triangular-lattice axes over the mean extent along the 6 diagonals' },
  { name: 'shell_count', meaning: 'number n of particles between R_max/2 and R_max (the shell of fold_amplitude_4 and fold_amplitude_6; sets their isotropic noise level √(π/(4n)))' },
  { name: 'fold_phase_4', meaning: 'signed 4-fold phase Σ cos 4θ / n over the same shell, θ from the lattice x axis (+1 all along the square axes, −1 all along the diagonals; expectation exactly 0 for a rotation-invariant model)' },
  { name: 'fold_phase_6', meaning: 'signed 6-fold phase Σ cos 6θ / n over the same shell (+1 all along the triangular-lattice axes at multiples of π/3; expectation exactly 0 for a rotation-invariant model)' },
] as const;

/** cos 4θ, sin 4θ, cos 6θ, sin 6θ of the last foldTermsOf call (reused). */
export const foldTerms = { c4: 0, s4: 0, c6: 0, s6: 0 };

/**
 * cos kθ and sin kθ for k = 4 and 6 of the point (dx, dy) at squared distance
 * r2 > 0 from the seed, by de Moivre's powers of (dx, dy)/r (no trigonometry):
 * the operations recordPlanarAnisotropy has always used, so that every
 * recorder gets the same bits for the same point.
 */
export function foldTermsOf(dx: number, dy: number, r2: number): void {
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
      foldTerms.c4 = re;
      foldTerms.s4 = im;
    }
  }
  foldTerms.c6 = re;
  foldTerms.s6 = im;
}

/** Unit vectors at angles πm/4 (m < 8) and πm/6 (m < 12): lattice axes at even m, diagonals at odd m. */
export const COS4 = new Float64Array(8);
export const SIN4 = new Float64Array(8);
export const COS6 = new Float64Array(12);
export const SIN6 = new Float64Array(12);
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
 * Raise the extents far4[m] (direction COS4/SIN4[m]) and far6[m] to the
 * projections of (dx, dy); returns the squared distance below which a later
 * point cannot raise any extent (the smallest extent squared, less a 1e-12
 * margin for rounding in the projection), or −1 when an extent is not yet
 * positive. Skipping such points leaves the extents unchanged.
 */
export function raiseExtents(dx: number, dy: number, far4: Float64Array, far6: Float64Array): number {
  let low = Infinity;
  for (let m = 0; m < 8; m++) {
    const p = dx * COS4[m] + dy * SIN4[m];
    if (p > far4[m]) far4[m] = p;
    if (far4[m] < low) low = far4[m];
  }
  for (let m = 0; m < 12; m++) {
    const p = dx * COS6[m] + dy * SIN6[m];
    if (p > far6[m]) far6[m] = p;
    if (far6[m] < low) low = far6[m];
  }
  return low > 0 ? low * low * (1 - 1e-12) : -1;
}

/**
 * Append the planar anisotropy observables (k = 4 and 6, and the shell count) of the first
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
    if (!(r2 < skip2)) skip2 = raiseExtents(dx, dy, FAR4, FAR6);
    if (r2 > inner2 && r2 <= outer2) {
      foldTermsOf(dx, dy, r2);
      sc4 += foldTerms.c4;
      ss4 += foldTerms.s4;
      sc6 += foldTerms.c6;
      ss6 += foldTerms.s6;
      n++;
    }
  }
  pushPlanarAnisotropy(extra, n, sc4, ss4, sc6, ss6, FAR4, FAR6);
}

/** Mean of the extents at even m (axes) over the mean at odd m (diagonals), 1 when the diagonal sum is not positive. */
function extentRatio(far: Float64Array): number {
  let axis = 0;
  let diag = 0;
  for (let m = 0; m < far.length; m++) {
    if (m % 2 === 0) axis += far[m];
    else diag += far[m];
  }
  return diag > 0 ? axis / diag : 1;
}

/**
 * Append the planar anisotropy observables, from the shell count n, the
 * shell sums of cos/sin 4θ and 6θ, and the extents along the 8 and 12
 * directions (COS4/SIN4, COS6/SIN6), to a series' extra records. The shell
 * count n goes to shell_count, except in a series resumed from a checkpoint
 * written before shell_count existed (fold_amplitude_4 has records and
 * shell_count none): it goes on without it, so that every record list keeps
 * one value per recorded size (the summary then shows no noise level).
 * fold_phase_4 = sc4/n and fold_phase_6 = sc6/n likewise: a series resumed
 * from a checkpoint written before they existed goes on without them (and
 * the summary then gives no phase verdict). They are pushed after the
 * existing observables, so every older record keeps its bits.
 */
export function pushPlanarAnisotropy(extra: Record<string, number[]>, n: number, sc4: number, ss4: number, sc6: number, ss6: number, far4: Float64Array, far6: Float64Array): void {
  const withCount = extra.shell_count !== undefined || !(extra.fold_amplitude_4?.length);
  const withPhase = extra.fold_phase_4 !== undefined || !(extra.fold_amplitude_4?.length);
  (extra.fold_amplitude_4 ??= []).push(n > 0 ? Math.sqrt(sc4 * sc4 + ss4 * ss4) / n : 0);
  (extra.axis_ratio_4 ??= []).push(extentRatio(far4));
  (extra.fold_amplitude_6 ??= []).push(n > 0 ? Math.sqrt(sc6 * sc6 + ss6 * ss6) / n : 0);
  (extra.axis_ratio_6 ??= []).push(extentRatio(far6));
  if (withCount) (extra.shell_count ??= []).push(n);
  if (withPhase) {
    (extra.fold_phase_4 ??= []).push(n > 0 ? sc4 / n : 0);
    (extra.fold_phase_6 ??= []).push(n > 0 ? sc6 / n : 0);
  }
}
