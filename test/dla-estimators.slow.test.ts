/**
 * A real DLA ensemble of CI size (32 off-lattice clusters of 25000
 * particles, grown by the embedded mode): D from the three estimators of the
 * summary with the library's default windows.
 *
 * Published value: D = 1.7100 ± 0.0002 for 2D off-lattice DLA (Menshutin,
 * Shchur & Vinokur 2008, Physica A 387, 6299), from R_g(N) of very large
 * clusters with corrections to scaling.
 *
 * What we find at this size (seed 1710, deterministic):
 *   D(R_g)   1.715 [1.703, 1.732]  - covers the published value (95% BCa, 2000 resamples)
 *   D(R_max) 1.753 [1.731, 1.777]  - high; its corrections fit 1.758 [1.728, 1.924]
 *   D(M(r))  1.669 [1.654, 1.684]  - low, whatever window inside the frozen
 *                                     region (r from 5 or 10 to R_g/4 .. R_g/2
 *                                     all give 1.66-1.67)
 * R_max is an extreme-value statistic of the rim: its local slopes still
 * swing between 1.70 and 1.79 over N = 10^3..10^4, so it converges more
 * slowly than R_g. M(r) of the final clusters probes scales r = 5..90, i.e.
 * the structure laid down while the cluster was small; its local slopes rise
 * with r (about 1.65 at r = 5, 1.69 at r = 60..110) and bend down at the
 * growing rim (r > 0.7 R_g). Both are finite-size effects, not faults of the
 * fits; they disappear only for much larger clusters. So the test checks
 * R_g against the published value and states the disagreement of the other
 * two as an expected failure (it.fails): if a later change makes the three
 * agree, this test turns red and should become a plain `it`.
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
