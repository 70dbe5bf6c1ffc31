/**
 * D(η) of the off-lattice DBM at small sizes (worker/models/dbm-offlattice-2d):
 *  - D decreases with η: D(0.5) > D(1) > D(2), each difference more than
 *    two standard errors above 0 (the sparser-with-η trend of the model,
 *    Niemeyer, Pietronero & Wiesmann 1984, Phys. Rev. Lett. 52, 1033);
 *  - D lies above the lower bound (4 − η)/2 within error for η = 0.5 and 1
 *    (proven on the square lattice for 0 <= η < 2: Losev & Smirnov 2023,
 *    arXiv 2307.14931; used here as the expected side for the disks too):
 *    D + 2 standard errors >= (4 − η)/2.
 * D per cluster is 1/slope of log R_g against log N over the record sizes
 * from 50 to N (R_g ∝ N^(1/D)); the ensemble value is the mean of the
 * per-cluster D with its standard error (common practice, no source).
 * Small sizes: finite-size drift moves these D by a few hundredths (the DLA
 * descriptor's finite-size note), not enough to reverse a step of about 0.1.
 * About 2 minutes on one idle core.
 */
import { describe, expect, it } from 'vitest';
import { fitLine } from '../coordinator/stats/log-log-fit.js';
import { modelParams } from '../worker/models/registry.js';
import { growInThreads } from './support/grow-in-thread.js';

const N = 500;
const CLUSTERS = 16;

async function dimensionOf(eta: number): Promise<{ mean: number; se: number }> {
  const d: number[] = [];
  const tasks = Array.from({ length: CLUSTERS }, (_, r) => ({ model: modelParams('dbm-offlattice-2d', { eta }), particles: N, ensembleSeed: '7013', runIndex: r, recordsPerDecade: 20 }));
  for (const result of await growInThreads(tasks)) {
    const s = result.series;
    const lx: number[] = [];
    const ly: number[] = [];
    s.sizes.forEach((n, j) => {
      if (n >= 50) {
        lx.push(Math.log(n));
        ly.push(Math.log(s.radiusOfGyration[j]));
      }
    });
    d.push(1 / fitLine(lx, ly).slope);
  }
  const mean = d.reduce((a, b) => a + b, 0) / d.length;
  const sd = Math.sqrt(d.reduce((a, b) => a + (b - mean) ** 2, 0) / (d.length - 1));
  return { mean, se: sd / Math.sqrt(d.length) };
}

describe('D(η) of the off-lattice DBM', () => {
  it('decreases with η and lies above (4 − η)/2 for η = 0.5 and 1 within two standard errors', async () => {
    const d05 = await dimensionOf(0.5);
    const d1 = await dimensionOf(1);
    const d2 = await dimensionOf(2);
    console.log(`D(0.5) = ${d05.mean.toFixed(3)} ± ${d05.se.toFixed(3)}, D(1) = ${d1.mean.toFixed(3)} ± ${d1.se.toFixed(3)}, D(2) = ${d2.mean.toFixed(3)} ± ${d2.se.toFixed(3)} (N = ${N}, ${CLUSTERS} clusters)`);
    expect(d05.mean - d1.mean).toBeGreaterThan(2 * Math.hypot(d05.se, d1.se));
    expect(d1.mean - d2.mean).toBeGreaterThan(2 * Math.hypot(d1.se, d2.se));
    expect(d05.mean + 2 * d05.se).toBeGreaterThanOrEqual((4 - 0.5) / 2);
    expect(d1.mean + 2 * d1.se).toBeGreaterThanOrEqual((4 - 1) / 2);
  }, 1_200_000);
});
