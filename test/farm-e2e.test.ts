import { beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { buildSummary } from '../coordinator/summary/index.js';
import { checkpointKey } from '../worker/runtime/job-contract.js';
import { growInThreads } from './support/grow-in-thread.js';
import { stopWorker, waitFor } from './farm-helpers.js';
import { farmFixture } from './support/farm-fixture.js';

const { artifacts, store, queue, workers, startWorker, waitDone } = farmFixture('e2e');

/** The hash of run i grown directly (on a worker thread: never blocking the test runner). */
async function directHash(spec: ReturnType<typeof validateSpec>, i: number): Promise<string> {
  const [r] = await growInThreads([runTaskFor('x', spec, i)], 1);
  return r.stateHash;
}

describe('farm end to end (real Redis, two worker processes)', () => {
  beforeAll(async () => {
    await startWorker();
    await startWorker();
  });

  it('two workers give the same per-run hashes as the embedded run of the same spec', async () => {
    // clusters long enough (most of a second) that a busy worker cannot take the next job before the idle one
    const spec = validateSpec({ name: 'e2e', model: 'dla-offlattice-2d', particles: 100000, clusters: 4, seed: '77', runs_per_job: 1 });
    const id = await launchEnsemble(store, queue, spec);
    const status = await waitDone(id);
    expect(status.runs).toEqual({ planned: 4, queued: 0, running: 0, done: 4, failed: 0 });
    expect(status.particles.done).toBe(4 * 100000);
    const farm = await store.results(id);
    const local = await runEmbedded(spec, { ensembleId: 'local', threads: 2 });
    expect(farm.map((r) => r.stateHash)).toEqual(local.results.map((r) => r.stateHash));
    // both worker processes took part (4 jobs, one run each, two idle workers)
    expect(new Set(farm.map((r) => r.timings.finishedBy)).size).toBe(2);
    const summary = buildSummary({ ensembleId: id, spec, createdAtMs: 0, results: farm });
    expect(summary.clustersDone).toBe(4);
  });

  it('SIGKILL mid-run: the run resumes from its checkpoint on the other worker, same hash, counted once', async () => {
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 300000, clusters: 1, seed: '4242', checkpoint_every_particles: 30000 });
    // stop the second worker so that the first one surely takes the job
    await stopWorker(workers.pop(), 'SIGTERM');
    const id = await launchEnsemble(store, queue, spec);
    const cps = new DirectoryArtifactStore(artifacts);
    await waitFor('a checkpoint', async () => (await cps.get(checkpointKey(id, 0)))?.length, 60_000);
    const victim = workers.pop()!;
    await stopWorker(victim, 'SIGKILL');
    await startWorker();
    const s = await waitDone(id, 'ensemble done after the crash', 120_000);
    expect(s.runs.done).toBe(1);
    const [r] = await store.results(id);
    expect(r.timings.resumes).toBeGreaterThanOrEqual(1);
    expect(r.stateHash).toBe(await directHash(spec, 0));
    expect(await cps.get(checkpointKey(id, 0))).toBeNull();
  });

  it('SIGTERM: a worker checkpoints, hands its run back and exits within 10 s; another finishes it', async () => {
    // long enough (a few seconds) that the run is surely still growing when the signal comes
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 400000, clusters: 1, seed: '999', checkpoint_interval_seconds: 3600 });
    const id = await launchEnsemble(store, queue, spec);
    await waitFor('run in progress', async () => {
      const st = await store.status(id);
      return st && st.particles.done > 2000 && st.runs.running === 1;
    });
    const w = workers.pop()!;
    const t0 = Date.now();
    w.child.kill('SIGTERM');
    const code = await w.exited;
    expect(Date.now() - t0).toBeLessThan(10_000);
    expect(code).toBe(0);
    const cps = new DirectoryArtifactStore(artifacts);
    expect(await cps.get(checkpointKey(id, 0))).not.toBeNull();
    await startWorker();
    await waitDone(id, 'ensemble done after release', 120_000);
    const [r] = await store.results(id);
    expect(r.timings.resumes).toBe(1);
    expect(r.stateHash).toBe(await directHash(spec, 0));
  });

  it('a corrupt job payload fails only that job, with a reason; the worker goes on', async () => {
    const bad = await queue.add('grow', { v: 1, ensembleId: 'nope', tasks: ['!!!not base64'] }, { jobId: 'corrupt-1', attempts: 3 });
    const bad2 = await queue.add('grow', { v: 1, ensembleId: 'nope', tasks: [Buffer.from([0xff, 0xff, 0xff]).toString('base64')] }, { jobId: 'corrupt-2', attempts: 3 });
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 1000, clusters: 2, seed: 3 });
    const id = await launchEnsemble(store, queue, spec);
    await waitDone(id, 'good ensemble done');
    const f1 = await waitFor('bad job failed', async () => ((await bad.getState()) === 'failed' ? await queue.getJob('corrupt-1') : undefined));
    const f2 = await waitFor('bad job 2 failed', async () => ((await bad2.getState()) === 'failed' ? await queue.getJob('corrupt-2') : undefined));
    expect(f1!.failedReason).toBe('job payload tasks[0] is not base64 text');
    expect(f2!.failedReason).toMatch(/^RunTask: not a valid protobuf message/);
    expect(f1!.attemptsMade).toBe(1); // no retries for a payload that can never be read
    expect(workers[0].child.exitCode).toBeNull();
  });
});
