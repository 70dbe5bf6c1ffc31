import { rmSync } from 'node:fs';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { deleteKeys, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

// A worker logs one JSON line (pino) when a run starts, checkpoints, finishes
// or is handed back, with the ensemble, the run and the particles.

const prefix = uniquePrefix('worker-logs');
const artifacts = tempDir('worker-logs-artifacts');
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

interface LogLine { level: number; msg: string; ensembleId?: string; runIndex?: number; particles?: number | null; resumed?: boolean; counted?: boolean; stateHash?: string; workerId?: string }

function logLines(text: string): LogLine[] {
  return text.split('\n').filter((l) => l.startsWith('{')).map((l) => JSON.parse(l) as LogLine);
}

describe('worker structured logs', () => {
  it('one line per start, checkpoint, finish and hand-back of a run', async () => {
    worker = await startWorker({ prefix, artifacts, extra: ['--log-level', 'info'] });
    const small = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 3000, clusters: 1, seed: 4, checkpoint_every_particles: 1000 }));
    await waitFor('small ensemble done', async () => (await store.status(small))?.state === 'done');
    const big = await launchEnsemble(store, queue, validateSpec({ model: 'dla-offlattice-2d', particles: 2_000_000, clusters: 1, seed: 5 }));
    await waitFor('the big run under way', async () => ((await store.status(big))?.particles.done ?? 0) > 2000);
    const w = worker;
    w.child.kill('SIGTERM');
    expect(await w.exited).toBe(0);
    const lines = logLines(w.output());
    const of = (id: string) => lines.filter((l) => l.ensembleId === id).map((l) => l.msg);
    expect(of(small)).toEqual(['run started', 'run checkpointed', 'run checkpointed', 'run finished']);
    const fin = lines.find((l) => l.ensembleId === small && l.msg === 'run finished')!;
    expect(fin).toMatchObject({ level: 30, runIndex: 0, particles: 3000, counted: true });
    expect(fin.stateHash).toMatch(/^[0-9a-f]+$/);
    expect(fin.workerId).toMatch(/:\d+$/);
    expect(lines.filter((l) => l.ensembleId === small && l.msg === 'run checkpointed').every((l) => typeof l.particles === 'number')).toBe(true);
    expect(of(big)).toEqual(['run started', 'run handed back']);
    expect(lines.find((l) => l.ensembleId === big && l.msg === 'run handed back')!.particles).toBeGreaterThan(2000);
    worker = undefined;
  }, 120_000);
});
