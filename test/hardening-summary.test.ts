/**
 * Issue #11 item 4: summaries on the HTTP API are computed once per ensemble
 * state, off the event loop, and the bootstrap's resamples × clusters is
 * bounded in the spec.
 */
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { farmSummary } from '../coordinator/farm/summary.js';
import { buildApi } from '../coordinator/http/server.js';
import { SummaryCache } from '../coordinator/http/summary-cache.js';
import { SummaryThread } from '../coordinator/farm/summary-thread.js';
import { runTaskFor } from '../coordinator/plan.js';
import { renderSummary } from '../coordinator/summary/index.js';
import { SpecError, validateSpec, type EnsembleSpec } from '../coordinator/spec/index.js';
import { encodeRunResult, type RunResultData } from '../proto/convert.js';
import { runTask } from '../worker/runtime/task-runner.js';
import { deleteKeys, REDIS_URL, uniquePrefix } from './farm-helpers.js';

const prefix = uniquePrefix('hardsum');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
const app = buildApi({ store, queue, token: 'hardsum-token', limits: { maxTotalParticles: 1e9 } });
let spec: EnsembleSpec;
let id = '';
const results: RunResultData[] = [];

beforeAll(async () => {
  spec = validateSpec({ model: 'dla-offlattice-2d', particles: 300, clusters: 12, seed: 8, analysis: { resamples: 50000 } });
  id = await launchEnsemble(store, queue, spec);
  for (let i = 0; i < spec.clusters; i++) {
    const o = await runTask(runTaskFor(id, spec, i));
    if (o.status === 'done') results.push(o.result);
  }
  for (const r of results.slice(0, 10)) await store.saveResult(r, encodeRunResult(r));
}, 120_000);

afterAll(async () => {
  await app.close();
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
});

describe('summary work is bounded', () => {
  it('resamples × clusters above the ceiling is refused with one line; the default always passes', () => {
    let p: string[] = [];
    try {
      validateSpec({ model: 'dla-offlattice-2d', particles: 300, clusters: 40, seed: 1, analysis: { resamples: 1_000_000 } });
    } catch (err) {
      p = (err as SpecError).problems;
    }
    expect(p).toEqual(['analysis.resamples: 1000000 is out of range for 40 clusters; allowed: an integer from 10 to 50000 (resamples × clusters at most 2000000, or the default 2000)']);
    expect(validateSpec({ model: 'dla-offlattice-2d', particles: 2, clusters: 100_000, seed: 1, analysis: { resamples: 2000 } }).analysis.resamples).toBe(2000);
  });

  it('/health answers while a summary is being computed (the bootstrap runs on a thread)', async () => {
    // Know when the computation has been handed to the thread (no timer: the
    // test holds on any machine speed). While the thread works on 50000
    // resamples of 12 clusters, /health (a few microseconds of main-thread
    // work) must be answered before the summary settles.
    let handedOff!: () => void;
    const onThread = new Promise<void>((r) => (handedOff = r));
    const build = SummaryThread.prototype.build;
    const spy = vi.spyOn(SummaryThread.prototype, 'build').mockImplementation(function (this: SummaryThread, input) {
      const p = build.call(this, input);
      handedOff();
      return p;
    });
    let settled = false;
    const summary = app.inject({ url: `/ensembles/${id}/summary` }).then((r) => {
      settled = true;
      return r;
    });
    await onThread;
    spy.mockRestore();
    const health = await app.inject({ url: '/health' });
    expect(health.statusCode).toBe(200);
    expect(settled).toBe(false);
    const r = await summary;
    expect(r.statusCode).toBe(200);
    // the thread's summary is the very summary of the main thread
    const local = await farmSummary(store, id);
    expect(r.body).toBe(Buffer.from(renderSummary(local!.summary, 'json', 'series')).toString('utf8'));
  }, 300_000);

  it('a summary is computed once per ensemble state', async () => {
    const cache = new SummaryCache(store);
    try {
      const a = await cache.get(id);
      const b = await cache.get(id);
      expect(cache.computed).toBe(1);
      expect(b).toBe(a);
      // two requests at once share one computation
      await store.saveResult(results[10], encodeRunResult(results[10]));
      const [c, d] = await Promise.all([cache.get(id), cache.get(id)]);
      expect(cache.computed).toBe(2);
      expect(c).toBe(d);
      expect(c!.summary.clustersDone).toBe(11);
      expect(await cache.get('enothere')).toBeNull();
    } finally {
      await cache.close();
    }
  }, 300_000);
});
