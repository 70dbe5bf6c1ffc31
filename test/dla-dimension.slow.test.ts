import { describe, expect, it } from 'vitest';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import { dlaTask, growResult, yieldToRunner } from './support/grow.js';

// Slow statistical check of the physics: the fractal dimension of an
// ensemble of off-lattice 2D DLA clusters, from the radius of gyration
// R_g(N) fitted over the default window, against
//   D = 1.7100 ± 0.0002 (Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299),
// with a tolerance of three bootstrap standard errors of our own estimate
// (the published error is negligible beside ours), and against Kesten's
// bound D >= 3/2 (Kesten 1987, Stoch. Proc. Appl. 25, 165), which the lower
// end of our 95% interval must respect.
const CLUSTERS = 32;
const PARTICLES = 20000;
const PUBLISHED_D = 1.71;

describe('fractal dimension of off-lattice 2D DLA', () => {
  it(`D from R_g(N) of ${CLUSTERS} clusters of ${PARTICLES} agrees with the published value and Kesten's bound`, async () => {
    const runs = [];
    for (let i = 0; i < CLUSTERS; i++) {
      runs.push(growResult(dlaTask(PARTICLES, i, '1710')));
      await yieldToRunner();
    }
    const analysis = analyzeEnsemble(runs, { resamples: 1000, corrections: false });
    const rg = analysis.estimators.radiusOfGyration;
    expect(rg.available).toBe(true);
    expect(rg.interval.status).toBe('ok');
    const D = rg.D as number;
    const se = rg.interval.standardError as number;
    expect(se).toBeGreaterThan(0);
    expect(se).toBeLessThan(0.02); // the ensemble is large enough for the check to mean something
    expect(Math.abs(D - PUBLISHED_D)).toBeLessThan(3 * se);
    const [lo] = rg.interval.bca as [number, number];
    expect(lo).toBeGreaterThan(1.5);
    expect(D).toBeLessThan(2); // D <= d
  });
});
