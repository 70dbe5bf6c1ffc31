/**
 * A real DLA ensemble of a size that fits CI (16 off-lattice clusters of
 * 10^6 particles, grown by the embedded mode on two threads, about 1.5
 * minutes here): D from the three estimators of the summary with the
 * library's default windows.
 *
 * Published value: D = 1.7100 ± 0.0002 for 2D off-lattice DLA (Menshutin,
 * Shchur & Vinokur 2008, Physica A 387, 6299), from R_g(N) of very large
 * clusters with corrections to scaling.
 *
 * Why this size. The effective dimension of DLA drifts with N: local slopes
 * of R_g(N) wander between 1.57 and 1.75 below N ≈ 10^4 and settle near 1.71
 * only above N ≈ 10^5; seed-centred M(r) describes the cluster's earlier
 * stages (local slopes 1.63-1.66 for r < 30, 1.70-1.71 for r > 100); the rim
 * statistic R_max converges slowest (drift of this kind is reported for
 * off-lattice DLA below about 10^4 particles: Menshutin 2012, Phys. Rev.
 * Lett. 108, 015501). Measured with seed 1710 (95% BCa, 2000 resamples,
 * engine tendril-engine/2):
 *   32 × 25000, default windows (the last 1.5 decades of N; r from R_g at the
 *     window's lower end to half the final R_g): the three disagree
 *     (R_g 1.721 [1.711, 1.733], R_max 1.773 [1.741, 1.807], M(r) 1.681
 *     [1.660, 1.697]; paired differences exclude 0);
 *   16 × 10^6 with the older 2.5-decade window (engine 1): R_g 1.719
 *     [1.711, 1.729] misses 1.7100 and the pairs disagree — the window
 *     reached into the small-N drift, which is why the default is now 1.5
 *     decades;
 *   16 × 10^6, default windows (this test): R_g 1.707 [1.694, 1.719],
 *     R_max 1.718 [1.687, 1.746], M(r) 1.694 [1.675, 1.710]; every paired
 *     difference contains 0 (R_g − M(r): 0.013 [−0.004, 0.037]).
 * The statistical intervals do not include the remaining systematic drift,
 * so the checks below are meaningful only at sizes where the local slopes
 * have settled; the local-slope test shows that they have.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import type { EnsembleAnalysis } from '../coordinator/stats/analyze-ensemble.js';
import { analysisOf } from '../coordinator/summary/index.js';

const PUBLISHED_D = 1.71; // Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299: 1.7100 ± 0.0002
const CLUSTERS = 16;
const PARTICLES = 1_000_000;
let a: EnsembleAnalysis;

beforeAll(async () => {
  const spec = validateSpec({ name: 'dla-estimators', model: 'dla-offlattice-2d', particles: PARTICLES, clusters: CLUSTERS, seed: 1710, records_per_decade: 20 }, { maxTotalParticles: 1e8 });
  const o = await runEmbedded(spec, { ensembleId: 'dla-estimators', threads: 2 });
  a = analysisOf(o.summary)!;
});

const iv = (e: { interval: { bca: [number, number] | null; percentile: [number, number] | null } }) => e.interval.bca ?? e.interval.percentile!;

describe('DLA ensemble: three estimators of D (slow)', () => {
  it('D from R_g covers the published off-lattice value; every estimate obeys Kesten and D <= 2', () => {
    const rg = a.estimators.radiusOfGyration;
    expect(a.clusters).toBe(CLUSTERS);
    expect(rg.interval.status).toBe('ok');
    const [lo, hi] = iv(rg);
    expect(lo).toBeLessThanOrEqual(PUBLISHED_D);
    expect(hi).toBeGreaterThanOrEqual(PUBLISHED_D);
    expect(hi - lo).toBeLessThan(0.05);
    for (const e of Object.values(a.estimators)) {
      expect(e.D!).toBeGreaterThan(1.5); // Kesten's bound (Kesten 1987, Stoch. Proc. Appl. 25, 165: D >= 3/2 in 2D)
      expect(e.D!).toBeLessThan(2);
    }
  });

  it('the local slopes have settled inside the fit windows: every window point within 0.03 of the fitted D (our rule, no source)', () => {
    for (const name of ['radiusOfGyration', 'massRadius'] as const) {
      const e = a.estimators[name];
      const w = e.fitWindow!;
      const inside = e.localSlopes!.points.filter((p) => p.D !== null && p.at >= w.firstUsed! && p.at <= w.lastUsed!);
      expect(inside.length, name).toBeGreaterThan(3);
      for (const p of inside) expect(Math.abs(p.D! - e.D!), `${name} at ${p.at}`).toBeLessThan(0.03);
    }
  });

  it('all three estimators agree within their intervals (paired differences contain 0) and the panel says so', () => {
    expect(a.consistency.pairs.length).toBe(3);
    for (const p of a.consistency.pairs) expect(p.agree, `${p.a} vs ${p.b}: difference ${p.difference}`).toBe(true);
  });
});
