/**
 * Local slopes: the effective exponent as a function of scale. At every
 * recorded abscissa value v_i whose sliding window [v_i 10^{-h}, v_i 10^{h}]
 * lies inside the recorded range, an OLS line is fitted to the ensemble-mean
 * log-log curve over all points in that window; the default full width 2h is
 * half a decade (h = 0.25), i.e. about 11 points at 20 records per decade.
 * Successive-point slopes would be far noisier at 20 points per decade.
 * Each local slope is linear in the data, so its bootstrap replicate is a
 * dot product of precomputed weights with the replicate's mean curve.
 */

import { slopeWeights } from './log-log-fit.js';

export interface LocalWindow {
  /** Index of the centre point. */
  center: number;
  /** First index in the window. */
  from: number;
  /** One past the last index. */
  to: number;
  weights: Float64Array;
}

/** Sliding windows of full width `widthDecades` over the log abscissa x (natural logs). */
export function localWindows(x: Float64Array, widthDecades: number, minPoints = 3): LocalWindow[] {
  const n = x.length;
  const out: LocalWindow[] = [];
  if (n < minPoints) return out;
  const h = (widthDecades / 2) * Math.LN10;
  const tol = 1e-9 * Math.max(1, Math.abs(x[n - 1]));
  let from = 0, to = 0;
  for (let i = 0; i < n; i++) {
    if (x[i] - h < x[0] - tol || x[i] + h > x[n - 1] + tol) continue;
    while (x[from] < x[i] - h - tol) from++;
    if (to < from) to = from;
    while (to < n && x[to] <= x[i] + h + tol) to++;
    if (to - from < minPoints) continue;
    const w = slopeWeights(x, from, to);
    if (w) out.push({ center: i, from, to, weights: w });
  }
  return out;
}
