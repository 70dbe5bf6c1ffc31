/**
 * Harmonic measure of large DLA clusters through the whole ensemble path
 * (spec with [probe], embedded mode, summary): 8 off-lattice clusters of
 * 10^6 particles, each probed with 10^6 walkers in 4 seeded jobs at its
 * final size (about two minutes on two cores). At these sizes the box-fit
 * exponents, which are not converged on 4000-particle clusters
 * (test/harmonic-growth.slow.test.ts), reach the values of the theory:
 *
 *  - τ(1) = 0 (normalisation Σ μ = 1): exact up to rounding;
 *  - τ(3) = D, the electrostatic scaling law (Halsey 1987, Phys. Rev. Lett.
 *    59, 2067; citation from memory): the box-fit τ(3) interval overlaps the
 *    interval of D from R_g(N) of the same clusters;
 *  - τ′(1) = 1 (Makarov 1985, Proc. London Math. Soc. 51, 369; citation from
 *    memory): measured 1.005 [1.002, 1.010] here and 0.994 [0.989, 0.999] on
 *    the first 10^5 particles of the same clusters — within 0.6% of 1, but the box fit's finite-window bias
 *    changes sign between these sizes and exceeds the small statistical
 *    error, so the strict check is recorded as an expected failure; with
 *    the fit-window systematic (half the difference of the fits over the
 *    two halves of the ε window, about 0.02 here) 1 is inside;
 *  - Beurling: the maximum-concentration exponent is at least 1/2 (Garnett
 *    & Marshall 2005, Harmonic Measure).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import type { HarmonicAtSize, HarmonicSection } from '../coordinator/harmonic/harmonic-section-types.js';
import { validateSpec } from '../coordinator/spec/index.js';
import type { EnsembleAnalysis } from '../coordinator/stats/analyze-ensemble.js';
import { analysisOf, harmonicOfSummary } from '../coordinator/summary/index.js';

let a: EnsembleAnalysis;
let h: HarmonicSection;
let top: HarmonicAtSize;

beforeAll(async () => {
  const spec = validateSpec(
    { name: 'harmonic-large', model: 'dla-offlattice-2d', particles: 1_000_000, clusters: 8, seed: 2718, records_per_decade: 20, probe: { walkers: 1_000_000, jobs: 4, q: [0, 1, 2, 3, 4] } },
    { maxTotalParticles: 1e8 },
  );
  const o = await runEmbedded(spec, { ensembleId: 'harmonic-large', threads: 2 });
  a = analysisOf(o.summary)!;
  h = harmonicOfSummary(o.summary)!;
  top = h.bySize[h.bySize.length - 1];
});

const ends = (iv: { bca: [number, number] | null; percentile: [number, number] | null } | null | undefined) => (iv ? iv.bca ?? iv.percentile : null);

describe('harmonic measure of 10^6-particle DLA clusters (slow)', () => {
  it('probes every cluster once at its final size; tau(1) = 0 and Beurling hold', () => {
    expect(top.size).toBe(1_000_000);
    expect(top.clusters).toBe(8);
    expect(h.perCluster!.length).toBe(8);
    expect(Math.abs(top.tau[top.q.indexOf(1)].mean)).toBeLessThan(1e-9);
    expect(top.beurlingRespected).toBe(true);
  });

  it('box-fit tau(3) is consistent with D from R_g of the same clusters (electrostatic scaling law)', () => {
    const t3 = ends(top.tau3!.interval)!;
    const d = ends(a.estimators.radiusOfGyration.interval)!;
    expect(t3[1] - t3[0]).toBeLessThan(0.06);
    expect(t3[0]).toBeLessThanOrEqual(d[1]);
    expect(d[0]).toBeLessThanOrEqual(t3[1]);
    expect(h.electrostatic.consistent).toBe(true);
  });

  it("tau'(1) = 1 and tau(3) = D hold within the statistical interval widened by the fit-window systematic (probe-analysis.ts)", () => {
    const ws = top.informationDimensionWithSystematic!;
    expect(top.systematic.informationDimension!).toBeGreaterThan(0);
    expect(top.systematic.informationDimension!).toBeLessThan(0.05);
    expect(ws[0]).toBeLessThanOrEqual(1);
    expect(ws[1]).toBeGreaterThanOrEqual(1);
    expect(h.electrostatic.consistentWithSystematic).toBe(true);
  });

  // Expected failure, measured (see the header): 1.005 [1.002, 1.010]; the bias of the box fit
  // is larger than its statistical error at this size. If a change makes this pass, make it `it`.
  it.fails("tau'(1) interval contains 1 (Makarov 1985)", () => {
    const iv = ends(top.informationDimension.interval)!;
    expect(iv[0]).toBeLessThanOrEqual(1);
    expect(iv[1]).toBeGreaterThanOrEqual(1);
  });
});
