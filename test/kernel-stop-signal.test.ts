/**
 * Issue #11 item 1, for every registered model: the stop signal
 * (worker/core/stop-signal.ts) is read inside the kernel's own loop, so a
 * stop ends growTo after a bounded amount of WORK (at most STOP_CHECK_EVERY
 * walker moves or particles, whatever the chunk asked for), and the state it
 * leaves resumes — from a checkpoint or in place — to the very same bits as
 * a run never stopped. A new model gets these checks by being registered.
 */
import { describe, expect, it } from 'vitest';
import type { GrowthCheckpoint, GrowthKernel, GrowthTask } from '../worker/core/growth-kernel.js';
import { decodeCheckpoint } from '../proto/convert.js';
import { createStopSignal, raiseStop, STOP_CHECK_EVERY, WalkerStuck } from '../worker/core/stop-signal.js';
import { createKernel, MODELS, modelParams } from '../worker/models/registry.js';
import { OffLatticeDla3d } from '../worker/models/dla-offlattice-3d/kernel.js';
import { TaskThreadPool } from '../worker/runtime/task-thread.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';

/** Large enough that no model finishes it inside one stop check. */
const P = 3 * STOP_CHECK_EVERY;

function taskOf(kind: string, particles: number, params: Record<string, number> = {}): GrowthTask {
  return { model: modelParams(kind, params), particles, ensembleSeed: '20261203', runIndex: 1, recordsPerDecade: 10 };
}

/**
 * Walker moves the counters record for the models that walk (each pass of the
 * walker loop is one of these); the Eden models draw once per particle and are
 * bounded by the particle count instead.
 */
const MOVES: Record<string, string[]> = {
  'dla-offlattice-2d': ['jumps', 'short_steps'],
  'dla-offlattice-3d': ['jumps', 'short_steps'],
  'dla-square': ['jumps', 'steps', 'returns', 'walkers'],
  'dla-triangular': ['jumps', 'steps', 'returns', 'walkers'],
};

function moves(k: GrowthKernel, names: string[]): number {
  return names.reduce((s, n) => s + (k.counters[n] ?? 0), 0);
}

/**
 * Particles per run in the resume check. The breakdown models are checked
 * on smaller clusters: the lattice one solves the potential over a disk that
 * grows with the cluster at every particle, the off-lattice one needs many
 * walkers per particle (about 1/Σω^η).
 */
function resumeSize(kind: string): number {
  if (kind === 'dbm-square') return 150;
  if (kind === 'dbm-offlattice-2d') return 300;
  return P;
}
const cases: Array<[string, Record<string, number>]> = [
  ...MODELS.map((d): [string, Record<string, number>] => [d.kind, {}]),
  ['dla-square', { noise_reduction: 4 }],
];

describe.each(cases)('the stop signal inside the %s kernel %o', (kind, params) => {
  it('a raised signal ends a long growTo within bounded work', () => {
    expect(Object.keys(MOVES).every((k) => MODELS.some((d) => d.kind === k))).toBe(true);
    // a 10^6-particle run asked to grow in one call: without the check it would run to the end
    const k = createKernel(taskOf(kind, 1_000_000, params));
    const stop = createStopSignal();
    raiseStop(stop);
    k.growTo(1_000_000, stop);
    expect(k.count).toBeGreaterThanOrEqual(1);
    expect(k.count).toBeLessThanOrEqual(STOP_CHECK_EVERY);
    const names = MOVES[kind];
    if (names) expect(moves(k, names)).toBeLessThanOrEqual(STOP_CHECK_EVERY);
    // asked again, it stops again after at most the same work
    const before = k.count;
    const movesBefore = names ? moves(k, names) : 0;
    k.growTo(1_000_000, stop);
    expect(k.count - before).toBeLessThanOrEqual(STOP_CHECK_EVERY);
    if (names) expect(moves(k, names) - movesBefore).toBeLessThanOrEqual(STOP_CHECK_EVERY);
  });

  it('the stopped state resumes from a checkpoint, or in place, to the same bits as an unstopped run', () => {
    const size = resumeSize(kind);
    const task = taskOf(kind, size, params);
    const whole = createKernel(task);
    whole.growTo(size);
    const expected = whole.result();

    const stop = createStopSignal();
    raiseStop(stop);
    const k = createKernel(task);
    k.growTo(size, stop);
    expect(k.count).toBeLessThan(size);
    const resumed = createKernel(task, k.checkpoint());
    resumed.growTo(size);
    expect(resumed.result().stateHash).toBe(expected.stateHash);
    expect(resumed.result().counters).toEqual(expected.counters);

    let calls = 1;
    while (!k.done) {
      k.growTo(size, stop);
      // one particle without the signal: a model whose particle can need more
      // than STOP_CHECK_EVERY moves would otherwise be stopped (and rewound)
      // inside that particle at every call
      if (!k.done) k.growTo(k.count + 1);
      calls++;
    }
    expect(calls).toBeGreaterThanOrEqual(3);
    expect(k.result().stateHash).toBe(expected.stateHash);
    expect(k.result().counters).toEqual(expected.counters);
    expect(k.result().series).toEqual(expected.series);
  });
});

describe('3D off-lattice: stuck walkers and threads', () => {
  it('min_step below the float spacing is refused by the registry, and a kernel built past it throws WalkerStuck instead of spinning', () => {
    expect(() => createKernel(taskOf('dla-offlattice-3d', 2000, { min_step: 1e-15 }))).toThrow(
      /^params\.min_step: 1e-15 is out of range; allowed: a number from 0\.000001 to 1 for 2000 particles/,
    );
    // built directly, past the registry's floor, as a task from an older coordinator could be (1e-300: stuck at the second ball)
    const k = new OffLatticeDla3d(taskOf('dla-offlattice-3d', 2000, { min_step: 1e-300 }), undefined, { maxStepsPerParticle: 2_000_000 });
    let err: unknown;
    try {
      k.growTo(2000);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(WalkerStuck);
    expect((err as Error).message).toMatch(/^run 1: the walker of particle \d+ made no progress in \d+ steps at radius [\d.e+-]+ \(params\.min_step = 1e-300 is too small/);
  });

  it('a 3D run on a task thread stopped mid-chunk hands back a checkpoint equal to an unstopped kernel at the same count', async () => {
    const pool = new TaskThreadPool(1);
    try {
      const spec = validateSpec({ model: 'dla-offlattice-3d', particles: 200_000, clusters: 1, seed: 9 });
      const run = runTaskFor('stop-3d', spec, 0);
      let progressed: () => void = () => undefined;
      const first = new Promise<void>((r) => (progressed = r));
      const h = pool.run(run, { onProgress: (p) => p.count > 1 && progressed() });
      await first;
      h.stop();
      const o = await h.outcome;
      expect(o.status).toBe('stopped');
      if (o.status !== 'stopped') return;
      const state = decodeCheckpoint(o.checkpoint!).state as GrowthCheckpoint;
      expect(state.count).toBeLessThan(200_000);
      const fresh = createKernel({ model: spec.model, particles: 200_000, ensembleSeed: spec.seed, runIndex: 0, recordsPerDecade: spec.recordsPerDecade });
      fresh.growTo(state.count);
      const c = fresh.checkpoint();
      expect(Array.from(c.rngState)).toEqual(Array.from(state.rngState));
      expect(Buffer.from(c.positions.buffer, c.positions.byteOffset, c.positions.byteLength).equals(Buffer.from(state.positions.buffer, state.positions.byteOffset, state.positions.byteLength))).toBe(true);
    } finally {
      await pool.close();
    }
  }, 120_000);
});
