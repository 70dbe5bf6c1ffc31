import { beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { decodeCheckpoint, encodeCheckpoint, growthTaskOf, type CheckpointData } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { runTask } from '../worker/runtime/task-runner.js';
import { farmFixture } from './support/farm-fixture.js';

// 3D DLA through every path a model takes: the spec, the task runner with
// checkpoints over the wire format, the embedded mode and the Redis farm.
const spec = validateSpec({ name: '3d test', model: 'dla-offlattice-3d', particles: 1200, clusters: 4, seed: '31415', runs_per_job: 1, checkpoint_every_particles: 500 });

function directHash(i: number): string {
  const k = createKernel(growthTaskOf(runTaskFor('x', spec, i)));
  k.growTo(spec.particles);
  return k.result().stateHash;
}

describe('3D DLA in specs, task runner and embedded mode', () => {
  it('the spec takes the model with its parameters and a [probe] table (3D probing: test/probe-3d-ensemble.test.ts)', () => {
    expect(spec.model.kind).toBe('dla-offlattice-3d');
    expect(spec.model.params).toEqual({ min_step: 0.02, launch_margin: 2 });
    expect(validateSpec({ model: 'dla-offlattice-3d', particles: 100, clusters: 2, seed: 1, probe: { walkers: 1000 } }).probe).toMatchObject({ walkers: 1000, contactSample: 0 });
    expect(() => validateSpec({ model: 'dla-offlattice-3d', particles: 100, clusters: 2, seed: 1, params: { min_step: 3 } })).toThrow(/params\.min_step: 3 is out of range/);
  });

  it('checkpoints go through the wire format with dimension 3 and resume to the uninterrupted hash', async () => {
    const run = runTaskFor('e3', spec, 2);
    const checkpoints: CheckpointData[] = [];
    const full = await runTask(run, { onCheckpoint: (c) => void checkpoints.push(c) });
    expect(full.status).toBe('done');
    const hash = full.status === 'done' ? full.result.stateHash : '';
    expect(hash).toBe(directHash(2));
    expect(checkpoints.map((c) => c.state.count)).toEqual([500, 1000]);
    for (const c of checkpoints) {
      const wire = decodeCheckpoint(encodeCheckpoint(c));
      expect(wire.state.dimension).toBe(3);
      const resumed = await runTask(run, { checkpoint: wire });
      expect(resumed.status === 'done' && resumed.result.stateHash).toBe(hash);
    }
  });

  it('the embedded mode grows every run on worker threads with the same hashes as the kernel run directly', async () => {
    const out = await runEmbedded(spec, { ensembleId: 'emb3d', threads: 2 });
    expect(out.results.map((r) => r.runIndex)).toEqual([0, 1, 2, 3]);
    for (const r of out.results) {
      expect(r.stateHash).toBe(directHash(r.runIndex));
      expect(r.dimension).toBe(3);
    }
  });
});

describe('3D DLA on the farm (real Redis, one worker process)', () => {
  const setup = farmFixture('dla3d');

  beforeAll(async () => {
    await setup.startWorker();
  });

  it('a worker grows the runs with the same hashes as the kernel run directly', async () => {
    const id = await launchEnsemble(setup.store, setup.queue, spec);
    const status = await setup.waitDone(id);
    expect(status.runs.done).toBe(4);
    const farm = await setup.store.results(id);
    expect(farm.map((r) => r.stateHash)).toEqual([0, 1, 2, 3].map(directHash));
  });
});
