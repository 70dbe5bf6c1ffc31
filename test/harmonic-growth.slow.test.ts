/**
 * Harmonic measures of a real off-lattice DLA ensemble while it grows: 20
 * clusters of 4000 particles (growth kernel directly, seed 3141), each
 * probed at the prefix sizes N = 500, 1000, 2000, 4000 (the first N centres
 * are the cluster at size N) as capture disks of radius 1 with 40000 walkers
 * in 2 jobs; records by clusterHarmonicOf, section by harmonicSection
 * (2000 resamples, seed 2718). Mass dimension: analyzeEnsemble's R_g
 * estimator on the same runs, fit window N = 500..4000 (the probed range),
 * 95% BCa.
 *
 * What we find (deterministic, engine tendril-engine/2; 95% BCa intervals):
 *   D(R_g, N 500..4000)     1.699 [1.674, 1.724]
 *   D_cap = 1/slope(log cap, log N)   1.683 [1.665, 1.703]     consistent with D(R_g)
 *   capacity-increment slope d log(Δlog cap/ΔN) / d log Z(3)  0.985 [0.946, 1.030]   contains 1
 *   −d log Z(3, particle) / d log N = τ(3)/D   0.995 [0.964, 1.023]   covers 1
 *   box-fit τ(3) at N = 500 … 4000: 1.20, 1.35, 1.47, 1.55 [1.52, 1.58]   far below D
 *   box-fit τ'(1) at N = 500 … 4000: 0.76, 0.84, 0.90, 0.94 [0.929, 0.942]   below 1
 *   max-concentration exponent (means): 0.49, 0.53, 0.56, 0.62
 * So the electrostatic scaling law holds in the particle-scale form in
 * which it is derived (Σ p_i³ ∝ d log cap/dN ∝ 1/N), while the box-counting
 * fits of τ(3) and τ'(1) over the window [max(8, R/32), R/2] are not
 * converged at these sizes: see the two expected failures at the end.
 * Time: about 45 s on one core (growth and probing; the analysis 0.1 s).
 */
import { axisOf } from '../worker/core/positions.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { clusterHarmonicOf, type ClusterHarmonic } from '../coordinator/harmonic/cluster-harmonic.js';
import { harmonicSection, intervalEnds } from '../coordinator/harmonic/harmonic-section.js';
import type { HarmonicSection } from '../coordinator/harmonic/harmonic-section-types.js';
import { runProbes } from '../coordinator/harmonic/probe-run.js';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { createKernel } from '../worker/models/registry.js';
import { dlaTask, yieldToRunner } from './support/grow.js';

const CLUSTERS = 20;
const PARTICLES = 4000;
const SIZES = [500, 1000, 2000, 4000];
const WALKERS = 40000;
const Q = [0, 0.5, 1, 2, 3, 4];

let section: HarmonicSection;
let records: ClusterHarmonic[];
let mass: { value: number; interval: [number, number] };

beforeAll(async () => {
  const runs: GrowthResult[] = [];
  records = [];
  for (let i = 0; i < CLUSTERS; i++) {
    const k = createKernel(dlaTask(PARTICLES, i, '3141'));
    k.growTo(PARTICLES);
    runs.push(k.result());
    const p = k.positions();
    for (const n of SIZES) {
      const set = { count: n, x: axisOf(p, 0, n), y: axisOf(p, 1, n), r: 1 };
      const run = await runProbes(set, { walkers: WALKERS, seed: String(1000 * i + n), jobs: 2, threads: 1, q: Q, contactSample: 2000 });
      records.push(clusterHarmonicOf(i, n, run.measures, run.counts));
      await yieldToRunner();
    }
  }
  const a = analyzeEnsemble(runs, {
    resamples: 2000, corrections: false, localSlopes: false, estimators: ['radiusOfGyration'],
    fitWindow: { minSize: SIZES[0], maxSize: PARTICLES },
  });
  const rg = a.estimators.radiusOfGyration;
  expect(rg.interval.status).toBe('ok');
  mass = { value: rg.D as number, interval: rg.interval.bca as [number, number] };
  section = harmonicSection(records, {
    probe: { walkers: WALKERS, jobs: 2, q: Q, sizes: SIZES, contactSample: 2000, minStep: 0.02 },
    massDimension: { estimator: 'radiusOfGyration (N 500..4000)', value: mass.value, interval: mass.interval },
    seed: '2718', resamples: 2000,
  });
});

describe('harmonic measures of growing off-lattice DLA clusters', () => {
  it('every cluster is probed at every size; tau(1) = 0 (normalisation); tau(q) converged in the two probe halves', () => {
    expect(section.clustersAtAllSizes).toBe(CLUSTERS);
    const k1 = Q.indexOf(1);
    for (const b of section.bySize) {
      expect(b.clusters).toBe(CLUSTERS);
      expect(Math.abs(b.tau[k1].mean)).toBeLessThan(1e-9);
      expect(b.converged.every(Boolean)).toBe(true);
    }
  });

  it('Beurling: the max-concentration exponent is at least 1/2 within the ensemble error at every size (Garnett & Marshall 2005, Harmonic Measure)', () => {
    // at N = 500 the mean is 0.48 and the interval's upper end 0.52: the fit window there
    // ([R/16, R/2], R ≈ 35) reaches down to a few particles, where local slopes are lower
    for (const b of section.bySize) expect(b.beurlingRespected, `N = ${b.size}`).toBe(true);
  });

  it('capacity increment per particle is proportional to the particle-scale Z(3) = sum p_i^3 (slope interval contains 1; the relation behind tau(3) = D, Halsey 1987, Phys. Rev. Lett. 59, 2067, citation from memory)', () => {
    const c = section.capacityIncrement;
    expect(c.reason).toBeNull();
    expect(c.slopeInterval!.status).toBe('ok');
    // the test means something only if the interval is narrower than the difference of the
    // alternatives it must tell apart (slope 1 against, e.g., 1/2 or 2)
    const iv = intervalEnds(c.slopeInterval)!;
    expect(iv[1] - iv[0]).toBeLessThan(0.5);
    expect(c.proportional).toBe(true);
  });

  it('particle-scale electrostatic law: Z(3) ~ N^(-tau(3)/D) with tau(3)/D = 1 (Halsey 1987, as above; particle-scale spectrum of Halsey, Meakin & Procaccia 1986, Phys. Rev. Lett. 56, 854, citation from memory)', () => {
    // the section's particleScale: per cluster the OLS slope of log Z(3) against log N, cluster bootstrap of the mean
    const p = section.electrostatic.particleScale;
    expect(p.reason).toBeNull();
    expect(p.clusters).toBe(CLUSTERS);
    const iv = intervalEnds(p.ratioInterval)!;
    expect(iv[1] - iv[0]).toBeLessThan(0.2);
    expect(p.consistent).toBe(true);
    // and by hand from the records, the same number
    const x = SIZES.map(Math.log);
    const xm = x.reduce((a, b) => a + b) / x.length;
    const sxx = x.reduce((a, b) => a + (b - xm) ** 2, 0);
    let sum = 0;
    for (let i = 0; i < CLUSTERS; i++) {
      const z = SIZES.map((n) => records.find((r) => r.runIndex === i && r.size === n)!.z3 as number);
      sum -= z.reduce((a, v, j) => a + ((x[j] - xm) / sxx) * Math.log(v), 0);
    }
    expect(p.ratio).toBeCloseTo(sum / CLUSTERS, 12);
  });

  it('capacity dimension D_cap is consistent with the mass dimension of the same clusters (cap is between diam/4 and diam/2 for a connected set: Ransford 1995, Potential Theory in the Complex Plane, ch. 5, from memory)', () => {
    const g = section.capacityGrowth;
    expect(g.reason).toBeNull();
    const d = g.dimensionInterval!;
    expect(d[0]).toBeLessThanOrEqual(mass.interval[1]);
    expect(mass.interval[0]).toBeLessThanOrEqual(d[1]);
    expect(d[1] - d[0]).toBeLessThan(0.1);
  });

  // Expected failure, measured: box-fit τ(3) at N = 4000 is 1.547 [1.523, 1.575] against
  // D(R_g) = 1.699 [1.674, 1.724]. It rises with N (1.20, 1.35, 1.47, 1.55 at N = 500 … 4000),
  // and at N = 4000 its local slopes over windows of a factor 4 (measured while developing,
  // engine 1: 6 clusters of this ensemble, 40000 walkers)
  // are 0.92, 1.18, 1.33, 1.56, 1.77 for ε from 1.5–6 up to 24–96 (R ≈ 116): no plateau at all,
  // so the window [8, R/2] gives an average over a crossover, not an exponent. The same law in
  // its particle-scale form (Z(3) against N, above) holds. The box fit needs clusters with many
  // more decades between particle and cluster size (multiscaling persists below ~10^4
  // particles: Menshutin 2012, Phys. Rev. Lett. 108, 015501). On larger clusters it keeps
  // rising (8 clusters of 10^5 probed with 10^6 walkers at N = 12500 … 10^5, engine 1 with the
  // default window [R/32, R/2]: 1.595, 1.608, 1.661, 1.666 [1.649, 1.682] against D(R_g) =
  // 1.730 [1.710, 1.761]; a single 10^5 cluster gave 1.703), while the particle-scale ratio
  // there is 0.987 [0.968, 1.009]. If a change makes this pass, make it a plain `it`.
  it.fails('box-fit tau(3) at the largest size is consistent with the mass dimension (electrostatic scaling law, Halsey 1987, citation from memory)', () => {
    expect(section.electrostatic.tau3).not.toBeNull();
    expect(section.electrostatic.consistent).toBe(true);
  });

  // Expected failure, measured: box-fit τ'(1) at N = 4000 is 0.936 [0.929, 0.942]; it rises with
  // N (0.76, 0.84, 0.90, 0.94). This is the estimator's finite-window bias, not a failure of
  // Makarov's theorem (which is a statement as ε → 0): the same box fit over the same relative
  // window [R/16, R/2] gives 0.878 on the exact harmonic measure of a segment (arcsine law,
  // dimension exactly 1), 0.927 over [R/64, R/4] and 0.980 over [R/1000, R/50]; and at N = 4000
  // the local slopes of the DLA information dimension run from 0.56 (ε 1.5–6) to 1.03 (ε 24–96).
  // On 8 clusters of 10^5 (10^6 walkers each, engine 1) it is 0.954, 0.969, 0.988, 0.994 [0.987, 0.998]
  // at N = 12500 … 10^5: converging to 1 from below, not yet within the (small) ensemble error;
  // test/harmonic-large.slow.test.ts follows it to 10^6.
  it.fails("box-fit tau'(1) contains 1 within the ensemble error at the largest size (Makarov 1985, Proc. London Math. Soc. 51, 369, citation from memory)", () => {
    const b = section.bySize[section.bySize.length - 1];
    const iv = intervalEnds(b.informationDimension.interval)!;
    expect(iv[0]).toBeLessThanOrEqual(1);
    expect(iv[1]).toBeGreaterThanOrEqual(1);
  });
});
