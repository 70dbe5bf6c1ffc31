/**
 * Issue #11 item 1: no accepted spec may run forever, and a stop lands inside
 * a walk. The step floor of min_step (worker/models/dla-offlattice-2d/
 * descriptor.ts), the stuck-walker limit and the in-kernel stop signal
 * (worker/core/stop-signal.ts).
 */
import { describe, expect, it } from 'vitest';
import { OffLatticeDla2d } from '../worker/models/dla-offlattice-2d/kernel.js';
import { minStepFloor } from '../worker/core/min-step-floor.js';
import { createKernel } from '../worker/models/registry.js';
import { createStopSignal, raiseStop, WalkerStuck } from '../worker/core/stop-signal.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { TaskThreadPool } from '../worker/runtime/task-thread.js';
import { runTaskFor } from '../coordinator/plan.js';
import { dlaTask } from './support/grow.js';
import { problemsOf } from './support/spec-problems.js';

describe('min_step is bounded by the float spacing', () => {
  it.each([1e-15, 1e-300, 5e-7])('a spec with min_step %s is refused with one line naming the field and the floor', (v) => {
    const p = problemsOf({ model: 'dla-offlattice-2d', particles: 2000, clusters: 1, seed: 1, params: { min_step: v } });
    expect(p).toEqual([`params.min_step: ${v} is out of range; allowed: a number from 0.000001 to 1 for 2000 particles (particle diameters; a smaller step is lost in the float spacing of the coordinates)`]);
  });

  it('the floor rises with the largest possible radius (particles × 2^-40)', () => {
    expect(minStepFloor(1000, 2)).toBe(1e-6);
    expect(minStepFloor(100_000_000, 2)).toBeGreaterThanOrEqual((100_000_003) * 2 ** -40);
    expect(problemsOf({ model: 'dla-offlattice-2d', particles: 100_000_000, clusters: 1, seed: 1, params: { min_step: 1e-5 } })[0]).toMatch(
      /^params\.min_step: 0\.00001 is out of range; allowed: a number from 0\.0000914 to 1 for 100000000 particles/,
    );
    // the default and the values the tests use stay allowed
    expect(problemsOf({ model: 'dla-offlattice-2d', particles: 100_000_000, clusters: 1, seed: 1, params: {} })).toEqual([]);
    expect(problemsOf({ model: 'dla-offlattice-2d', particles: 2000, clusters: 1, seed: 1, params: { min_step: 1e-6 } })).toEqual([]);
  });

  it('a task below the floor is refused by the kernel registry too (tasks straight from the queue)', () => {
    expect(() => createKernel(dlaTask(2000, 0, '1', { min_step: 1e-15 }))).toThrow(/^params\.min_step: 1e-15 is out of range/);
  });
});

describe('a walker that makes no progress fails its run', () => {
  it('min_step 1e-15 (below the float spacing) throws WalkerStuck with the reason instead of spinning', () => {
    // built directly, past the registry's floor, as a task from an older coordinator could be
    const k = new OffLatticeDla2d(dlaTask(2000, 0, '1', { min_step: 1e-15 }), undefined, { maxStepsPerParticle: 2_000_000 });
    let err: unknown;
    try {
      k.growTo(2000);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(WalkerStuck);
    expect((err as Error).message).toMatch(/^run 0: the walker of particle \d+ made no progress in \d+ steps at radius [\d.e+-]+ \(params\.min_step = 1e-15 is too small for the float spacing there\)$/);
    expect(k.count).toBeLessThan(2000);
  });
});

describe('the stop signal is read inside the walk', () => {
  it('a raised signal ends growTo early, between whole particles, and the run resumes to the same bits', () => {
    const task = dlaTask(3000, 2, '5');
    const whole = createKernel(task);
    whole.growTo(3000);

    const stop = createStopSignal();
    raiseStop(stop);
    const k = createKernel(task);
    k.growTo(3000, stop);
    // the first check comes after 4096 steps: a few dozen particles, far from 3000
    expect(k.count).toBeGreaterThan(1);
    expect(k.count).toBeLessThan(3000);
    const stoppedAt = k.count;
    // resumed from a checkpoint
    const resumed = createKernel(task, k.checkpoint());
    resumed.growTo(3000);
    expect(resumed.result().stateHash).toBe(whole.result().stateHash);
    expect(resumed.result().counters).toEqual(whole.result().counters);
    // or continued in place, stopped again every few thousand steps
    let calls = 0;
    while (!k.done) {
      k.growTo(3000, stop);
      calls++;
    }
    expect(calls).toBeGreaterThan(3);
    expect(stoppedAt).toBeGreaterThan(0);
    expect(k.result().stateHash).toBe(whole.result().stateHash);
  });

  it('a thread run stopped mid-chunk hands back a checkpoint that resumes to the same bits', async () => {
    const pool = new TaskThreadPool(1);
    try {
      // Stopped at its first progress report after growth began (after the first chunk of 256
      // particles), not after a fixed sleep: a fixed sleep raced the whole run on a fast machine.
      // The stop is a shared-memory signal the walk reads every few thousand steps; 2·10^5
      // particles leave the thread about a second of growth or more when it is raised.
      const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 200000, clusters: 1, seed: 3 });
      const run = runTaskFor('stop-e1', spec, 0);
      // progress arrives asynchronously, from the thread, so `h` is assigned by the time it is read
      const h = pool.run(run, { onProgress: (p) => p.count > 0 && h.stop() });
      const o = await h.outcome;
      expect(o.status).toBe('stopped');
      if (o.status !== 'stopped') return;
      const again = await pool.run(run, { checkpoint: o.checkpoint }).outcome;
      expect(again.status).toBe('done');
      const whole = createKernel({ model: spec.model, particles: 200000, ensembleSeed: spec.seed, runIndex: 0, recordsPerDecade: spec.recordsPerDecade });
      whole.growTo(200000);
      if (again.status === 'done') expect(again.result.stateHash).toBe(whole.result().stateHash);
    } finally {
      await pool.close();
    }
  }, 120_000);

  it('runs stopped while waiting for a thread never start: no checkpoint, no resume counted', async () => {
    const pool = new TaskThreadPool(1);
    try {
      const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 20000, clusters: 3, seed: 6 });
      let firstProgress: () => void = () => undefined;
      const progressed = new Promise<void>((r) => (firstProgress = r));
      const handles = [0, 1, 2].map((i) => pool.run(runTaskFor('unstarted-e1', spec, i), { onProgress: i === 0 ? () => firstProgress() : undefined }));
      await progressed;
      for (const h of handles) h.stop();
      const outcomes = await Promise.all(handles.map((h) => h.outcome));
      expect(['stopped', 'done']).toContain(outcomes[0].status);
      expect(outcomes.slice(1).map((o) => o.status)).toEqual(['unstarted', 'unstarted']);
    } finally {
      await pool.close();
    }
  }, 120_000);
});
