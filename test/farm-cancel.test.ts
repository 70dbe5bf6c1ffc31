import { describe, expect, it } from 'vitest';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { cancelEnsemble, launchEnsemble } from '../coordinator/farm/queue.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { checkpointKey } from '../worker/runtime/job-contract.js';
import { waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const { artifacts, store, queue, startWorker, waitDone } = farmFixture('cancel');

describe('cancel', () => {
  it('drops queued jobs and stops the running run within seconds; the worker goes on', async () => {
    await startWorker();
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 600000, clusters: 3, seed: 8, runs_per_job: 1, checkpoint_every_particles: 50000 });
    const id = await launchEnsemble(store, queue, spec);
    await waitFor('a run in progress', async () => ((await store.status(id))?.particles.done ?? 0) > 3000);
    expect(await cancelEnsemble(store, queue, id)).toBe('cancelled');
    const s = await waitFor('the run stopped', async () => {
      const st = await store.status(id);
      return st && st.runs.running === 0 ? st : undefined;
    }, 15_000);
    expect(s.state).toBe('cancelled');
    expect(s.runs.done).toBe(0);
    // the store marks the run stopped just before BullMQ moves its job from active to completed,
    // so the queue's counts are awaited, not read once
    const counts = await waitFor('the cancelled job completed in the queue', async () => {
      const c = await queue.getJobCounts('waiting', 'active', 'completed');
      return c.active === 0 ? c : undefined;
    }, 15_000);
    expect(counts).toMatchObject({ waiting: 0, active: 0, completed: 1 });
    expect(await new DirectoryArtifactStore(artifacts).get(checkpointKey(id, 0))).toBeNull();
    // the worker still serves new ensembles
    const next = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 500, clusters: 1, seed: 9 }));
    await waitDone(next, 'next ensemble done');
    // a cancelled ensemble lists nothing queued; cancelling twice says so; a finished one is left alone
    expect((await store.status(id))!.runs.queued).toBe(0);
    expect(await cancelEnsemble(store, queue, id)).toBe('already-cancelled');
    expect(await cancelEnsemble(store, queue, next)).toBe('finished');
    expect((await store.status(next))!.state).toBe('done');
    expect(await cancelEnsemble(store, queue, 'enothere')).toBe('unknown');
  });
});
