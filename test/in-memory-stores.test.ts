/** The embedded mode's implementations of the farm's RunSink, CheckpointStore, BatchStore and run queue (coordinator/embedded/in-memory-stores.ts, in-memory-queue.ts). */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { decodeRunResult, encodeRunResult, type RunTaskData } from '../proto/convert.js';
import { EmbeddedRunSink, MemoryBatchStore, MemoryCheckpointStore } from '../coordinator/embedded/in-memory-stores.js';
import { MemoryRunQueue } from '../coordinator/embedded/in-memory-queue.js';
import { launchEnsemble } from '../coordinator/farm/launch.js';
import { advanceAdaptive } from '../coordinator/farm/adaptive.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { finalKey, resultKey } from '../worker/runtime/job-contract.js';

const run: RunTaskData = {
  ensembleId: 'e1', runIndex: 3, ensembleSeed: '5', particles: 50, recordsPerDecade: 10, model: modelParams('dla-offlattice-2d'),
  checkpointIntervalSeconds: 60, checkpointEveryParticles: 0, engineVersion: ENGINE_VERSION, keepPositions: true,
};

function grown() {
  const k = createKernel(run);
  k.growTo(run.particles);
  const result = { ...k.result(), ensembleId: 'e1', timings: { growSeconds: 1, startedAtMs: 0, finishedAtMs: 1, resumes: 0, finishedBy: 'test' } };
  const final = { run, state: k.checkpoint(), growSeconds: 1, startedAtMs: 0, resumes: 0 };
  return { result, final, coords: k.positions().coords.slice(0, 2 * run.particles) };
}

describe('in-memory stores of the embedded mode', () => {
  it('MemoryCheckpointStore keeps, returns and drops checkpoints by key', async () => {
    const s = new MemoryCheckpointStore();
    expect(await s.get('e1/run-3.checkpoint')).toBeNull();
    await s.put('e1/run-3.checkpoint', Uint8Array.of(1, 2));
    expect([...(await s.get('e1/run-3.checkpoint'))!]).toEqual([1, 2]);
    await s.delete('e1/run-3.checkpoint');
    expect(await s.get('e1/run-3.checkpoint')).toBeNull();
  });

  it('EmbeddedRunSink stores a result once, in memory and under the farm key, and keeps final positions to probe', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tendril-sink-'));
    try {
      const store = new DirectoryArtifactStore(dir);
      let changes = 0;
      const sink = new EmbeddedRunSink('e1', store, () => changes++);
      const { result, final } = grown();
      expect(await sink.hasResult('e1', 3)).toBe(false);
      await sink.progress('e1', 3, 20, 20);
      expect(sink.live.get(3)).toBe(20);
      expect(await sink.saveResult(result, encodeRunResult(result))).toBe(true);
      expect(await sink.saveResult(result, encodeRunResult(result))).toBe(false);
      expect(await sink.hasResult('e1', 3)).toBe(true);
      expect(sink.live.has(3)).toBe(false);
      expect(decodeRunResult((await store.get(resultKey('e1', 3)))!).stateHash).toBe(result.stateHash);
      await sink.finalPositions(run, final);
      expect(sink.finals.get(3)).toBeNull(); // waits in the store
      expect(await store.get(finalKey('e1', 3))).not.toBeNull();
      expect(changes).toBeGreaterThanOrEqual(2);
      await sink.runFailed('e1', 4, 'bad task');
      expect(sink.failures).toEqual(['run 4: bad task']);
      expect(await sink.isCancelled()).toBe(false);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('without an artifact store the final positions stay in memory', async () => {
    const sink = new EmbeddedRunSink('e1', undefined, () => undefined);
    const { final, coords } = grown();
    await sink.finalPositions(run, final);
    const pos = sink.finals.get(3)!;
    expect(pos.count).toBe(run.particles);
    expect(pos.coords.subarray(0, 2 * run.particles)).toEqual(coords);
  });

  it('MemoryRunQueue and MemoryBatchStore carry the farm batch loop: idempotent queueing, one batch step per judgement', async () => {
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 30, clusters: 4, seed: 8, runs_per_job: 2, target: { half_width: 1e-6, max_clusters: 8, min_batch: 4 } });
    const sink = new EmbeddedRunSink('q1', undefined, () => undefined);
    const ledger = new MemoryBatchStore(sink);
    const queue = new MemoryRunQueue();
    await launchEnsemble(ledger, queue, spec, { ensembleId: 'q1' });
    await launchEnsemble(new MemoryBatchStore(sink), queue, spec, { ensembleId: 'q1' }); // the same jobs again: ignored
    expect(queue.queued).toBe(2);
    const first = queue.takeRuns();
    expect(first.map((r) => r.runIndex)).toEqual([0, 1, 2, 3]);
    expect(queue.takeRuns()).toEqual([]);
    expect(await advanceAdaptive(ledger, queue, 'q1')).toBe('waiting');
    for (const r of first) {
      const k = createKernel(r);
      k.growTo(r.particles);
      const result = { ...k.result(), ensembleId: 'q1', timings: { growSeconds: 1, startedAtMs: 0, finishedAtMs: 1, resumes: 0, finishedBy: 'test' } };
      await sink.saveResult(result, encodeRunResult(result));
    }
    // the batch is judged once: a second judge of the same batch loses the race and changes nothing
    const rec = ledger.recordOf('q1')!;
    expect(await advanceAdaptive(ledger, queue, 'q1')).toBe('extended');
    expect(await ledger.extendAdaptive('q1', rec.plannedClusters, 99, 99, rec.adaptive!)).toBe(false);
    const after = ledger.recordOf('q1')!;
    expect(after.plannedClusters).toBe(8);
    expect(after.adaptive!.batches.map((b) => [b.fromRun, b.toRun, b.firstJob, b.jobs])).toEqual([[0, 4, 0, 2], [4, 8, 2, 2]]);
    expect(queue.takeRuns().map((r) => r.runIndex)).toEqual([4, 5, 6, 7]);
    expect(await ledger.resultCount('q1')).toBe(4);
  });
});
