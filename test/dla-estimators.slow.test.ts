/**
 * A real DLA ensemble of CI size (32 off-lattice clusters of 25000
 * particles, grown by the embedded mode): D from the three estimators of the
 * summary with the library's default windows.
 *
 * Published value: D = 1.7100 ± 0.0002 for 2D off-lattice DLA (Menshutin,
 * Shchur & Vinokur 2008, Physica A 387, 6299), from R_g(N) of very large
 * clusters with corrections to scaling.
 *
 * What we find at this size (seed 1710, deterministic; 95% BCa, 2000 resamples):
 *   D(R_g)   1.715 [1.703, 1.732]  - covers the published value
 *   D(R_max) 1.753 [1.731, 1.777]  - high
 *   D(M(r))  1.675 [1.659, 1.687]  - low (window r = 7.9 .. 79: from R_g at the
 *                                     size window's lower end N = 100 to half
 *                                     the smallest final R_g)
 * R_max is an extreme-value statistic of the rim: its local slopes still
 * swing between 1.70 and 1.79 over N = 10^3..10^4, so it converges more
 * slowly than R_g. M(r) of the final clusters describes the structure laid
 * down while the cluster was small; its local slopes rise with r (about 1.65
 * at r = 5, 1.69 at r = 60..110) and bend down at the growing rim. These are
 * finite-size effects, not faults of the fits, and they shrink slowly: on 16
 * clusters of 200000 particles (same seed, measured with the same code)
 *   D(R_g) 1.725 [1.709, 1.745], D(R_max) 1.765 [1.731, 1.804],
 *   D(M(r)) 1.701 [1.687, 1.716] (r = 22 .. 282),
 * R_g and M(r) now both cover 1.7100 but their paired difference still
 * excludes 0, and M(r)'s local slopes reach 1.71-1.73 only for r > 110.
 * Multiscaling-like drift of this kind is reported for off-lattice DLA below
 * about 10^4 particles and fading only for much larger clusters (Menshutin
 * 2012, Phys. Rev. Lett. 108, 015501). So the test checks R_g against the
 * published value and states the disagreement of the other two as an
 * expected failure (it.fails): if a later change makes the three agree,
 * this test turns red and should become a plain `it`.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import type { EnsembleAnalysis } from '../coordinator/stats/analyze-ensemble.js';
import { analysisOf } from '../coordinator/summary/index.js';

const PUBLISHED_D = 1.71; // Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299: 1.7100 ± 0.0002
let a: EnsembleAnalysis;

beforeAll(async () => {
  const spec = validateSpec({ name: 'dla-estimators', model: 'dla-offlattice-2d', particles: 25000, clusters: 32, seed: 1710, records_per_decade: 20 });
  const o = await runEmbedded(spec, { ensembleId: 'dla-estimators', threads: 2 });
  a = analysisOf(o.summary)!;
}, 180_000);

const iv = (e: { interval: { bca: [number, number] | null; percentile: [number, number] | null } }) => e.interval.bca ?? e.interval.percentile!;

describe('DLA ensemble: three estimators of D (slow)', () => {
  it('D from R_g covers the published off-lattice value; every estimate obeys Kesten and D <= 2', () => {
    const rg = a.estimators.radiusOfGyration;
    expect(a.clusters).toBe(32);
    expect(rg.interval.status).toBe('ok');
    const [lo, hi] = iv(rg);
    expect(lo).toBeLessThanOrEqual(PUBLISHED_D);
    expect(hi).toBeGreaterThanOrEqual(PUBLISHED_D);
    expect(hi - lo).toBeLessThan(0.05);
    for (const e of Object.values(a.estimators)) {
      expect(e.D!).toBeGreaterThan(1.5); // Kesten's bound (from memory: Kesten 1987, D >= 3/2 in 2D)
      expect(e.D!).toBeLessThan(2);
    }
  });

  it('the finite-size drift is visible: R_max sits above R_g and M(r) below, the M(r) local slopes rise through the frozen region', () => {
    const rg = a.estimators.radiusOfGyration.D!;
    expect(a.estimators.maxRadius.D!).toBeGreaterThan(rg);
    expect(a.estimators.massRadius.D!).toBeLessThan(rg);
    const pts = a.estimators.massRadius.localSlopes!.points.filter((p) => p.D !== null);
    const near = (r: number) => pts.reduce((b, p) => (Math.abs(Math.log(p.at / r)) < Math.abs(Math.log(b.at / r)) ? p : b));
    expect(near(60).D!).toBeGreaterThan(near(8).D!);
  });

  // Known disagreement at CI sizes (see the header): expected to fail until the estimators agree.
  it.fails('all three estimators agree within their intervals (paired differences contain 0)', () => {
    for (const p of a.consistency.pairs) expect(p.agree, `${p.a} vs ${p.b}: difference ${p.difference}`).toBe(true);
  });
});
