import { describe, expect, it } from 'vitest';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import { bootstrapInterval, jackknifeAcceleration, sortedQuantile } from '../coordinator/stats/bca.js';
import { bootstrapRandom, bootstrapScalar, drawResample, jackknifeScalar } from '../coordinator/stats/bootstrap.js';
import { erfc, normalCdf, normalQuantile } from '../coordinator/stats/special-functions.js';
import { syntheticEnsemble } from '../coordinator/stats/synthetic-ensemble.js';
import { Random } from '../worker/core/random.js';

describe('normal distribution functions', () => {
  it('match standard table values (Abramowitz & Stegun 1964, Table 26.1; values from memory, widely reproduced)', () => {
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963984540054, 12);
    expect(normalQuantile(0.995)).toBeCloseTo(2.5758293035489, 11);
    expect(normalQuantile(0.9)).toBeCloseTo(1.2815515655446004, 12);
    expect(normalCdf(1)).toBeCloseTo(0.8413447460685429, 14);
    expect(normalCdf(-3)).toBeCloseTo(0.0013498980316301, 15);
    expect(erfc(3) / 2.209049699858544e-5).toBeCloseTo(1, 12);
    for (const p of [1e-12, 1e-6, 0.01, 0.3, 0.5, 0.77, 0.999]) expect(normalCdf(normalQuantile(p)) / p).toBeCloseTo(1, 11);
  });
});

// Exact interval for the mean mu of an exponential sample of size n:
// 2 n xbar / mu ~ chi-square with 2n degrees of freedom, whose distribution
// function for even dof is 1 - exp(-x/2) sum_{k<n} (x/2)^k / k! (Poisson sum).
function chiSquareEvenCdf(x: number, n: number): number {
  let term = 1, sum = 1;
  for (let k = 1; k < n; k++) { term *= x / 2 / k; sum += term; }
  return 1 - Math.exp(-x / 2) * sum;
}
function chiSquareEvenQuantile(p: number, n: number): number {
  let lo = 0, hi = 20 * n + 100;
  for (let i = 0; i < 200; i++) { const m = (lo + hi) / 2; if (chiSquareEvenCdf(m, n) < p) lo = m; else hi = m; }
  return (lo + hi) / 2;
}

describe('BCa interval', () => {
  it('for the mean of an exponential sample is closer to the exact chi-square interval than the percentile interval (Efron & Tibshirani 1993, An Introduction to the Bootstrap, ch. 14)', () => {
    // a representative sample: the n quantiles (i + 1/2)/n of Exp(1)
    const n = 15, level = 0.9;
    const x = Float64Array.from({ length: n }, (_, i) => -Math.log(1 - (i + 0.5) / n));
    let sum = 0;
    for (let i = 0; i < n; i++) sum += x[i];
    const mean = sum / n;
    const exact = [(2 * n * mean) / chiSquareEvenQuantile(0.95, n), (2 * n * mean) / chiSquareEvenQuantile(0.05, n)];
    const reps = bootstrapScalar(n, 4000, bootstrapRandom(1), (counts) => { let t = 0; for (let i = 0; i < n; i++) t += counts[i] * x[i]; return t / n; });
    const iv = bootstrapInterval(mean, reps, jackknifeScalar(n, (i) => (sum - x[i]) / (n - 1)), level);
    expect(iv.status).toBe('ok');
    const [pl, pu] = iv.percentile!, [bl, bu] = iv.bca!;
    expect(Math.abs(bl - exact[0])).toBeLessThan(Math.abs(pl - exact[0]));
    expect(Math.abs(bu - exact[1])).toBeLessThan(Math.abs(pu - exact[1]));
    // both corrections push the interval up for a right-skewed statistic
    expect(iv.biasCorrection!).toBeGreaterThan(0);
    // for a mean, a is about skewness / (6 sqrt(n)) (E&T 1993, ch. 14): 2 / (6 sqrt(15)) = 0.086 for Exp
    expect(iv.acceleration!).toBeGreaterThan(0.03);
    expect(iv.acceleration!).toBeLessThan(0.1);
  });

  it('for the exponential mean, BCa one-sided miss rates are closer to nominal than the percentile ones (Efron & Tibshirani 1993, ch. 14)', () => {
    const n = 15, samples = 2000, B = 1000, level = 0.9;
    const rng = Random.forRun(5, 0, 3);
    const missPct = [0, 0], missBca = [0, 0];
    for (let s = 0; s < samples; s++) {
      const x = Float64Array.from({ length: n }, () => -Math.log(rng.nextOpen32()));
      let sum = 0;
      for (let i = 0; i < n; i++) sum += x[i];
      const reps = bootstrapScalar(n, B, bootstrapRandom(s), (counts) => { let t = 0; for (let i = 0; i < n; i++) t += counts[i] * x[i]; return t / n; });
      const iv = bootstrapInterval(sum / n, reps, jackknifeScalar(n, (i) => (sum - x[i]) / (n - 1)), level);
      if (iv.percentile![0] > 1) missPct[0]++;
      if (iv.percentile![1] < 1) missPct[1]++;
      if (iv.bca![0] > 1) missBca[0]++;
      if (iv.bca![1] < 1) missBca[1]++;
    }
    const nominal = (1 - level) / 2;
    for (const side of [0, 1]) {
      expect(Math.abs(missBca[side] / samples - nominal)).toBeLessThan(Math.abs(missPct[side] / samples - nominal));
    }
    console.log(`miss rates (nominal ${nominal}): percentile ${missPct.map((m) => m / samples)}, BCa ${missBca.map((m) => m / samples)}`);
  });

  it('acceleration of a symmetric jackknife is 0 and quantiles interpolate (Hyndman & Fan 1996 type 7)', () => {
    expect(jackknifeAcceleration([1, 2, 3, 4, 5])).toBeCloseTo(0, 15);
    expect(jackknifeAcceleration([2, 2, 2])).toBeNull();
    expect(sortedQuantile([0, 10], 0.25)).toBe(2.5);
    expect(sortedQuantile([1, 2, 3, 4, 5], 0.5)).toBe(3);
  });

  it('handles degenerate replicates without NaN', () => {
    const same = bootstrapInterval(1.5, new Float64Array(100).fill(1.5), new Float64Array(10).fill(1.5), 0.95);
    expect(same.status).toBe('degenerate');
    expect(same.percentile).toEqual([1.5, 1.5]);
    expect(same.notes.join(' ')).toMatch(/all 100 bootstrap replicates are equal/);
    const broken = new Float64Array(100).map((_, i) => (i < 10 ? NaN : i));
    const b = bootstrapInterval(50, broken, null, 0.95);
    expect(b.status).toBe('unstable');
    expect(b.percentile).toBeNull();
    const few = new Float64Array(100).map((_, i) => (i < 2 ? Infinity : i));
    const f = bootstrapInterval(50, few, null, 0.95);
    expect(f.status).toBe('ok');
    expect(f.replicatesUsed).toBe(98);
    expect(f.notes[0]).toMatch(/2 of 100 bootstrap replicates were not finite/);
  });
});

describe('cluster resampling', () => {
  it('draws multinomial multiplicities: mean 1 and variance 1 - 1/K per cluster (exact moments of Multinomial(K; 1/K, ...))', () => {
    const k = 7, reps = 20000;
    const rng = bootstrapRandom(3);
    const counts = new Int32Array(k), drawn = new Int32Array(k), weights = new Float64Array(k);
    const s1 = new Float64Array(k), s2 = new Float64Array(k);
    for (let b = 0; b < reps; b++) {
      const used = drawResample(rng, counts, drawn, weights);
      let total = 0;
      for (let j = 0; j < used; j++) { expect(weights[j]).toBe(counts[drawn[j]]); total += weights[j]; }
      expect(total).toBe(k);
      for (let c = 0; c < k; c++) { s1[c] += counts[c]; s2[c] += counts[c] * counts[c]; }
    }
    const v = 1 - 1 / k;
    for (let c = 0; c < k; c++) {
      const mean = s1[c] / reps;
      expect(Math.abs(mean - 1)).toBeLessThan(5 * Math.sqrt(v / reps));
      expect(s2[c] / reps - mean * mean).toBeGreaterThan(v * 0.95);
      expect(s2[c] / reps - mean * mean).toBeLessThan(v * 1.05);
    }
  });
});

describe('determinism', () => {
  const sizes = Array.from({ length: 30 }, (_, i) => Math.round(500 * Math.pow(10, i / 20)));
  const radii = Array.from({ length: 20 }, (_, i) => 3 * Math.pow(10, i / 20));
  const runs = syntheticEnsemble({ clusters: 30, sizes, radii, dimension: 1.7, seed: 11, correction: { amplitude: -0.6, omega: 0.7 } });

  it('same seed gives identical output bit for bit, regardless of the order of the runs', () => {
    const a = JSON.stringify(analyzeEnsemble(runs, { seed: '123', resamples: 300 }));
    const b = JSON.stringify(analyzeEnsemble([...runs].reverse(), { seed: '123', resamples: 300 }));
    expect(b).toBe(a);
    const c = JSON.stringify(analyzeEnsemble(runs, { seed: '124', resamples: 300 }));
    expect(c).not.toBe(a);
    expect(a).not.toMatch(/NaN|Infinity/);
  });

  it('defaults the seed to the ensemble seed and echoes the options used', () => {
    const a = analyzeEnsemble(runs, { resamples: 100, localSlopes: false, corrections: false });
    expect(a.options.seed).toBe('11');
    expect(a.options.resamples).toBe(100);
    expect(a.options.level).toBe(0.95);
    expect(a.options.generator).toMatch(/STREAM_BOOTSTRAP/);
  });
});
