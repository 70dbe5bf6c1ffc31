/**
 * Statistical checks of the off-lattice DBM(η) growth rule
 * (worker/models/dbm-offlattice-2d/kernel.ts):
 *  - selection frequencies on a fixed cluster equal ω_i^η / Σ ω^η, with ω
 *    measured by independent walkers (exact, by the definition of the model;
 *    chi-square at level 0.001);
 *  - the fractional-power machinery (Bernoulli factory, η = 1.999) against
 *    the exact integer method (η = 2), and the capped recurrence estimator
 *    (η = 0.999, and its default cap through the chi-square above) against
 *    DLA: same R_g distribution at fixed N (two-sample Kolmogorov–Smirnov,
 *    level 0.001; Kolmogorov 1933, Smirnov 1948, citation from memory);
 *    the same test separates η = 2 from η = 1, so it can fail.
 * About 3 minutes on one idle core.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { GrowthTask } from '../worker/core/growth-kernel.js';
import { OffLatticeDbm2d } from '../worker/models/dbm-offlattice-2d/kernel.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { ksTwoSample } from './support/ks.js';
import { growInThreads } from './support/grow-in-thread.js';

/** Let the test runner's event loop breathe (a long synchronous stretch makes vitest's worker time out). */
const breathe = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

/** Tasks of the exact method for η > 1 (params.method = 0; the history method has its own checks in test/dbm-offlattice-history.slow.test.ts). */
function task(params: Record<string, number>, particles: number, runIndex = 0, seed = '20261203'): GrowthTask {
  return { model: modelParams('dbm-offlattice-2d', { method: 0, ...params }), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 };
}

async function finalRgs(tasks: GrowthTask[]): Promise<number[]> {
  return (await growInThreads(tasks)).map((r) => r.series.radiusOfGyration.at(-1) as number);
}

describe('selection frequencies on a fixed cluster', () => {
  // The cluster: 25 particles grown as DLA, then frozen; kernels for other η
  // continue from its checkpoint with only η changed.
  const grower = createKernel(task({ eta: 1 }, 400));
  grower.growTo(25);
  const cp = grower.checkpoint();

  function frozen(eta: number, runIndex: number): OffLatticeDbm2d {
    const t = { ...task({ eta }, 400, runIndex) };
    return new OffLatticeDbm2d(t, { ...cp, task: structuredClone(t) });
  }

  // ω_i from independent DLA walkers (η = 1 samples ω exactly)
  const omegaWalkers = 100_000;
  const hits = new Float64Array(25);
  beforeAll(async () => {
    const probe = frozen(1, 7);
    for (let s = 0; s < omegaWalkers; s++) {
      hits[probe.sampleGrowthParticle()]++;
      if (s % 2000 === 0) await breathe();
    }
  }, 400_000);

  for (const [eta, selections] of [
    [2, 8_000],
    [2.5, 8_000],
    [0.5, 5_000],
  ] as const) {
    it(`at η = ${eta} particle i is chosen with probability ω_i^η / Σ ω^η (chi-square, level 0.001)`, async () => {
      const k = frozen(eta, 11);
      const chosen = new Float64Array(25);
      for (let s = 0; s < selections; s++) {
        chosen[k.sampleGrowthParticle()]++;
        if (s % 100 === 0) await breathe();
      }
      const omega = Array.from(hits, (h) => h / omegaWalkers);
      const weights = omega.map((w) => (w > 0 ? w ** eta : 0));
      const total = weights.reduce((a, b) => a + b, 0);
      // chi-square with the variance of both samples (delta method for the
      // ω estimate; cells with expected share above 0.5%), compared with the
      // 0.999 quantile of chi-square with as many degrees of freedom as cells
      // (conservative: the cells sum to one). Common practice, no source.
      let chi2 = 0;
      let cells = 0;
      for (let i = 0; i < 25; i++) {
        const p = weights[i] / total;
        if (p < 0.005) continue;
        const observed = chosen[i] / selections;
        const variance = (p * (1 - p)) / selections + (eta * p) ** 2 * (1 - omega[i]) / (omegaWalkers * omega[i]);
        chi2 += (observed - p) ** 2 / variance;
        cells++;
      }
      // Wilson–Hilferty approximation of the chi-square quantile (z = 3.09 for 0.999)
      const z = 3.09;
      const quantile = cells * (1 - 2 / (9 * cells) + z * Math.sqrt(2 / (9 * cells))) ** 3;
      expect(cells).toBeGreaterThan(3);
      expect(chi2).toBeLessThan(quantile);
    }, 400_000);
  }
});

describe('the fractional-power methods against the exact ones (R_g at fixed N, two-sample KS, level 0.001)', () => {
  const N = 150;
  const runs = 60;
  const runIdx = Array.from({ length: runs }, (_, r) => r);
  it('η = 1.999 (Bernoulli factory for ω^0.999) and η = 2 (two walkers in a row) agree', async () => {
    const a = await finalRgs(runIdx.map((r) => task({ eta: 1.999 }, N, r, '31')));
    const b = await finalRgs(runIdx.map((r) => task({ eta: 2 }, N, r, '32')));
    expect(ksTwoSample(a, b).p).toBeGreaterThan(0.001);
  }, 400_000);

  it('η = 0.999 (capped recurrence estimator) and η = 1 (DLA) agree', async () => {
    const a = await finalRgs(runIdx.map((r) => task({ eta: 0.999, recurrence_cap: 64 }, N, r, '33')));
    const b = await finalRgs(runIdx.map((r) => ({ ...task({}, N, r, '34'), model: modelParams('dla-offlattice-2d') })));
    expect(ksTwoSample(a, b).p).toBeGreaterThan(0.001);
  }, 400_000);

  it('the same test separates η = 2 from η = 1 (it can fail)', async () => {
    const a = await finalRgs(runIdx.map((r) => task({ eta: 2 }, N, r, '35')));
    const b = await finalRgs(runIdx.map((r) => task({ eta: 1 }, N, r, '36')));
    expect(ksTwoSample(a, b).p).toBeLessThan(0.001);
  }, 400_000);
});

