/**
 * Off-lattice DBM(η) in the plane (worker/models/dbm-offlattice-2d/kernel.ts):
 *  - η = 1 is tendril's off-lattice DLA: the same walk, the same random
 *    draws, so the same state hashes (exact, by the definition);
 *  - selection frequencies on a fixed cluster equal ω_i^η / Σ ω^η, with ω
 *    measured by independent walkers (exact, by the definition; chi-square
 *    at the stated level);
 *  - the fractional-power machinery (Bernoulli factory, η = 1.999) against
 *    the exact integer method (η = 2), and the capped recurrence estimator
 *    (η = 0.999) against DLA: same R_g distribution at fixed N (two-sample
 *    Kolmogorov–Smirnov, level 0.001);
 *  - geometry invariants, determinism under chunking, resume from
 *    checkpoints and after a stop, one-line refusal of η outside [0, 6].
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { GrowthTask } from '../worker/core/growth-kernel.js';
import { createStopSignal, raiseStop } from '../worker/core/stop-signal.js';
import { OffLatticeDbm2d } from '../worker/models/dbm-offlattice-2d/kernel.js';
import { checkModelParams, createKernel, modelParams } from '../worker/models/registry.js';
import { ksTwoSample } from './support/ks.js';

function task(params: Record<string, number>, particles: number, runIndex = 0, seed = '20261203'): GrowthTask {
  return { model: modelParams('dbm-offlattice-2d', params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 };
}

function finalRg(t: GrowthTask): number {
  const k = createKernel(t);
  k.growTo(t.particles);
  return k.result().series.radiusOfGyration.at(-1) as number;
}

describe('dbm-offlattice-2d at η = 1 is off-lattice DLA', () => {
  it('gives the state hashes of dla-offlattice-2d for the same task (exact: the same walk and draws)', () => {
    for (const runIndex of [0, 1, 2]) {
      const dbm = createKernel(task({ eta: 1 }, 500, runIndex));
      dbm.growTo(500);
      const dla = createKernel({ ...task({}, 500, runIndex), model: modelParams('dla-offlattice-2d') });
      dla.growTo(500);
      expect(dbm.result().stateHash).toBe(dla.result().stateHash);
      expect(dbm.result().counters.walkers).toBe(499);
    }
  });
});

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
  const omegaWalkers = 200_000;
  const hits = new Float64Array(25);
  beforeAll(() => {
    const probe = frozen(1, 7);
    for (let s = 0; s < omegaWalkers; s++) hits[probe.sampleGrowthParticle()]++;
  }, 60_000);

  for (const [eta, selections] of [
    [2, 20_000],
    [2.5, 20_000],
    [0.5, 12_000],
  ] as const) {
    it(`at η = ${eta} particle i is chosen with probability ω_i^η / Σ ω^η (chi-square, level 0.001)`, () => {
      const k = frozen(eta, 11);
      const chosen = new Float64Array(25);
      for (let s = 0; s < selections; s++) chosen[k.sampleGrowthParticle()]++;
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
    }, 120_000);
  }
});

describe('the fractional-power methods against the exact ones (R_g at fixed N, two-sample KS, level 0.001)', () => {
  const N = 150;
  const runs = 60;
  it('η = 1.999 (Bernoulli factory for ω^0.999) and η = 2 (two walkers in a row) agree', () => {
    const a: number[] = [];
    const b: number[] = [];
    for (let r = 0; r < runs; r++) {
      a.push(finalRg(task({ eta: 1.999 }, N, r, '31')));
      b.push(finalRg(task({ eta: 2 }, N, r, '32')));
    }
    expect(ksTwoSample(a, b).p).toBeGreaterThan(0.001);
  }, 240_000);

  it('η = 0.999 (capped recurrence estimator) and η = 1 (DLA) agree', () => {
    const a: number[] = [];
    const b: number[] = [];
    for (let r = 0; r < runs; r++) {
      a.push(finalRg(task({ eta: 0.999, recurrence_cap: 64 }, N, r, '33')));
      b.push(finalRg({ ...task({}, N, r, '34'), model: modelParams('dla-offlattice-2d') }));
    }
    expect(ksTwoSample(a, b).p).toBeGreaterThan(0.001);
  }, 240_000);

  it('the same test separates η = 2 from η = 1 (it can fail)', () => {
    const a: number[] = [];
    const b: number[] = [];
    for (let r = 0; r < runs; r++) {
      a.push(finalRg(task({ eta: 2 }, N, r, '35')));
      b.push(finalRg(task({ eta: 1 }, N, r, '36')));
    }
    expect(ksTwoSample(a, b).p).toBeLessThan(0.001);
  }, 240_000);
});

describe('geometry, determinism, resume, refusals', () => {
  for (const eta of [0, 0.5, 2, 3]) {
    it(`at η = ${eta} every new disk touches an earlier one and overlaps none`, () => {
      const n = 200;
      const k = createKernel(task({ eta, recurrence_cap: 128 }, n, 4));
      k.growTo(n);
      const xy = k.positions().coords;
      for (let i = 1; i < n; i++) {
        let nearest = Infinity;
        for (let j = 0; j < i; j++) nearest = Math.min(nearest, Math.hypot(xy[2 * i] - xy[2 * j], xy[2 * i + 1] - xy[2 * j + 1]));
        expect(Math.abs(nearest - 1)).toBeLessThan(1e-9);
      }
    }, 60_000);
  }

  for (const eta of [0.5, 2.5]) {
    it(`at η = ${eta} chunks, checkpoints and an interrupted particle all give the uninterrupted final state`, () => {
      const n = 120;
      const t = task({ eta, recurrence_cap: 64 }, n, 9);
      const whole = createKernel(t);
      whole.growTo(n);
      const want = whole.result();

      const chunked = createKernel(t);
      for (let m = 7; m < n; m += 13) {
        chunked.growTo(m);
        const resumed = createKernel(t, structuredClone(chunked.checkpoint()));
        expect(resumed.count).toBe(chunked.count);
      }
      chunked.growTo(n);
      expect(chunked.result().stateHash).toBe(want.stateHash);
      expect(chunked.result().counters).toEqual(want.counters);

      // a raised stop abandons the particle in progress and leaves the state
      // of the last whole particle; continuing gives the same end
      const stopped = createKernel(t);
      stopped.growTo(40);
      const before = stopped.checkpoint();
      const signal = createStopSignal();
      raiseStop(signal);
      stopped.growTo(n, signal);
      const resumed = createKernel(t, stopped.checkpoint());
      expect(resumed.count).toBeGreaterThanOrEqual(before.count);
      resumed.growTo(n);
      expect(resumed.result().stateHash).toBe(want.stateHash);
      expect(resumed.result().counters).toEqual(want.counters);
    }, 60_000);
  }

  it('refuses η outside [0, 6] in one line naming params.eta and the range', () => {
    for (const eta of [-0.5, 6.5, Number.NaN]) {
      let message = '';
      try {
        checkModelParams(modelParams('dbm-offlattice-2d', { eta }));
      } catch (e) {
        message = (e as Error).message;
      }
      expect(message).toMatch(/^params\.eta: .* (is out of range|is not a finite number); allowed: a number from 0 to 6/);
      expect(message).not.toContain('\n');
    }
  });
});
