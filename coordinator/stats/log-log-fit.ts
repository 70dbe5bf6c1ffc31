/**
 * Ordinary least-squares straight lines: the one least-squares fit of the
 * project (fitLine), used by the ensemble statistics, the summary's power-law
 * fit and the harmonic-measure spectra, and its slope weights for the
 * bootstrap.
 *
 * For fixed abscissae x the OLS slope is linear in the ordinates,
 * slope = sum_i w_i y_i with w_i = (x_i - xbar) / sum_j (x_j - xbar)^2, so the
 * slope of the ensemble-mean curve equals the mean of the per-cluster slopes.
 * The bootstrap uses this identity: a replicate's slope is a weighted mean of
 * per-cluster slopes, O(K) instead of O(K x S).
 */

export interface LineFit {
  slope: number;
  intercept: number;
  /** Points in the fit. */
  points: number;
  /** Root-mean-square residual (natural-log units); 0 for two points. */
  residualRms: number;
  /** Standard error of the slope, sqrt(RSS / (n - 2) / Sxx); NaN for two points. */
  standardError: number;
  /** Coefficient of determination Sxy² / (Sxx Syy); 1 when y has no spread. */
  rSquared: number;
}

/** OLS slope weights over x[from..to): slope = sum w[i - from] y[i]. Null if fewer than 2 points or no spread. */
export function slopeWeights(x: Float64Array, from: number, to: number): Float64Array | null {
  const n = to - from;
  if (n < 2) return null;
  let xm = 0;
  for (let i = from; i < to; i++) xm += x[i];
  xm /= n;
  let sxx = 0;
  for (let i = from; i < to; i++) sxx += (x[i] - xm) * (x[i] - xm);
  if (!(sxx > 0)) return null;
  const w = new Float64Array(n);
  for (let i = from; i < to; i++) w[i - from] = (x[i] - xm) / sxx;
  return w;
}

/** Dot product of slope weights with y[from..]. */
export function applyWeights(w: Float64Array, y: Float64Array, offset: number): number {
  let s = 0;
  for (let i = 0; i < w.length; i++) s += w[i] * y[offset + i];
  return s;
}

/** OLS line through (x[i], y[i]) for i in [from, to) (two-pass sums about the means). */
export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>, from = 0, to = x.length): LineFit {
  const n = to - from;
  let xm = 0, ym = 0;
  for (let i = from; i < to; i++) { xm += x[i]; ym += y[i]; }
  xm /= n; ym /= n;
  let sxx = 0, sxy = 0, syy = 0;
  for (let i = from; i < to; i++) { sxx += (x[i] - xm) * (x[i] - xm); sxy += (x[i] - xm) * (y[i] - ym); syy += (y[i] - ym) * (y[i] - ym); }
  const slope = sxy / sxx;
  const intercept = ym - slope * xm;
  let rss = 0;
  for (let i = from; i < to; i++) { const r = y[i] - intercept - slope * x[i]; rss += r * r; }
  return {
    slope,
    intercept,
    points: n,
    residualRms: n > 2 ? Math.sqrt(rss / (n - 2)) : 0,
    standardError: n > 2 ? Math.sqrt(rss / (n - 2) / sxx) : NaN,
    rSquared: syy > 0 ? (sxy * sxy) / (sxx * syy) : 1,
  };
}

/**
 * Per-row slopes of the row-major K x S matrix y against x over columns
 * [from, to), with weights from slopeWeights.
 */
export function rowSlopes(y: Float64Array, rows: number, columns: number, w: Float64Array, from: number): Float64Array {
  const out = new Float64Array(rows);
  for (let c = 0; c < rows; c++) out[c] = applyWeights(w, y, c * columns + from);
  return out;
}
