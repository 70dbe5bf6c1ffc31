/**
 * Off-lattice DBM(η) in the plane (worker/models/dbm-offlattice-2d/kernel.ts):
 *  - η = 1 is tendril's off-lattice DLA: the same walk, the same random
 *    draws, so the same state hashes (exact, by the definition);
 *  (the statistical checks of the growth rule are in
 *  test/dbm-offlattice-statistics.slow.test.ts);
 *  - geometry invariants, determinism under chunking, resume from
 *    checkpoints and after a stop, one-line refusal of η outside [0, 6].
 */
import { describe, expect, it } from 'vitest';
import type { GrowthTask } from '../worker/core/growth-kernel.js';
import { createStopSignal, raiseStop, WalkerStuck } from '../worker/core/stop-signal.js';
import { OffLatticeDbm2d } from '../worker/models/dbm-offlattice-2d/kernel.js';
import { checkModelParams, createKernel, modelParams } from '../worker/models/registry.js';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { harmonicOfSummary } from '../coordinator/summary/index.js';

function task(params: Record<string, number>, particles: number, runIndex = 0, seed = '20261203'): GrowthTask {
  return { model: modelParams('dbm-offlattice-2d', params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 };
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

describe('a breakdown-model particle that makes no progress fails its run', () => {
  it('min_step 1e-300 (below the float spacing) throws WalkerStuck naming min_step and η (the stuck check of the shared walk, counted over all walkers of the particle)', () => {
    // built directly, past the registry's floor on min_step, as a task from an older coordinator could be
    const k = new OffLatticeDbm2d(task({ eta: 2, min_step: 1e-300 }, 200, 1), undefined, { maxStepsPerParticle: 2_000_000 });
    let err: unknown;
    try {
      k.growTo(200);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(WalkerStuck);
    expect((err as Error).message).toMatch(/^run 1: the walker of particle \d+ made no progress in \d+ steps at radius [\d.e+-]+ \(params\.min_step = 1e-300 is too small for the float spacing there, or params\.eta = 2 makes acceptance too rare\)$/);
    expect(k.count).toBeLessThan(200);
  }, 120_000);
});

describe('geometry, determinism, resume, refusals', () => {
  for (const eta of [0, 0.5, 2, 2.5]) {
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

  for (const [eta, method] of [[0.5, 0], [2.5, 0], [2.5, 1], [4, 1]]) {
    it(`at η = ${eta}${eta > 1 ? `, method ${method}` : ''} chunks, checkpoints and an interrupted particle all give the uninterrupted final state`, () => {
      const n = method === 1 ? 80 : 120;
      const t = task({ eta, recurrence_cap: 64, method }, n, 9);
      const whole = createKernel(t);
      whole.growTo(n);
      const want = whole.result();

      // the same seed gives the same bits
      const again = createKernel(t);
      again.growTo(n);
      expect(again.result().stateHash).toBe(want.stateHash);

      // a resumed kernel (with the history method: the hit history restored
      // from modelState) continues exactly as the one it was taken from
      const chunked = createKernel(t);
      for (let m = 7; m < n; m += 13) {
        chunked.growTo(m);
        const resumed = createKernel(t, structuredClone(chunked.checkpoint()));
        expect(resumed.count).toBe(chunked.count);
        expect((resumed as OffLatticeDbm2d).stateHash()).toBe((chunked as OffLatticeDbm2d).stateHash());
        if (m === 46) {
          resumed.growTo(n);
          expect(resumed.result().stateHash).toBe(want.stateHash);
        }
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

  it('with the history method the checkpoint carries the hit history; a checkpoint without it is refused in one line', () => {
    const t = task({ eta: 2, method: 1 }, 100, 3);
    const k = createKernel(t);
    k.growTo(50);
    const cp = k.checkpoint();
    expect(cp.modelState.length).toBeGreaterThan(0);
    expect(createKernel(task({ eta: 2, method: 0 }, 100, 3)).checkpoint().modelState.length).toBe(0);
    let message = '';
    try {
      createKernel(t, { ...cp, modelState: new Uint8Array(0) });
    } catch (e) {
      message = (e as Error).message;
    }
    expect(message).toMatch(/^checkpoint modelState must hold the hit history of 50 particles/);
    expect(message).not.toContain('\n');
  });

  it('the history method changes η = 2 trajectories, and η = 1 ignores the method (DLA hashes either way)', () => {
    const a = createKernel(task({ eta: 2, method: 0 }, 150, 2));
    const b = createKernel(task({ eta: 2, method: 1 }, 150, 2));
    a.growTo(150);
    b.growTo(150);
    expect(a.result().stateHash).not.toBe(b.result().stateHash);
    expect(b.result().counters.attempts).toBeGreaterThanOrEqual(149);
    const one = createKernel(task({ eta: 1, method: 1 }, 300, 2));
    one.growTo(300);
    const dla = createKernel({ ...task({}, 300, 2), model: modelParams('dla-offlattice-2d') });
    dla.growTo(300);
    expect(one.result().stateHash).toBe(dla.result().stateHash);
  });

  it('refuses a bad method, history_extra_gaps or history_headroom in one line naming the field and the range', () => {
    for (const [params, pattern] of [
      [{ method: 2 }, /^params\.method: 2 is out of range; allowed: an integer from 0 to 1/],
      [{ history_extra_gaps: 1.5 }, /^params\.history_extra_gaps: 1\.5 /],
      [{ history_headroom: 0.5 }, /^params\.history_headroom: 0\.5 is out of range; allowed: a number from 1 to/],
    ] as const) {
      let message = '';
      try {
        checkModelParams(modelParams('dbm-offlattice-2d', params));
      } catch (e) {
        message = (e as Error).message;
      }
      expect(message).toMatch(pattern);
      expect(message).not.toContain('\n');
    }
  });

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

describe('embedded ensemble with [probe]', () => {
  it('records Z(η) and Z(η + 2) per probed cluster and puts harmonic.breakdownRelation, with its rules, in the summary', async () => {
    const spec = validateSpec({
      name: 'dbm probe test', model: 'dbm-offlattice-2d', params: { eta: 2 }, particles: 240, clusters: 3, seed: '4242',
      probe: { walkers: 2000, jobs: 2, at_sizes: [60, 120] },
    });
    const out = await runEmbedded(spec, { ensembleId: 'dbm-probe', threads: 2 });
    expect(out.harmonic.length).toBe(9);
    for (const r of out.harmonic) {
      expect(r.breakdown?.eta).toBe(2);
      expect(r.breakdown?.zEta).toBeGreaterThan(0);
      expect(r.breakdown!.zEtaPlus2!).toBeLessThan(r.breakdown!.zEta!);
    }
    const h = harmonicOfSummary(out.summary)!;
    const b = h.breakdownRelation!;
    expect(b.eta).toBe(2);
    expect(b.sizes).toEqual([60, 120, 240]);
    expect(b.clusters).toBe(3);
    expect(b.tauDifference.estimate).toEqual(expect.any(Number));
    expect(['consistent', 'inconsistent', 'undetermined']).toContain(b.verdict);
    expect(b.rule).toMatch(/intervals overlap/);
    expect(b.capacityIncrement.rule).toMatch(/contains 1/);
  }, 300_000);
});
