/**
 * Multifractal spectrum of a measure from its box statistics.
 *
 * Sign convention: Z(q, ε) = Σ_B μ(B)^q ~ (ε/R)^τ(q) as ε → 0, so
 *   τ(q) = slope of log Z(q, ε) against log(ε/R),
 *   τ(0) = −(box dimension of the support), τ(1) = 0 (Σ μ = 1),
 *   D_q = τ(q)/(q − 1); D_1 = τ'(1) = slope of Σ μ log μ against log(ε/R),
 *   α(q) = τ'(q), f(α) = q α − τ(q) (Legendre transform).
 * With it a smooth curve has τ(q) = q − 1, and for a planar connected set
 * τ'(1) = 1 (Makarov 1985, Proc. London Math. Soc. 51, 369).
 * α(q) is taken by finite differences on the q grid (central inside, one-sided
 * at the ends), except at q = 1 where τ'(1) is fitted directly.
 * Maximum concentration: M(ε) = max_B μ(B) ~ (ε/R)^α_min; Beurling's
 * estimate bounds α_min ≥ 1/2 for a connected set (Garnett & Marshall 2005,
 * Harmonic Measure).
 */
import type { BoxStatistics } from './partition-function.js';
import { fitLine } from '../stats/log-log-fit.js';

export interface Spectrum {
  q: number[];
  tau: number[];
  /** Standard error of the fitted slope (scatter about the line only). */
  tauFitError: number[];
  dq: Array<number | null>;
  alpha: number[];
  f: number[];
  /** τ'(1) fitted from Σ μ log μ. */
  informationDimension: number;
  informationDimensionFitError: number;
  maxConcentrationExponent: number;
  maxConcentrationFitError: number;
}

export function spectrumFrom(stats: BoxStatistics, radius: number): Spectrum {
  const xs = stats.eps.map((e) => Math.log(e / radius));
  const q = stats.q;
  const tau: number[] = [];
  const err: number[] = [];
  for (let k = 0; k < q.length; k++) {
    const fit = fitLine(xs, stats.z.map((row) => Math.log(row[k])));
    tau.push(fit.slope);
    err.push(fit.standardError);
  }
  const info = fitLine(xs, stats.entropy);
  const mx = fitLine(xs, stats.maxMeasure.map((m) => Math.log(m)));
  const alpha: number[] = [];
  for (let k = 0; k < q.length; k++) {
    if (Math.abs(q[k] - 1) < 1e-12) { alpha.push(info.slope); continue; }
    if (q.length < 2) { alpha.push(NaN); continue; }
    const a = k === 0 ? 0 : k - 1;
    const b = k === q.length - 1 ? k : k + 1;
    alpha.push((tau[b] - tau[a]) / (q[b] - q[a]));
  }
  const f = q.map((qk, k) => qk * alpha[k] - tau[k]);
  const dq = q.map((qk, k) => (Math.abs(qk - 1) < 1e-12 ? info.slope : tau[k] / (qk - 1)));
  return {
    q: [...q], tau, tauFitError: err, dq, alpha, f,
    informationDimension: info.slope, informationDimensionFitError: info.standardError,
    maxConcentrationExponent: mx.slope, maxConcentrationFitError: mx.standardError,
  };
}
