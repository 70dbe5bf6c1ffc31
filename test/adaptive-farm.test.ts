/**
 * Adaptive ensembles on the farm, with real Redis and a real worker process:
 * a loose target stops after two batches, an unreachable one at the cap; the
 * runs equal those of a fixed embedded ensemble of the same size; several
 * coordinators judging the same complete batch add it exactly once; the
 * summary is partial (with the analysis of the runs so far) while it runs.
 */
import { rmSync } from 'node:fs';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { advanceAdaptive } from '../coordinator/farm/adaptive.js';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { farmSummary } from '../coordinator/farm/summary.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { encodeRunResult, growthTaskOf } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { deleteKeys, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const prefixes: string[] = [];
const queues: ReturnType<typeof runQueue>[] = [];
const artifacts = tempDir('adaptive-farm');
let worker: WorkerProc | undefined;

function farm(tag: string) {
  const prefix = uniquePrefix(tag);
  prefixes.push(prefix);
  const queue = runQueue(redis, prefix);
  queues.push(queue);
  return { prefix, store: new EnsembleStore(redis, prefix), queue };
}

afterAll(async () => {
  await stopWorker(worker);
  for (const q of queues) await q.close();
  for (const p of prefixes) await deleteKeys(redis, p);
  redis.disconnect();
  rmSync(artifacts, { recursive: true, force: true });
});

const base = { model: 'dla-offlattice-2d', particles: 400, clusters: 8, seed: 5, runs_per_job: 2 };

describe('adaptive ensembles on the farm', () => {
  it('concurrent judges add the next batch once; the summary is partial with the analysis so far', async () => {
    const { store, queue } = farm('adaptive-race');
    const spec = validateSpec({ ...base, target: { half_width: 0.2, max_clusters: 64, min_clusters: 12, min_batch: 4 } });
    const id = await launchEnsemble(store, queue, spec);
    const empty = (await farmSummary(store, id))!.summary;
    expect(empty.partial).toBe(true);
    expect(empty.clustersDone).toBe(0);
    expect(JSON.parse(empty.statisticsJson)).toEqual({ available: false, reason: 'no run has finished yet' });
    expect(await advanceAdaptive(store, queue, id)).toBe('waiting');
    // store the first batch's results as a worker would (no worker serves this prefix)
    for (let i = 0; i < 8; i++) {
      const k = createKernel(growthTaskOf(runTaskFor(id, spec, i)));
      k.growTo(spec.particles);
      const r = { ...k.result(), ensembleId: id, runIndex: i, ensembleSeed: spec.seed, engineVersion: runTaskFor(id, spec, i).engineVersion } as never;
      await store.saveResult(r, encodeRunResult(r));
    }
    const partial = (await farmSummary(store, id))!.summary;
    expect(partial.partial).toBe(true); // all 8 planned runs are stored, but the stopping rule has not spoken
    expect(JSON.parse(partial.statisticsJson).clusters).toBe(8);
    const steps = await Promise.all([1, 2, 3, 4, 5].map(() => advanceAdaptive(store, queue, id)));
    expect(steps.filter((s) => s === 'extended')).toHaveLength(1);
    const rec = (await store.get(id))!;
    expect(rec.plannedClusters).toBe(12);
    expect(rec.adaptive!.batches.map((b) => [b.fromRun, b.toRun, b.firstJob, b.jobs])).toEqual([
      [0, 8, 0, 4],
      [8, 12, 4, 2],
    ]);
    expect(rec.queuedThrough).toBe(12);
    const waiting = await queue.getWaiting(0, 100);
    expect(waiting.map((j) => j.id).sort()).toEqual([0, 1, 2, 3, 4, 5].map((j) => `${id}-${j}`).sort());
    expect((await store.status(id))!.runs.planned).toBe(12);
  }, 60_000);

  it('with a worker process: a loose target stops after two batches, an unreachable one at the cap', async () => {
    const { prefix, store, queue } = farm('adaptive-run');
    worker = await startWorker({ prefix, artifacts, concurrency: 2, extra: ['--adaptive-sweep-ms', '1000'] });
    const loose = validateSpec({ ...base, name: 'loose', target: { half_width: 0.2, max_clusters: 64, min_clusters: 12, min_batch: 4 } });
    const capped = validateSpec({ ...base, name: 'capped', target: { half_width: 0.001, max_clusters: 20, min_clusters: 12, min_batch: 4 } });
    const a = await launchEnsemble(store, queue, loose);
    const b = await launchEnsemble(store, queue, capped);
    const done = async (id: string) =>
      waitFor(`ensemble ${id} done`, async () => {
        const s = await store.status(id);
        return s?.state === 'done' ? s : undefined;
      }, 90_000);
    const sa = await done(a);
    const sb = await done(b);
    expect(sa.adaptive).toEqual({ outcome: 'target-reached', batches: 2, maxClusters: 64 });
    expect(sa.runs.planned).toBe(12);
    expect(sb.adaptive?.outcome).toBe('cap-reached');
    expect(sb.runs).toEqual({ planned: 20, queued: 0, running: 0, done: 20, failed: 0 });
    const fa = (await farmSummary(store, a))!;
    expect(fa.summary.partial).toBe(false);
    const ha = JSON.parse(fa.summary.adaptiveJson);
    expect(ha.batches.map((x: any) => x.judged.action)).toEqual(['continue', 'target-reached']);
    expect(JSON.parse(fa.summary.statisticsJson).estimators.radiusOfGyration.interval.status).toBe('ok');
    // the same runs as a fixed ensemble of the final size, and as the embedded adaptive run
    const fixed = await runEmbedded(validateSpec({ ...base, clusters: 20 }), { ensembleId: 'fixed', threads: 2 });
    const fb = (await farmSummary(store, b))!;
    expect(fb.results.map((r) => r.stateHash)).toEqual(fixed.results.map((r) => r.stateHash));
    expect(fa.results.map((r) => r.stateHash)).toEqual(fixed.results.slice(0, 12).map((r) => r.stateHash));
    const local = await runEmbedded(capped, { ensembleId: 'local', threads: 2 });
    // one batch loop (launchEnsemble + advanceAdaptive) for both: the same batches, the same jobs planned for them
    expect(JSON.parse(fb.summary.adaptiveJson).batches.map((x: any) => [x.fromRun, x.toRun, x.firstJob, x.jobs, x.judged.action])).toEqual(
      local.adaptive!.batches.map((x) => [x.fromRun, x.toRun, x.firstJob, x.jobs, x.judged!.action]),
    );
  }, 150_000);
});
