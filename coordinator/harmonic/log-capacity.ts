/**
 * Logarithmic capacity from independent samples of the harmonic measure μ
 * of a compact set K: the logarithmic energy I(μ) = ∫∫ log|z − w| dμ(z) dμ(w)
 * of the equilibrium measure equals log cap(K) (Ransford 1995, Potential
 * Theory in the Complex Plane, ch. 3 and 5). The estimate is the
 * U-statistic Î = mean over pairs i < j of log|z_i − z_j|, and cap = exp(Î).
 *
 * Standard error: Var(Î) = 4(M−2)/(M(M−1)) ζ1 + 2/(M(M−1)) ζ2 (Hoeffding's
 * U-statistic variance; common practice, no source), with ζ2 = Var(h) the
 * variance of log|z − w| over pairs and ζ1 the variance of the row means
 * h1(z_i) = mean_j log|z_i − z_j|, which estimates Var(h1(Z)) with an upward
 * bias ≈ ζ2/M (so the error is conservative). For the equilibrium measure
 * h1 is constant on the support (Frostman), so ζ1 is small and the estimate
 * is unusually precise. The error of cap is cap · SE(Î) (delta method).
 */

export interface CapacityEstimate {
  /** Sample size M used. */
  samples: number;
  logCapacity: number;
  logCapacityError: number;
  capacity: number;
  capacityError: number;
}

export function logCapacity(x: ArrayLike<number>, y: ArrayLike<number>, count: number): CapacityEstimate {
  const m = count;
  if (m < 3) throw new RangeError(`capacity needs at least 3 contact points, got ${m}`);
  const row = new Float64Array(m);
  let sum = 0;
  let sum2 = 0;
  for (let i = 0; i < m; i++) {
    const xi = x[i];
    const yi = y[i];
    for (let j = i + 1; j < m; j++) {
      const dx = xi - x[j];
      const dy = yi - y[j];
      const l = 0.5 * Math.log(dx * dx + dy * dy);
      if (!Number.isFinite(l)) continue; // coincident points (measure zero)
      row[i] += l;
      row[j] += l;
      sum += l;
      sum2 += l * l;
    }
  }
  const pairs = (m * (m - 1)) / 2;
  const mean = sum / pairs;
  const zeta2 = Math.max(0, sum2 / pairs - mean * mean);
  let z1 = 0;
  for (let i = 0; i < m; i++) {
    const r = row[i] / (m - 1) - mean;
    z1 += r * r;
  }
  const zeta1 = z1 / (m - 1);
  const variance = (4 * (m - 2)) / (m * (m - 1)) * zeta1 + (2 / (m * (m - 1))) * zeta2;
  const se = Math.sqrt(variance);
  const cap = Math.exp(mean);
  return { samples: m, logCapacity: mean, logCapacityError: se, capacity: cap, capacityError: cap * se };
}
