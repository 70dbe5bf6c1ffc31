import { describe, expect, it } from 'vitest';
import { growthMomentZ3, type ClusterHarmonic } from '../coordinator/harmonic/cluster-harmonic.js';
import { harmonicSection, intervalEnds, type HarmonicSectionOptions } from '../coordinator/harmonic/harmonic-section.js';
import { Random } from '../worker/core/random.js';

// Exact and synthetic checks of the harmonic section (coordinator/harmonic/harmonic-section.ts):
// synthetic per-cluster records with a known truth, so every check compares with the truth
// put in, not with a measured value.

const Q = [0, 1, 2, 3];
const SIZES = [500, 1000, 2000, 4000];

function gaussian(rng: Random): number {
  // Box–Muller (common practice, no source)
  const u = rng.nextOpen32();
  const v = rng.nextDouble();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

function record(runIndex: number, size: number, over: Partial<ClusterHarmonic> = {}): ClusterHarmonic {
  const q = over.q ?? Q;
  const tau = over.tau ?? q.map((v) => 0.7 * (v - 1));
  return {
    runIndex, size, walkers: 10000, q,
    tau, tauFitError: q.map(() => 0.01), dq: q.map((v, k) => (v === 1 ? null : tau[k] / (v - 1))),
    alpha: q.map(() => 0.7), f: q.map(() => 0), converged: q.map(() => true),
    informationDimension: 0.95, tauSystematic: q.map(() => 0.01), informationDimensionSystematic: 0.02, maxConcentrationExponent: 0.6,
    window: { relativeMin: 1 / 32, relativeMax: 0.5 }, radius: Math.sqrt(size),
    logCapacity: Math.log(size) / 1.7, logCapacityError: 0.001, z3: 1 / size, z2Plugin: 0, z3Plugin: 0,
    ...over,
  };
}

function options(over: Partial<HarmonicSectionOptions> = {}): HarmonicSectionOptions {
  return {
    probe: { walkers: 10000, jobs: 2, q: Q, sizes: SIZES, contactSample: 1000, minStep: 0.02 },
    massDimension: null, seed: '17', resamples: 1000, ...over,
  };
}

/** K clusters with log cap(N) = log c + log N / D + u_c + e_{c,N} (u, e normal with sds offset, noise). */
function capacityEnsemble(k: number, d: number, seed: number, offset = 0.1, noise = 0.03): ClusterHarmonic[] {
  const rng = Random.forRun(seed, 0);
  const out: ClusterHarmonic[] = [];
  for (let c = 0; c < k; c++) {
    const u = offset * gaussian(rng);
    for (const n of SIZES) out.push(record(c, n, { logCapacity: Math.log(0.4) + Math.log(n) / d + u + noise * gaussian(rng) }));
  }
  return out;
}

describe('harmonic section: capacity growth', () => {
  it('recovers the exponent 1/D of cap(N) = c N^(1/D) with an interval covering the truth, and a bootstrap error that is the error of the mean of per-cluster slopes', () => {
    const D = 1.71;
    const recs = capacityEnsemble(40, D, 5);
    const s = harmonicSection(recs, options({ resamples: 2000 }));
    const g = s.capacityGrowth;
    expect(g.reason).toBeNull();
    expect(g.sizes).toEqual(SIZES);
    const iv = intervalEnds(g.exponentInterval)!;
    expect(iv[0]).toBeLessThan(1 / D);
    expect(iv[1]).toBeGreaterThan(1 / D);
    expect(g.dimensionInterval![0]).toBeLessThan(D);
    expect(g.dimensionInterval![1]).toBeGreaterThan(D);
    expect(g.dimension).toBeCloseTo(1 / (g.exponent as number), 12);
    // OLS is linear in the ordinates: slope of the mean curve = mean of per-cluster slopes (exact)
    const x = SIZES.map(Math.log);
    const xm = x.reduce((a, b) => a + b) / x.length;
    const sxx = x.reduce((a, b) => a + (b - xm) ** 2, 0);
    const slopes = Array.from({ length: 40 }, (_, c) => SIZES.reduce((acc, n, j) => acc + ((x[j] - xm) / sxx) * (recs[c * 4 + j].logCapacity as number), 0));
    const mean = slopes.reduce((a, b) => a + b) / 40;
    expect(g.exponent as number).toBeCloseTo(mean, 12);
    const lm = g.meanLogCapacity.reduce((a, b) => a + b) / 4;
    expect(g.meanLogCapacity.reduce((a, v, j) => a + ((x[j] - xm) / sxx) * (v - lm), 0)).toBeCloseTo(mean, 12);
    // the bootstrap SE of a mean of K values is sd sqrt((K-1)/K) / sqrt(K) (plug-in); with B = 2000
    // resamples its Monte Carlo relative error is about 1/sqrt(2B) = 1.6% (common practice, no source): 3 of them
    const sd = Math.sqrt(slopes.reduce((a, v) => a + (v - mean) ** 2, 0) / 39);
    const want = (sd * Math.sqrt(39 / 40)) / Math.sqrt(40);
    expect(Math.abs((g.exponentInterval!.standardError as number) / want - 1)).toBeLessThan(3 * 0.016);
  });

  it('the 95% interval of the exponent covers the truth at the rate of a bootstrap of a mean (200 synthetic ensembles)', () => {
    // Expected coverage of a bootstrap interval of the mean of K = 40 normal values: the bootstrap's
    // plug-in variance (K-1)/K and the normal instead of the t quantile give
    // P(|t_39| < 1.96 sqrt(39/40)) = 0.94 (common practice, no source). Tolerance: 3 binomial
    // standard deviations of 200 trials, sqrt(0.94 * 0.06 / 200) = 0.017.
    const D = 1.71;
    const trials = 200;
    let covered = 0;
    for (let t = 0; t < trials; t++) {
      const s = harmonicSection(capacityEnsemble(40, D, 1000 + t), options({ resamples: 400, seed: t }));
      const iv = intervalEnds(s.capacityGrowth.exponentInterval)!;
      if (iv[0] <= 1 / D && 1 / D <= iv[1]) covered++;
    }
    expect(Math.abs(covered / trials - 0.94)).toBeLessThan(3 * Math.sqrt((0.94 * 0.06) / trials));
  });
});

/**
 * K clusters, sizes `sizes`: Z(3) = A N^-beta e^{noise}; log cap grows over each interval by
 * C g^power (N_{k+1} − N_k) (1 + noise'), g = geometric mean of the true Z(3) at the ends.
 */
function incrementEnsemble(k: number, sizes: number[], power: number, seed: number, noise: number): ClusterHarmonic[] {
  const rng = Random.forRun(seed, 0);
  const truth = (n: number): number => 0.5 / n;
  const C = 1 / (1.7 * 0.5 ** power); // power 1: increments about 1/(1.7 N)
  const out: ClusterHarmonic[] = [];
  for (let c = 0; c < k; c++) {
    let lc = Math.log(0.4 * Math.sqrt(sizes[0])) + 0.1 * gaussian(rng);
    for (let j = 0; j < sizes.length; j++) {
      if (j > 0) {
        const g = Math.sqrt(truth(sizes[j - 1]) * truth(sizes[j]));
        lc += C * g ** power * (sizes[j] - sizes[j - 1]) * (1 + noise * gaussian(rng));
      }
      out.push(record(c, sizes[j], { logCapacity: lc, z3: truth(sizes[j]) * Math.exp(noise * gaussian(rng)) }));
    }
  }
  return out;
}

describe('harmonic section: capacity increment against Z(3)', () => {
  const sizes = [500, 1000, 2000, 4000, 8000];

  it('exact proportional increments: slope 1, constant ratio; increments proportional to Z(3)^2: slope 2, not proportional', () => {
    const p = harmonicSection(incrementEnsemble(10, sizes, 1, 3, 0), options({ probe: { ...options().probe, sizes } })).capacityIncrement;
    expect(p.reason).toBeNull();
    expect(p.fromSize).toEqual(sizes.slice(0, 4));
    expect(p.toSize).toEqual(sizes.slice(1));
    expect(p.slope as number).toBeCloseTo(1, 10);
    for (const r of p.ratio) expect(r).toBeCloseTo(p.ratio[0], 10);
    // identical clusters: the bootstrap spread is rounding only (proportional is judged on noisy data below)
    const iv = intervalEnds(p.slopeInterval)!;
    expect(iv[1] - iv[0]).toBeLessThan(1e-9);
    const n = harmonicSection(incrementEnsemble(10, sizes, 2, 3, 0), options()).capacityIncrement;
    expect(n.slope as number).toBeCloseTo(2, 10);
    expect(n.proportional).toBe(false);
  });

  it('noisy proportional increments: the slope interval covers 1; noisy increments proportional to Z(3)^2: it covers 2 and excludes 1', () => {
    const p = harmonicSection(incrementEnsemble(30, sizes, 1, 4, 0.2), options({ resamples: 2000 })).capacityIncrement;
    expect(p.slopeInterval!.status).toBe('ok');
    expect(p.proportional).toBe(true);
    expect(Math.abs((p.slope as number) - 1)).toBeLessThan(3 * (p.slopeInterval!.standardError as number));
    const n = harmonicSection(incrementEnsemble(30, sizes, 2, 4, 0.2), options({ resamples: 2000 })).capacityIncrement;
    const iv = intervalEnds(n.slopeInterval)!;
    expect(iv[0]).toBeLessThan(2);
    expect(iv[1]).toBeGreaterThan(2);
    expect(n.proportional).toBe(false);
  });
});

describe('harmonic section: per size', () => {
  it('Legendre transform of the ensemble-mean tau by finite differences (exact for a quadratic tau), D_q, convergence shares, Beurling', () => {
    // tau_c(q) = a_c (q - 1) + b (q - 1)^2: the mean is a quadratic with a = mean a_c, and central
    // differences of a quadratic are exact, so alpha(q) = a + 2 b (q - 1) inside the grid.
    const q = [3, 0, 2, 1, 0.5]; // unsorted on purpose: differences are taken over the sorted grid
    const b = 0.1;
    const as = [0.6, 0.7, 0.8, 0.9];
    const recs = as.map((a, c) => record(c, 1000, {
      q, tau: q.map((v) => a * (v - 1) + b * (v - 1) ** 2), informationDimension: 0.9 + 0.01 * c,
      converged: q.map((_, k) => (k === 0 ? c > 0 : k === 1 ? null : true)), maxConcentrationExponent: 0.55 + 0.01 * c,
    }));
    const s = harmonicSection(recs, options({ probe: { ...options().probe, q } }));
    const at = s.bySize[0];
    const a = 0.75;
    const tau = (v: number): number => a * (v - 1) + b * (v - 1) ** 2;
    q.forEach((v, k) => expect(at.tau[k].mean).toBeCloseTo(tau(v), 12));
    // interior points of the sorted grid 0, 0.5, 1, 2, 3 other than q = 1: 0.5 and 2
    expect(at.alpha[q.indexOf(0.5)]).toBeCloseTo(a + 2 * b * (0.5 - 1), 12);
    expect(at.alpha[q.indexOf(2)]).toBeCloseTo(a + 2 * b * (2 - 1), 12);
    // ends: one-sided differences
    expect(at.alpha[q.indexOf(0)]).toBeCloseTo((tau(0.5) - tau(0)) / 0.5, 12);
    expect(at.alpha[q.indexOf(3)]).toBeCloseTo(tau(3) - tau(2), 12);
    // q = 1: the ensemble mean of the fitted tau'(1)
    expect(at.alpha[q.indexOf(1)]).toBeCloseTo(0.915, 12);
    q.forEach((v, k) => expect(at.f[k]).toBeCloseTo(v * at.alpha[k] - tau(v), 12));
    expect(at.dq[q.indexOf(1)]).toBeNull();
    expect(at.dq[q.indexOf(3)] as number).toBeCloseTo(tau(3) / 2, 12);
    expect(at.convergedFraction[0]).toBe(0.75);
    expect(at.converged[0]).toBe(false);
    expect(at.convergedFraction[1]).toBeNull();
    expect(at.converged[1]).toBe(false);
    expect(at.convergedFraction[2]).toBe(1);
    expect(at.converged[2]).toBe(true);
    // sorted grid 0 (unjudged), 0.5, 1, 2 (converged), 3 (not): the range to quote is [0.5, 2]
    expect(at.convergedRange).toEqual([0.5, 2]);
    expect(at.tau3).toBe(at.tau[0]);
    expect(at.beurlingRespected).toBe(true);
    const low = harmonicSection(recs.map((r) => ({ ...r, maxConcentrationExponent: r.maxConcentrationExponent - 0.2 })), options()).bySize[0];
    expect(low.beurlingRespected).toBe(false);
  });

  it('electrostatic check: tau(3) at the largest size beside the mass dimension, consistent when the intervals overlap', () => {
    const recs = SIZES.flatMap((n) => Array.from({ length: 8 }, (_, c) => record(c, n, { tau: Q.map((v) => (v === 3 ? 1.7 + 0.02 * (c - 3.5) + (n === 4000 ? 0 : 1) : 0.7 * (v - 1))) })));
    const mass = { estimator: 'radiusOfGyration', value: 1.69, interval: [1.66, 1.72] as [number, number] };
    const e = harmonicSection(recs, options({ massDimension: mass })).electrostatic;
    expect(e.size).toBe(4000);
    expect(e.tau3!.mean).toBeCloseTo(1.7, 12);
    expect(e.massDimension).toEqual(mass);
    expect(e.consistent).toBe(true);
    const far = harmonicSection(recs, options({ massDimension: { ...mass, value: 1.5, interval: [1.45, 1.55] } })).electrostatic;
    expect(far.consistent).toBe(false);
    const noThree = harmonicSection(recs.map((r) => ({ ...r, q: [0, 1, 2], tau: r.tau.slice(0, 3) })), options({ massDimension: mass })).electrostatic;
    expect(noThree.tau3).toBeNull();
    expect(noThree.consistent).toBeNull();
    expect(harmonicSection(recs, options()).electrostatic.consistent).toBeNull();
  });
});

describe('harmonic section: particle-scale form of tau(3) = D', () => {
  it('recovers tau(3)/D from Z(3) = c N^(-r) with cluster noise (exact power law: common practice, no source), and judges r = 1 consistent, r = 1.3 not', () => {
    const ensemble = (r: number, seed: number) => {
      const rng = Random.forRun(seed, 0);
      return Array.from({ length: 12 }, (_, c) => {
        const u = 0.1 * gaussian(rng);
        return SIZES.map((n) => record(c, n, { z3: Math.exp(Math.log(2) - r * Math.log(n) + u + 0.02 * gaussian(rng)) }));
      }).flat();
    };
    const one = harmonicSection(ensemble(1, 5), options()).electrostatic.particleScale;
    expect(one.clusters).toBe(12);
    expect(one.reason).toBeNull();
    const iv = one.ratioInterval!.bca ?? one.ratioInterval!.percentile!;
    expect(iv[0]).toBeLessThanOrEqual(1);
    expect(iv[1]).toBeGreaterThanOrEqual(1);
    expect(one.consistent).toBe(true);
    const steep = harmonicSection(ensemble(1.3, 6), options()).electrostatic.particleScale;
    expect(steep.ratio!).toBeCloseTo(1.3, 1);
    expect(steep.consistent).toBe(false);
    // exact data: the ratio is the exponent itself
    const exact = SIZES.flatMap((n) => Array.from({ length: 4 }, (_, c) => record(c, n, { z3: 3 * n ** -1.1 })));
    expect(harmonicSection(exact, options()).electrostatic.particleScale.ratio!).toBeCloseTo(1.1, 12);
    // a cluster with no Z(3) at some size is left out; too few clusters give a reason
    expect(harmonicSection(exact.map((r) => (r.runIndex === 0 && r.size === SIZES[0] ? { ...r, z3: null } : r)), options()).electrostatic.particleScale.clusters).toBe(3);
    expect(harmonicSection(exact.filter((r) => r.runIndex < 2), options()).electrostatic.particleScale.reason).toMatch(/2 clusters with a positive Z\(3\) at every probed size; at least 3 are needed/);
  });
});

describe('harmonic section: fit-window systematic', () => {
  it('reports the ensemble mean of the per-cluster systematics and widens the intervals by it (our rule)', () => {
    const recs = Array.from({ length: 6 }, (_, c) => record(c, 1000, { informationDimension: 0.95 + 0.002 * c, informationDimensionSystematic: 0.01 * (c + 1), tauSystematic: Q.map((v) => (v === 3 ? 0.05 : 0.01)) }));
    const at = harmonicSection(recs, options()).bySize[0];
    expect(at.systematic.informationDimension).toBeCloseTo(0.035, 12);
    expect(at.systematic.tau[Q.indexOf(3)]).toBeCloseTo(0.05, 12);
    const iv = at.informationDimension.interval.bca ?? at.informationDimension.interval.percentile!;
    expect(at.informationDimensionWithSystematic![0]).toBeCloseTo(iv[0] - 0.035, 12);
    expect(at.informationDimensionWithSystematic![1]).toBeCloseTo(iv[1] + 0.035, 12);
    const t3 = at.tau3!.interval.bca ?? at.tau3!.interval.percentile!;
    expect(at.tau3WithSystematic![0]).toBeCloseTo(t3[0] - 0.05, 12);
    // records without a systematic (fewer than 4 box sides) leave it null
    const none = harmonicSection(recs.map((r) => ({ ...r, tauSystematic: null, informationDimensionSystematic: null })), options()).bySize[0];
    expect(none.systematic.informationDimension).toBeNull();
    expect(none.informationDimensionWithSystematic).toBeNull();
  });
});

describe('harmonic section: thin data and determinism', () => {
  it('gives reasons instead of throwing when there are too few clusters or sizes', () => {
    const none = harmonicSection([], options());
    expect(none.bySize).toEqual([]);
    expect(none.capacityGrowth.reason).toMatch(/0 probed sizes/);
    expect(none.capacityIncrement.reason).toMatch(/0 probed sizes/);
    expect(none.electrostatic.tau3).toBeNull();
    expect(none.clustersAtAllSizes).toBe(0);

    const one = harmonicSection([record(0, 1000)], options());
    expect(one.bySize[0].tau[0].interval.status).toBe('too-few-clusters');
    expect(one.bySize[0].beurlingRespected).toBeNull();
    expect(one.capacityGrowth.reason).toMatch(/1 probed size;/);

    const two = harmonicSection([0, 1].flatMap((c) => SIZES.map((n) => record(c, n))), options());
    expect(two.capacityGrowth.reason).toMatch(/2 clusters .* at least 3/);
    expect(two.capacityGrowth.meanLogCapacity).toHaveLength(4);
    expect(two.capacityIncrement.reason).toMatch(/2 clusters .* at least 3/);
    expect(two.capacityIncrement.meanIncrement).toHaveLength(3);

    const twoSizes = harmonicSection([0, 1, 2].flatMap((c) => [500, 1000].map((n) => record(c, n, { logCapacity: Math.log(n) / 1.7 + 0.01 * c * (n === 500 ? 1 : -1) }))), options());
    expect(twoSizes.capacityGrowth.reason).toBeNull();
    expect(twoSizes.capacityIncrement.reason).toMatch(/1 increment; the slope needs at least 3 sizes/);
    expect(twoSizes.capacityIncrement.ratio).toHaveLength(1);

    const noCap = harmonicSection([0, 1, 2, 3].flatMap((c) => SIZES.map((n) => record(c, n, { logCapacity: null, z3: null }))), options());
    expect(noCap.bySize[0].logCapacity.interval.status).toBe('too-few-clusters');
    expect(noCap.capacityGrowth.reason).toMatch(/no cluster has a log capacity/);
    expect(noCap.capacityIncrement.reason).toMatch(/no cluster has a log capacity and Z\(3\)/);
    expect(noCap.clustersAtAllSizes).toBe(4);

    // one cluster missing a size is left out of the growth relations only
    const partial = capacityEnsemble(5, 1.7, 9).filter((r) => !(r.runIndex === 4 && r.size === 2000));
    const sp = harmonicSection(partial, options());
    expect(sp.clustersAtAllSizes).toBe(4);
    expect(sp.bySize.map((b) => b.clusters)).toEqual([5, 5, 4, 5]);
    expect(sp.capacityGrowth.exponentInterval!.replicatesUsed).toBeGreaterThan(0);

    // shrinking capacity: no dimension, a reason
    const shrink = harmonicSection([0, 1, 2].flatMap((c) => SIZES.map((n) => record(c, n, { logCapacity: -Math.log(n) + 0.01 * c * n / 1000 }))), options());
    expect(shrink.capacityGrowth.dimension).toBeNull();
    expect(shrink.capacityGrowth.reason).toMatch(/does not grow/);
    expect(shrink.capacityIncrement.slope).toBeNull();
    expect(shrink.capacityIncrement.reason).toMatch(/must both be positive/);

    expect(() => harmonicSection([record(0, 500), record(1, 500, { q: [0, 1] , tau: [0, 0] })], options())).toThrow(/run 1 at size 500: q grid/);
    expect(() => harmonicSection([], options({ resamples: 5 }))).toThrow(/resamples: 5/);
  });

  it('is deterministic: same records (in any order) and seed give the same section; another seed other intervals', () => {
    const recs = incrementEnsemble(12, [500, 1000, 2000, 4000], 1, 8, 0.2);
    const a = JSON.stringify(harmonicSection(recs, options()));
    const shuffled = [...recs].reverse();
    shuffled.push(recs[3]); // a duplicate (run, size) is ignored
    expect(JSON.stringify(harmonicSection(shuffled, options()))).toBe(a);
    expect(JSON.stringify(harmonicSection(recs, options()))).toBe(a);
    const other = harmonicSection(recs, options({ seed: '18' }));
    expect(JSON.stringify(other)).not.toBe(a);
    expect(other.capacityIncrement.slope).toBe(JSON.parse(a).capacityIncrement.slope);
  });
});

describe('unbiased particle-scale Z(3)', () => {
  it('the factorial-moment estimator averages to sum p^3 within its standard error; the plug-in averages to its exact biased expectation', () => {
    // p: 40 cells with p_i proportional to (i + 1)^-1.5. Exact moments of one multinomial cell
    // with W trials: E[c(c-1)(c-2)] = W(W-1)(W-2) p^3 and
    // E[c^3] = W(W-1)(W-2) p^3 + 3 W(W-1) p^2 + W p (factorial moments of the binomial; standard).
    const m = 40;
    const raw = Array.from({ length: m }, (_, i) => (i + 1) ** -1.5);
    const tot = raw.reduce((a, b) => a + b);
    const p = raw.map((v) => v / tot);
    const cdf: number[] = [];
    p.reduce((a, v, i) => (cdf[i] = a + v), 0);
    const W = 60;
    const draws = 4000;
    const rng = Random.forRun(77, 0);
    const counts = new Float64Array(m);
    const un: number[] = [];
    const plug: number[] = [];
    for (let d = 0; d < draws; d++) {
      counts.fill(0);
      for (let w = 0; w < W; w++) {
        const u = rng.nextDouble();
        let lo = 0, hi = m - 1;
        while (lo < hi) { const mid = (lo + hi) >> 1; if (cdf[mid] > u) hi = mid; else lo = mid + 1; }
        counts[lo]++;
      }
      un.push(growthMomentZ3(counts, W) as number);
      plug.push(Array.from(counts).reduce((a, c) => a + (c / W) ** 3, 0));
    }
    const meanSe = (v: number[]): [number, number] => {
      const mu = v.reduce((a, b) => a + b) / v.length;
      return [mu, Math.sqrt(v.reduce((a, x) => a + (x - mu) ** 2, 0) / (v.length - 1) / v.length)];
    };
    const z3 = p.reduce((a, v) => a + v ** 3, 0);
    const plugExpect = p.reduce((a, v) => a + (W * (W - 1) * (W - 2) * v ** 3 + 3 * W * (W - 1) * v ** 2 + W * v) / W ** 3, 0);
    const [mu, se] = meanSe(un);
    const [mp, sp] = meanSe(plug);
    expect(Math.abs(mu - z3)).toBeLessThan(3 * se);
    expect(Math.abs(mp - plugExpect)).toBeLessThan(3 * sp);
    expect(mp - z3).toBeGreaterThan(10 * sp); // the plug-in's bias is far outside its error at W = 60
    expect(growthMomentZ3([5, 1], 2)).toBeNull();
  });
});
