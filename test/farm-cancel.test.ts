import { rmSync } from 'node:fs';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { cancelEnsemble, launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { checkpointKey } from '../worker/runtime/job-contract.js';
import { deleteKeys, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

const prefix = uniquePrefix('cancel');
const artifacts = tempDir('cancel-artifacts');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
let worker: WorkerProc | undefined;

afterAll(async () => {
  await stopWorker(worker);
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(artifacts, { recursive: true, force: true });
});

describe('cancel', () => {
  it('drops queued jobs and stops the running run within seconds; the worker goes on', async () => {
    worker = await startWorker({ prefix, artifacts });
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 600000, clusters: 3, seed: 8, runs_per_job: 1, checkpoint_every_particles: 50000 });
    const id = await launchEnsemble(store, queue, spec);
    await waitFor('a run in progress', async () => ((await store.status(id))?.particles.done ?? 0) > 3000);
    expect(await cancelEnsemble(store, queue, id)).toBe(true);
    const s = await waitFor('the run stopped', async () => {
      const st = await store.status(id);
      return st && st.runs.running === 0 ? st : undefined;
    }, 15_000);
    expect(s.state).toBe('cancelled');
    expect(s.runs.done).toBe(0);
    const counts = await queue.getJobCounts('waiting', 'active', 'completed');
    expect(counts).toMatchObject({ waiting: 0, active: 0, completed: 1 });
    expect(await new DirectoryArtifactStore(artifacts).get(checkpointKey(id, 0))).toBeNull();
    // the worker still serves new ensembles
    const next = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 500, clusters: 1, seed: 9 }));
    await waitFor('next ensemble done', async () => (await store.status(next))?.state === 'done');
  });
});
