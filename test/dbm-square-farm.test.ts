import { beforeAll, describe, expect, it } from 'vitest';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { growthTaskOf } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { farmFixture } from './support/farm-fixture.js';

// The lattice DBM on the farm (real Redis, one worker process): its checkpoints
// carry the potential (modelState), stored in Redis between chunks.
const spec = validateSpec({ name: 'dbm farm test', model: 'dbm-square', params: { eta: 2 }, particles: 160, clusters: 3, seed: '2718', runs_per_job: 1, checkpoint_every_particles: 60 });

function directHash(i: number): string {
  const k = createKernel(growthTaskOf(runTaskFor('x', spec, i)));
  k.growTo(spec.particles);
  return k.result().stateHash;
}

describe('dbm-square on the farm', () => {
  const setup = farmFixture('dbmsq');

  beforeAll(async () => {
    await setup.startWorker();
  });

  it('the spec takes eta and refuses it out of range with one line', () => {
    expect(spec.model).toEqual({ kind: 'dbm-square', params: { eta: 2, far_factor: 2, far_margin: 16, tolerance: 1e-9 } });
    expect(() => validateSpec({ model: 'dbm-square', params: { eta: 7 }, particles: 100, clusters: 2, seed: 1 })).toThrow(/params\.eta: 7 is out of range/);
  });

  it('a worker grows the runs with the same hashes as the kernel run directly', async () => {
    const id = await launchEnsemble(setup.store, setup.queue, spec);
    const status = await setup.waitDone(id);
    expect(status.runs.done).toBe(3);
    const farm = await setup.store.results(id);
    expect(farm.map((r) => r.stateHash)).toEqual([0, 1, 2].map(directHash));
  });
});
