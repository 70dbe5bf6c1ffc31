import { rmSync } from 'node:fs';
import { Redis } from 'ioredis';
import { afterAll, describe, expect, it } from 'vitest';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { deleteKeys, freePort, REDIS_URL, startWorker, stopWorker, tempDir, uniquePrefix, waitFor, type WorkerProc } from './farm-helpers.js';

const prefix = uniquePrefix('lock');
const artifacts = tempDir('lock-artifacts');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
const workers: WorkerProc[] = [];

afterAll(async () => {
  for (const w of workers) await stopWorker(w);
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(artifacts, { recursive: true, force: true });
});

describe('worker lock renewal and metrics', () => {
  it('a run far longer than the lock duration never stalls (growth is off the main thread); /metrics counts it', async () => {
    const port = await freePort();
    // lock of 1 s, stalled check every 0.5 s, a second worker ready to steal a stalled job
    const extra = ['--lock-ms', '1000', '--stalled-ms', '500'];
    workers.push(await startWorker({ prefix, artifacts, extra: [...extra, '--metrics-port', String(port)] }));
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 600000, clusters: 1, seed: 2 });
    const id = await launchEnsemble(store, queue, spec);
    await waitFor('run started', async () => ((await store.status(id))?.runs.running ?? 0) === 1);
    workers.push(await startWorker({ prefix, artifacts, extra }));
    await waitFor('done', async () => (await store.status(id))?.state === 'done', 120_000);
    const job = (await queue.getJob(`${id}-0`))!;
    expect(job.stalledCounter).toBe(0);
    expect(job.attemptsStarted).toBe(1);
    const [r] = await store.results(id);
    expect(r.timings.resumes).toBe(0);
    expect(r.timings.growSeconds).toBeGreaterThan(2); // the run outlived the 1 s lock at least twice over
    const text = await (await fetch(`http://127.0.0.1:${port}/metrics`)).text();
    expect(text).toMatch(/^tendril_particles_grown_total\{model="dla-offlattice-2d"\} \d+$/m);
    const grown = Number(/^tendril_particles_grown_total\{model="dla-offlattice-2d"\} (\d+)$/m.exec(text)![1]);
    expect(grown).toBeGreaterThan(590000);
    expect(grown).toBeLessThanOrEqual(600000);
    expect(text).toMatch(/^tendril_runs_finished_total\{outcome="stored"\} 1$/m);
    expect(text).toMatch(/^tendril_run_duration_seconds_count 1$/m);
    expect(text).toMatch(/^tendril_runs_active 0$/m);
  });
});
