import { describe, expect, it } from 'vitest';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import { syntheticEnsemble } from '../coordinator/stats/synthetic-ensemble.js';
import { yieldToRunner } from './support/grow.js';

// Coverage of nominal 95% bootstrap intervals (percentile and BCa) on
// synthetic ensembles with a known exponent. Each cluster is a power law with
// multiplicative, size-correlated noise (a random walk in log N plus a
// per-cluster offset; coordinator/stats/synthetic-ensemble.ts), so the true D
// is known exactly. This tests the statistics, not the physics.
//
// Expected coverage: the cluster bootstrap of a mean of K i.i.d. per-cluster
// slopes has coverage about P(|t_{K-1}| < 1.96 sqrt((K-1)/K)), i.e. ~0.94 for
// K = 40 (Efron & Tibshirani 1993, An Introduction to the Bootstrap, ch. 13:
// bootstrap intervals are slightly narrow in small samples). The brief's
// tolerance 95% +- 2.5% is, with 2000 replicates, about 5 binomial
// standard deviations (sqrt(0.95 * 0.05 / 2000) = 0.0049).

describe('bootstrap interval coverage on synthetic power laws', () => {
  it('95% percentile and BCa intervals cover the true D in 95% +- 2.5% of 2000 ensembles, for all three estimators', async () => {
    const replicates = 2000;
    const K = 40;
    const D = 1.71;
    const sizes = Array.from({ length: 15 }, (_, i) => Math.round(1000 * Math.pow(10, i / 20)));
    const radii = Array.from({ length: 15 }, (_, i) => 5 * Math.pow(10, i / 20));
    const names = ['radiusOfGyration', 'maxRadius', 'massRadius'] as const;
    const cover = { percentile: { radiusOfGyration: 0, maxRadius: 0, massRadius: 0 }, bca: { radiusOfGyration: 0, maxRadius: 0, massRadius: 0 } };
    let failed = 0;
    for (let rep = 0; rep < replicates; rep++) {
      // let the runner report between chunks: 2000 analyses in one synchronous stretch would block its worker
      if (rep % 25 === 0) await yieldToRunner();
      const runs = syntheticEnsemble({ clusters: K, sizes, radii, dimension: D, seed: 1000 + rep, walkSigma: 0.08, offsetSigma: 0.05 });
      const a = analyzeEnsemble(runs, {
        resamples: 500, seed: rep, localSlopes: false, corrections: false,
        massRadiusWindow: { minRadius: 5, maxRadius: 30 },
      });
      for (const n of names) {
        const iv = a.estimators[n].interval;
        if (iv.status !== 'ok' || !iv.percentile || !iv.bca) { failed++; continue; }
        if (iv.percentile[0] <= D && D <= iv.percentile[1]) cover.percentile[n]++;
        if (iv.bca[0] <= D && D <= iv.bca[1]) cover.bca[n]++;
      }
    }
    expect(failed).toBe(0);
    const summary: string[] = [];
    for (const kind of ['percentile', 'bca'] as const) {
      for (const n of names) {
        const c = cover[kind][n] / replicates;
        summary.push(`${kind}/${n}: ${c.toFixed(3)}`);
        expect(c, `${kind} coverage for ${n}`).toBeGreaterThanOrEqual(0.925);
        expect(c, `${kind} coverage for ${n}`).toBeLessThanOrEqual(0.975);
      }
    }
    console.log(`coverage (nominal 0.95): ${summary.join(', ')}`);
  });
});
