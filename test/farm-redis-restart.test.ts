import { rmSync } from 'node:fs';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { TaskThreadPool } from '../worker/runtime/task-thread.js';
import { privateRedis, sleep, startWorker, stopWorker, tempDir, waitFor, type PrivateRedis, type WorkerProc } from './farm-helpers.js';

let server: PrivateRedis | undefined;
let worker: WorkerProc | undefined;
const artifacts = tempDir('restart-artifacts');

afterAll(async () => {
  await stopWorker(worker);
  await server?.cleanup();
  rmSync(artifacts, { recursive: true, force: true });
});

describe('Redis restart mid-ensemble (test-owned redis-server with AOF)', () => {
  it('the ensemble still completes with nothing lost or doubled', async () => {
    server = await privateRedis();
    const prefix = 'restart';
    const redis = new Redis(server.url, { maxRetriesPerRequest: null });
    redis.on('error', () => undefined);
    const store = new EnsembleStore(redis, prefix);
    const queue = runQueue(redis, prefix);
    queue.on('error', () => undefined);
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 60000, clusters: 8, seed: '31337', runs_per_job: 1, checkpoint_every_particles: 20000 });
    const id = await launchEnsemble(store, queue, spec);
    worker = await startWorker({ redisUrl: server.url, prefix, artifacts, concurrency: 2 });
    await waitFor('two runs done', async () => ((await store.status(id))?.runs.done ?? 0) >= 2);
    const doneBefore = (await store.status(id))!.runs.done;
    expect(doneBefore).toBeLessThan(8);
    await server.stop();
    await sleep(1500);
    await server.start();
    const s = await waitFor('ensemble done after the restart', async () => {
      try {
        const st = await store.status(id);
        return st?.state === 'done' ? st : undefined;
      } catch {
        return undefined;
      }
    }, 120_000);
    expect(s.runs).toEqual({ planned: 8, queued: 0, running: 0, done: 8, failed: 0 });
    const results = await store.results(id);
    expect(results.map((r) => r.runIndex)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    // the reference hashes grow on a worker thread, so this test never blocks the runner's event loop
    const pool = new TaskThreadPool(2);
    try {
      const direct = await Promise.all(results.map(async (r) => {
        const o = await pool.run(runTaskFor('x', spec, r.runIndex)).outcome;
        return o.status === 'done' ? o.result.stateHash : `run ${r.runIndex}: ${o.status}`;
      }));
      expect(results.map((r) => r.stateHash)).toEqual(direct);
    } finally {
      await pool.close();
    }
    expect(worker.child.exitCode).toBeNull();
    await queue.close();
    redis.disconnect();
  });
});
