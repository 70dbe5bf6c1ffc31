/**
 * The isotropic noise level of the k-fold amplitude A_k = |Σ_j e^{ikθ_j}| / n
 * (worker/core/anisotropy.ts) over the n particles of the outer shell, and
 * the verdict "above noise" that compares an ensemble's A_k with it.
 *
 * Law under the null (n angles θ_j independent and uniform on [0, 2π)).
 * For any integer k ≥ 1 the unit vectors e^{ikθ_j} are independent and
 * uniform on the circle: mean 0, E cos² = E sin² = 1/2, E cos·sin = 0. So
 * E|S|² = n exactly (S = Σ_j e^{ikθ_j}), i.e. E[A_k²] = 1/n, and by the
 * central limit theorem in the plane S/√n tends to a complex normal law with
 * variance 1/2 per component: |S| is asymptotically Rayleigh with σ² = n/2.
 * Hence, for A_k = |S|/n,
 *
 *   P(A_k > a) → exp(−n a²)                (the Rayleigh test of uniformity:
 *                                            2n A² is asymptotically χ²₂),
 *   mean      E[A_k] → σ √(π/2) / n = √(π/(4n)),
 *   quantile  A_p = √(−ln(1 − p) / n);  p = 0.95: √(ln 20 / n) ≈ 1.731/√n.
 *
 * (Mardia & Jupp 2000, Directional Statistics, Wiley, §6.3.1, the Rayleigh
 * test; citation from memory.) The law does not depend on k, so one noise
 * level serves k = 4 and 6. For finite n the exact mean differs from
 * √(π/(4n)) by a relative O(1/n): about +1.3% at n = 5 and below 0.1% for
 * n ≥ 100 (Monte Carlo, test/fold-noise.test.ts); the shells of recorded
 * clusters hold tens to millions of particles.
 *
 * What the noise level is not: a DLA cluster's angles are not independent
 * (a whole branch shares one direction), so even an isotropic model such as
 * off-lattice DLA shows A_k far above √(π/(4n)) (about 150 times at 10^6).
 * "Above noise" says that finite sampling of independent angles cannot
 * explain the amplitude; whether a model is anisotropic is judged against an
 * isotropic baseline ensemble (the combined figure of
 * coordinator/report/observable-plots.ts).
 *
 * Pure; no I/O.
 */

/** Quantile p of the noise law that the verdict compares with. */
export const NOISE_QUANTILE = 0.95;

/** E[A_k] for n independent uniform angles, asymptotically (Rayleigh): √(π/(4n)). NaN for n < 1. */
export function isotropicFoldMean(n: number): number {
  return n >= 1 ? Math.sqrt(Math.PI / (4 * n)) : NaN;
}

/** Quantile p of A_k for n independent uniform angles (Rayleigh tail exp(−n a²)): √(−ln(1 − p)/n). NaN for n < 1. */
export function isotropicFoldQuantile(n: number, p: number = NOISE_QUANTILE): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`quantile p must lie strictly between 0 and 1, got ${p}`);
  return n >= 1 ? Math.sqrt(-Math.log1p(-p) / n) : NaN;
}

/** The rule of aboveNoise, printed beside every verdict. */
export const ABOVE_NOISE_RULE =
  `'above noise' when the lower end of the bootstrap band of the ensemble mean A_k lies above the mean over clusters of √(ln 20 / n) ` +
  `(the ${Math.round(NOISE_QUANTILE * 100)}% quantile of A_k for n independent uniform angles, Rayleigh law; n = the cluster's shell count), 'within noise' otherwise`;

/** What "above noise" does not mean, said beside the verdicts. */
export const NOISE_CAVEAT =
  'Angles within a DLA cluster are correlated along its branches, so even an isotropic model lies above the independent-angle noise: anisotropy is judged against an isotropic baseline ensemble (tendril run --baseline), not against this noise.';

/** Verdict of one ensemble mean A_k with band lower end `lo` against the noise threshold `threshold` (ABOVE_NOISE_RULE). */
export function aboveNoise(lo: number, threshold: number): 'above noise' | 'within noise' | 'unknown' {
  if (!Number.isFinite(lo) || !Number.isFinite(threshold)) return 'unknown';
  return lo > threshold ? 'above noise' : 'within noise';
}
