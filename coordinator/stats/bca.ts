/**
 * Bootstrap confidence intervals from a set of replicates: the percentile
 * interval and the bias-corrected and accelerated (BCa) interval of Efron &
 * Tibshirani 1993, An Introduction to the Bootstrap, ch. 13 (percentile) and
 * ch. 14 (BCa, eqs. 14.9-14.15):
 *
 *   z0 = Phi^{-1}( share of replicates below the estimate )   (ties count one half)
 *   a  = sum d_i^3 / (6 (sum d_i^2)^{3/2}),  d_i = mean(theta_(.)) - theta_(i)  (jackknife)
 *   alpha1 = Phi( z0 + (z0 + z_{alpha/2}) / (1 - a (z0 + z_{alpha/2})) )
 *   alpha2 = Phi( z0 + (z0 + z_{1-alpha/2}) / (1 - a (z0 + z_{1-alpha/2})) )
 *   interval = [ q(alpha1), q(alpha2) ]  of the replicate distribution.
 *
 * Quantiles q(p) of the replicates interpolate linearly between order
 * statistics at position (B - 1) p (Hyndman & Fan 1996, type 7).
 *
 * Degenerate cases never give NaN: all replicates equal -> zero-width interval
 * with status 'degenerate'; non-finite replicates are dropped and counted
 * (more than 5% dropped -> status 'unstable', no interval).
 */

import { normalCdf, normalQuantile } from './special-functions.js';

export type IntervalStatus = 'ok' | 'degenerate' | 'too-few-clusters' | 'unstable' | 'unavailable';

/** A confidence interval summary; plain JSON (numbers are finite or null). */
export interface IntervalSummary {
  /** Confidence level, e.g. 0.95. */
  level: number;
  /** Percentile interval [lower, upper], or null when not available. */
  percentile: [number, number] | null;
  /** BCa interval [lower, upper], or null when not available. */
  bca: [number, number] | null;
  status: IntervalStatus;
  /** Human-readable remarks (degenerate cases, edge effects, dropped replicates). */
  notes: string[];
  /** BCa bias correction z0, or null. */
  biasCorrection: number | null;
  /** BCa acceleration a (from the jackknife), or null. */
  acceleration: number | null;
  /** Standard deviation of the replicates, or null. */
  standardError: number | null;
  /** Replicates that entered the interval (finite ones). */
  replicatesUsed: number;
}

/** Quantile of an ascending-sorted array, linear interpolation at (n-1)p (Hyndman & Fan type 7). */
export function sortedQuantile(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  if (p <= 0) return sorted[0];
  if (p >= 1) return sorted[n - 1];
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** An interval summary with no interval, for a stated reason. */
export function unavailableInterval(level: number, status: IntervalStatus, note: string): IntervalSummary {
  return { level, percentile: null, bca: null, status, notes: [note], biasCorrection: null, acceleration: null, standardError: null, replicatesUsed: 0 };
}

/** Jackknife acceleration a; returns null when it cannot be formed (all jackknife values equal or non-finite). */
export function jackknifeAcceleration(jack: ArrayLike<number>): number | null {
  const n = jack.length;
  if (n < 2) return null;
  let mean = 0;
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(jack[i])) return null;
    mean += jack[i];
  }
  mean /= n;
  let s2 = 0, s3 = 0;
  for (let i = 0; i < n; i++) {
    const d = mean - jack[i];
    s2 += d * d;
    s3 += d * d * d;
  }
  if (!(s2 > 0)) return null;
  const a = s3 / (6 * Math.pow(s2, 1.5));
  return Number.isFinite(a) ? a : null;
}

/**
 * Percentile and BCa intervals for `estimate` from bootstrap `replicates`
 * (not modified) and jackknife values `jackknife` (leave-one-out or
 * leave-group-out estimates; null -> acceleration 0 with a note).
 */
export function bootstrapInterval(
  estimate: number,
  replicates: ArrayLike<number>,
  jackknife: ArrayLike<number> | null,
  level: number,
): IntervalSummary {
  const notes: string[] = [];
  if (!Number.isFinite(estimate)) return unavailableInterval(level, 'unavailable', 'the point estimate is not finite');
  const total = replicates.length;
  let finite = 0;
  for (let i = 0; i < total; i++) if (Number.isFinite(replicates[i])) finite++;
  if (finite === 0) return unavailableInterval(level, 'unstable', `none of ${total} bootstrap replicates is finite`);
  const sorted = new Float64Array(finite);
  let k = 0;
  for (let i = 0; i < total; i++) if (Number.isFinite(replicates[i])) sorted[k++] = replicates[i];
  sorted.sort();
  const dropped = total - finite;
  if (dropped > 0) {
    notes.push(`${dropped} of ${total} bootstrap replicates were not finite and were left out`);
    if (dropped > 0.05 * total) {
      return { ...unavailableInterval(level, 'unstable', notes[0]), notes: [...notes, 'more than 5% of replicates failed: no interval'] };
    }
  }
  let mean = 0;
  for (let i = 0; i < finite; i++) mean += sorted[i];
  mean /= finite;
  let v = 0;
  for (let i = 0; i < finite; i++) v += (sorted[i] - mean) * (sorted[i] - mean);
  const se = finite > 1 ? Math.sqrt(v / (finite - 1)) : 0;
  const spread = sorted[finite - 1] - sorted[0];
  if (!(spread > 1e-13 * Math.max(Math.abs(estimate), 1e-300))) {
    notes.push(`all ${finite} bootstrap replicates are equal: the clusters agree exactly, the interval has zero width`);
    return {
      level, percentile: [estimate, estimate], bca: [estimate, estimate], status: 'degenerate', notes,
      biasCorrection: null, acceleration: null, standardError: 0, replicatesUsed: finite,
    };
  }
  const alpha = (1 - level) / 2;
  const percentile: [number, number] = [sortedQuantile(sorted, alpha), sortedQuantile(sorted, 1 - alpha)];

  // bias correction: share below the estimate, ties counted one half
  let below = 0, equal = 0;
  for (let i = 0; i < finite; i++) {
    if (sorted[i] < estimate) below++;
    else if (sorted[i] === estimate) equal++;
  }
  let share = (below + 0.5 * equal) / finite;
  const edge = 0.5 / finite;
  if (share < edge || share > 1 - edge) {
    notes.push('the estimate lies outside the bootstrap distribution: BCa bias correction clamped');
    share = Math.min(Math.max(share, edge), 1 - edge);
  }
  const z0 = normalQuantile(share);
  let a = jackknife ? jackknifeAcceleration(jackknife) : null;
  if (a === null) {
    notes.push(jackknife ? 'jackknife values all equal or not finite: acceleration set to 0' : 'no jackknife: acceleration set to 0');
    a = 0;
  }
  const adjusted = (zAlpha: number): number => {
    const s = z0 + zAlpha;
    const den = 1 - a! * s;
    if (!(den > 0)) return zAlpha < 0 ? 0 : 1;
    return normalCdf(z0 + s / den);
  };
  const a1 = adjusted(normalQuantile(alpha));
  const a2 = adjusted(normalQuantile(1 - alpha));
  if (a1 < 1 / (finite + 1) || a2 > finite / (finite + 1)) {
    notes.push(`BCa endpoint at the edge of the bootstrap distribution (adjusted levels ${a1.toPrecision(3)}, ${a2.toPrecision(3)}): use more resamples`);
  }
  const bca: [number, number] = [sortedQuantile(sorted, a1), sortedQuantile(sorted, a2)];
  return { level, percentile, bca, status: 'ok', notes, biasCorrection: z0, acceleration: a, standardError: se, replicatesUsed: finite };
}

/** Half-width of an interval, or null. */
export function halfWidth(iv: [number, number] | null): number | null {
  return iv ? (iv[1] - iv[0]) / 2 : null;
}
