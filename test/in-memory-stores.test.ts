/** The embedded mode's implementations of the farm's RunSink and CheckpointStore (coordinator/embedded/in-memory-stores.ts). */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { decodeRunResult, encodeCheckpoint, encodeRunResult, type RunTaskData } from '../proto/convert.js';
import { EmbeddedRunSink, MemoryCheckpointStore } from '../coordinator/embedded/in-memory-stores.js';
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
  const final = encodeCheckpoint({ run, state: k.checkpoint(), growSeconds: 1, startedAtMs: 0, resumes: 0 });
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
});
