/**
 * Logarithmic capacity from independent samples of the harmonic measure μ
 * of a compact set K: the logarithmic energy I(μ) = ∫∫ log|z − w| dμ(z) dμ(w)
 * of the equilibrium measure equals log cap(K) (Ransford 1995, Potential
 * Theory in the Complex Plane, ch. 3 and 5). The estimate is the
 * U-statistic Î = mean over pairs i < j of log|z_i − z_j|, and cap = exp(Î).
 *
 * Standard error (calibrated, not a bound). Hoeffding's variance of a
 * U-statistic of degree 2 on M points is
 *   Var(Î) = 4(M−2)/(M(M−1)) ζ1 + 2/(M(M−1)) ζ2
 * (Hoeffding 1948, Ann. Math. Stat. 19, 293), with ζ2 = Var h(Z, W),
 * h(z, w) = log|z − w|, and ζ1 = Var h1(Z), h1(z) = ∫ log|z − w| dμ(w).
 * For the equilibrium measure h1 is constant (= log cap) on the support of μ
 * (Frostman's theorem, for a regular compact set such as a finite union of
 * disks; Ransford 1995, Thm 3.3.4), so ζ1 = 0 exactly: the statistic is
 * degenerate and Var(Î) = 2 ζ2/(M(M−1)). ζ2 is estimated by the variance of
 * log|z_i − z_j| over the pairs (its bias, −Var(Î), is of relative order
 * 1/M²). The error of cap is cap · SE(Î) (delta method).
 *
 * Why not the old formula, a jackknife or batch means over jobs: the old
 * error plugged the variance of the row means in for ζ1, which is biased up
 * by ≈ ζ2/M and made the error about √3 times too large in the degenerate
 * case (1.4–2.1 times the seed-to-seed spread was measured on disk unions).
 * A delete-a-group jackknife over the jobs is biased upward as well
 * (Efron & Stein 1981, Ann. Stat. 9, 586): about 1.3–1.45 times the spread
 * with 8 groups of uniform points on a circle or an ellipse. Batch means
 * (one capacity per job, averaged) estimate their own spread correctly but
 * throw away the pairs across jobs and are G times less precise than the
 * pooled Î for G jobs. The pooled Î with the degenerate variance is both the
 * most precise and calibrated: test/capacity-calibration.slow.test.ts checks, over
 * 100 seeds of probes of a disk and of two tangent disks (exact capacities),
 * that the stated error matches the seed-to-seed spread and the nominal 95%
 * coverage holds.
 *
 * The pair ζ1 of a sample that is NOT from the equilibrium measure (a wrong
 * measure) is positive; frostmanExcess reports the unbiased estimate of ζ1
 * (U-statistic of degree 3 and 4 terms; may be negative by noise) relative to
 * ζ2/M, the noise level of that estimate (it scatters by about ±1.5 for
 * harmonic-measure samples of 3000 points): a value above 5 (our rule) says
 * the sample is not a harmonic measure and the stated error is too small.
 */

import { LatticePotential } from '../../worker/lattice/potential-kernel.js';

export interface CapacityEstimate {
  /** Sample size M used. */
  samples: number;
  logCapacity: number;
  logCapacityError: number;
  capacity: number;
  capacityError: number;
  /** Unbiased estimate of ζ1 divided by ζ2/M (0 up to noise of order 1 for a harmonic-measure sample; see the header). */
  frostmanExcess: number;
}

/**
 * The pair value h(z, w) of the U-statistic, from w − z = (dx, dy): for
 * continuum sets log|z − w| (the default); for lattice sets the potential
 * kernel's form (latticePairValue). A non-finite value (coincident points of
 * a continuum sample, measure zero) is skipped.
 */
export type PairValue = (dx: number, dy: number) => number;

const LOG_DISTANCE: PairValue = (dx, dy) => 0.5 * Math.log(dx * dx + dy * dy);

/**
 * The capacity of a finite lattice set (our definition, following Lawler &
 * Limic 2010, Random Walk: A Modern Introduction, §6.6; from memory): with
 * a the lattice walk's potential kernel and H the harmonic measure from
 * infinity of A, Σ_{z∈A} a(x − z) H(z) = cap_L(A) is the same for every
 * x ∈ A (cap_L({0}) = 0; cap_L of two neighbours = 1/2, since a = 1 there).
 * So h(z, w) = (a(w − z) − κ)/C, with a(x) ≈ C ln|x| + κ far away
 * (worker/lattice/potential-kernel.ts), has h1 ≡ (cap_L − κ)/C on the support
 * of H: the same degenerate U-statistic as in the continuum, estimating
 * log of the set's continuum-equivalent capacity, (cap_L − κ)/C (for a large
 * set a(x − z) ≈ C ln|x − z| + κ away from the diagonal, so this tends to
 * the logarithmic capacity of the set in lattice spacings). Coincident
 * sample points count (a(0) = 0): on a lattice they are not of measure zero.
 */
export function latticePairValue(lattice: 'square' | 'triangular'): PairValue {
  const pot = LatticePotential.of(lattice);
  return (dx, dy) => (pot.atPlane(dx, dy) - pot.constant) / pot.slope;
}

export function logCapacity(x: ArrayLike<number>, y: ArrayLike<number>, count: number, pair: PairValue = LOG_DISTANCE): CapacityEstimate {
  const m = count;
  if (m < 4) throw new RangeError(`capacity needs at least 4 contact points, got ${m}`);
  // pass 1: the mean (so that pass 2 sums centred values: no cancellation in the moment sums)
  let sum = 0;
  let pairs = 0;
  for (let i = 0; i < m; i++) {
    const xi = x[i];
    const yi = y[i];
    for (let j = i + 1; j < m; j++) {
      const dx = xi - x[j];
      const dy = yi - y[j];
      const l = pair(dx, dy);
      if (!Number.isFinite(l)) continue; // coincident points (measure zero)
      sum += l;
      pairs++;
    }
  }
  const mean = sum / pairs;
  // pass 2: centred pair values h, their row sums r_i, S1 = sum h, S2 = sum h^2
  const row = new Float64Array(m);
  let s1 = 0;
  let s2 = 0;
  for (let i = 0; i < m; i++) {
    const xi = x[i];
    const yi = y[i];
    for (let j = i + 1; j < m; j++) {
      const dx = xi - x[j];
      const dy = yi - y[j];
      const l = pair(dx, dy);
      if (!Number.isFinite(l)) continue;
      const h = l - mean;
      row[i] += h;
      row[j] += h;
      s1 += h;
      s2 += h * h;
    }
  }
  const zeta2 = Math.max(0, s2 / pairs - (s1 / pairs) ** 2);
  const variance = (2 / (m * (m - 1))) * zeta2;
  // unbiased ζ1 = E[h12 h13] − θ²: triples T = Σ_i (r_i² − Σ_j h_ij²) = Σ r_i² − 2 S2,
  // disjoint pairs of pairs D = S1² − S2 − T (all ordered)
  let r2 = 0;
  for (let i = 0; i < m; i++) r2 += row[i] * row[i];
  const t = r2 - 2 * s2;
  const d = s1 * s1 - s2 - t;
  const zeta1 = t / (m * (m - 1) * (m - 2)) - d / (pairs * (m - 2) * (m - 3) / 2);
  const se = Math.sqrt(variance);
  const cap = Math.exp(mean);
  return {
    samples: m, logCapacity: mean, logCapacityError: se, capacity: cap, capacityError: cap * se,
    frostmanExcess: zeta2 > 0 ? zeta1 / (zeta2 / m) : 0,
  };
}

/**
 * Check of the stated error from the spread of independent jobs (batch
 * means): each job's contact points are an independent sample, so each job
 * gives its own Î_g with its own stated variance v_g (the formula above on
 * that job's points). With calibrated errors χ² = Σ_g (Î_g − Ī)²/v_g, Ī the
 * 1/v-weighted mean, follows roughly a chi-square law with G − 1 degrees of
 * freedom (roughly: a degenerate U-statistic is not normal), so
 * spreadOverStated = sqrt(χ²/(G − 1)) is near 1; test/capacity-calibration.slow.test.ts
 * checks its mean square over 200 seeds. The pooled Î and its error are
 * what is reported: they use the pairs across jobs too and are G times more
 * precise than the mean of the Î_g.
 */
export interface CapacityJobCheck {
  jobs: number;
  chiSquare: number;
  degreesOfFreedom: number;
  spreadOverStated: number;
}

/** Batch-means check over consecutive groups of the sample (job j holds `sizes[j]` points, in order); null with fewer than 2 groups of at least 4 points. */
export function capacityJobCheck(x: ArrayLike<number>, y: ArrayLike<number>, sizes: readonly number[], pair: PairValue = LOG_DISTANCE): CapacityJobCheck | null {
  const est: number[] = [];
  const vars: number[] = [];
  let from = 0;
  for (const m of sizes) {
    if (m >= 4) {
      const gx = Array.prototype.slice.call(x, from, from + m) as number[];
      const gy = Array.prototype.slice.call(y, from, from + m) as number[];
      const c = logCapacity(gx, gy, m, pair);
      if (c.logCapacityError > 0) { est.push(c.logCapacity); vars.push(c.logCapacityError ** 2); }
    }
    from += m;
  }
  if (est.length < 2) return null;
  let sw = 0;
  let swx = 0;
  for (let g = 0; g < est.length; g++) { sw += 1 / vars[g]; swx += est[g] / vars[g]; }
  const mean = swx / sw;
  let chi2 = 0;
  for (let g = 0; g < est.length; g++) chi2 += (est[g] - mean) ** 2 / vars[g];
  const dof = est.length - 1;
  return { jobs: est.length, chiSquare: chi2, degreesOfFreedom: dof, spreadOverStated: Math.sqrt(chi2 / dof) };
}
