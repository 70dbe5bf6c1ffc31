import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { encodeRunResult } from '../proto/convert.js';
import { runTask } from '../worker/runtime/task-runner.js';
import { deleteKeys, REDIS_URL, uniquePrefix } from './farm-helpers.js';

// The bookkeeping behind "running: 1 with done: 8 of 8" (a run counted as
// running after its result was stored). Causes, each closed here: a result
// stored and the running mark cleared by two separate commands (a connection
// lost between them left the mark, and the retry skipped the run without
// clearing it); a worker marking a run running after another had stored it.

const prefix = uniquePrefix('bookkeeping');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
afterAll(async () => {
  await deleteKeys(redis, prefix);
  redis.disconnect();
});

describe('run bookkeeping in the store', () => {
  const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 200, clusters: 2, seed: 77 });
  const store = new EnsembleStore(redis, prefix);

  it('never counts a run with a stored result as running', async () => {
    await store.create('eb1', spec, 2);
    const results = [];
    for (const i of [0, 1]) {
      const out = await runTask(runTaskFor('eb1', spec, i));
      if (out.status !== 'done') throw new Error('not done');
      results.push(out.result);
    }
    // worker A marks run 0 and stores it; the mark is gone with the result, in one transaction
    expect(await store.runStarted('eb1', 0, 'A')).toBe(true);
    expect((await store.status('eb1'))!.runs.running).toBe(1);
    expect(await store.saveResult(results[0], encodeRunResult(results[0]))).toBe(true);
    expect(await redis.hexists(`${prefix}:ensemble:eb1:running`, '0')).toBe(0);
    // worker B (a stalled copy of the same job) may not mark it running again, so it does not grow it
    expect(await store.runStarted('eb1', 0, 'B')).toBe(false);
    expect(await redis.hexists(`${prefix}:ensemble:eb1:running`, '0')).toBe(0);
    // a stale mark left by an older worker (or a lost connection) does not count either
    expect(await store.runStarted('eb1', 1, 'A')).toBe(true);
    await redis.hset(`${prefix}:ensemble:eb1:progress`, '1', '150');
    expect(await store.saveResult(results[1], encodeRunResult(results[1]))).toBe(true);
    await redis.hset(`${prefix}:ensemble:eb1:running`, '1', 'ghost');
    await redis.hset(`${prefix}:ensemble:eb1:progress`, '1', '150');
    const s = (await store.status('eb1'))!;
    expect(s.state).toBe('done');
    expect(s.runs).toEqual({ planned: 2, queued: 0, running: 0, done: 2, failed: 0 });
    expect(s.particles.done).toBe(400);
    // a retry of a stored run stores nothing twice
    expect(await store.saveResult(results[1], encodeRunResult(results[1]))).toBe(false);
  });
});
