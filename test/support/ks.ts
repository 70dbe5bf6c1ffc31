/**
 * Kolmogorov–Smirnov tests (one- and two-sample) with the asymptotic
 * Kolmogorov distribution, P(K > x) = 2 Σ_{k≥1} (−1)^{k−1} e^{−2k²x²}
 * (Kolmogorov 1933; Smirnov 1948; the finite-n correction
 * √n + 0.12 + 0.11/√n is from Stephens 1970, J. R. Stat. Soc. B 32, 115;
 * citations from memory).
 */

export function kolmogorovPValue(x: number): number {
  if (x <= 0) return 1;
  let sum = 0;
  for (let k = 1; k <= 100; k++) {
    const term = Math.exp(-2 * k * k * x * x);
    sum += (k % 2 === 1 ? 1 : -1) * term;
    if (term < 1e-12) break;
  }
  return Math.min(1, Math.max(0, 2 * sum));
}

/** One-sample KS test of samples against a continuous CDF. */
export function ksOneSample(samples: ArrayLike<number>, cdf: (x: number) => number): { d: number; p: number } {
  const xs = Float64Array.from(samples).sort();
  const n = xs.length;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const f = cdf(xs[i]);
    d = Math.max(d, (i + 1) / n - f, f - i / n);
  }
  const sn = Math.sqrt(n);
  return { d, p: kolmogorovPValue((sn + 0.12 + 0.11 / sn) * d) };
}

/** Two-sample KS test. */
export function ksTwoSample(a: ArrayLike<number>, b: ArrayLike<number>): { d: number; p: number } {
  const xa = Float64Array.from(a).sort();
  const xb = Float64Array.from(b).sort();
  const n = xa.length;
  const m = xb.length;
  let i = 0;
  let j = 0;
  let d = 0;
  while (i < n && j < m) {
    const v = Math.min(xa[i], xb[j]);
    while (i < n && xa[i] <= v) i++;
    while (j < m && xb[j] <= v) j++;
    d = Math.max(d, Math.abs(i / n - j / m));
  }
  const ne = Math.sqrt((n * m) / (n + m));
  return { d, p: kolmogorovPValue((ne + 0.12 + 0.11 / ne) * d) };
}
