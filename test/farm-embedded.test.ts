import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runEmbedded, EmbeddedAborted } from '../coordinator/embedded/index.js';
import { DirectoryArtifactStore } from '../coordinator/farm/artifacts.js';
import { checkpointKey } from '../worker/runtime/job-contract.js';
import { planEnsemble, runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { buildSummary, logLogFit, summaryToCsv, summaryToJsonObject } from '../coordinator/summary/index.js';
import { decodeCheckpoint, decodeEnsembleSummary, encodeEnsembleSummary, growthTaskOf, type CheckpointData } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { runTask, TaskRejected } from '../worker/runtime/task-runner.js';
import { growInThreads } from './support/grow-in-thread.js';

const dirs: string[] = [];
const tmp = () => {
  const d = mkdtempSync(join(tmpdir(), 'tendril-embedded-'));
  dirs.push(d);
  return d;
};
afterAll(() => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

const spec = validateSpec({ name: 'embedded test', model: 'dla-offlattice-2d', particles: 1500, clusters: 6, seed: '987654321987654321', runs_per_job: 2 });

function directHash(runIndex: number): string {
  const k = createKernel(growthTaskOf(runTaskFor('x', spec, runIndex)));
  k.growTo(spec.particles);
  return k.result().stateHash;
}

describe('plan', () => {
  it('gives run i the seed (ensemble seed, i) and groups runs into jobs', () => {
    const plan = planEnsemble('e1', spec);
    expect(plan.jobs.map((j) => j.runs.map((r) => r.runIndex))).toEqual([[0, 1], [2, 3], [4, 5]]);
    for (const r of plan.jobs.flatMap((j) => j.runs)) expect(r.ensembleSeed).toBe('987654321987654321');
    expect(() => planEnsemble('bad id!', spec)).toThrow(/ensemble id/);
  });
});

describe('task runner', () => {
  it('checkpoints by particle count; resuming from any checkpoint gives the uninterrupted hash', async () => {
    const run = { ...runTaskFor('e1', spec, 3), checkpointEveryParticles: 400 };
    const checkpoints: CheckpointData[] = [];
    const full = await runTask(run, { onCheckpoint: (c) => void checkpoints.push(c) });
    expect(full.status).toBe('done');
    expect(checkpoints.map((c) => c.state.count)).toEqual([400, 800, 1200]);
    const hash = full.status === 'done' ? full.result.stateHash : '';
    expect(hash).toBe(directHash(3));
    for (const c of checkpoints) {
      const resumed = await runTask(run, { checkpoint: c });
      expect(resumed.status).toBe('done');
      if (resumed.status === 'done') {
        expect(resumed.result.stateHash).toBe(hash);
        expect(resumed.result.timings.resumes).toBe(1);
      }
    }
  });

  it('stops on request with a checkpoint that resumes to the same hash', async () => {
    const run = runTaskFor('e1', spec, 1);
    let calls = 0;
    const stopped = await runTask(run, { chunkSeconds: 1e-9, shouldStop: () => ++calls > 3 });
    expect(stopped.status).toBe('stopped');
    if (stopped.status !== 'stopped') return;
    expect(stopped.checkpoint.state.count).toBeLessThan(spec.particles);
    const done = await runTask(run, { checkpoint: stopped.checkpoint });
    expect(done.status === 'done' && done.result.stateHash).toBe(directHash(1));
  });

  it('rejects a task of another engine version and an invalid model with a reason', async () => {
    await expect(runTask({ ...runTaskFor('e1', spec, 0), engineVersion: 'other/9' })).rejects.toThrow(TaskRejected);
    await expect(runTask({ ...runTaskFor('e1', spec, 0), model: { kind: 'dla-offlattice-2d', params: { min_step: -1, launch_margin: 2 } } })).rejects.toThrow(
      /task of run 0 is invalid: params\.min_step: -1 is out of range/,
    );
  });
});

describe('embedded mode', () => {
  it('grows every run on worker threads with the same hashes as the kernel run directly', async () => {
    const out = await runEmbedded(spec, { ensembleId: 'emb1', threads: 2 });
    expect(out.results.map((r) => r.runIndex)).toEqual([0, 1, 2, 3, 4, 5]);
    for (const r of out.results) expect(r.stateHash).toBe(directHash(r.runIndex));
    expect(out.summary.clustersDone).toBe(6);
    const fit = out.summary.radiusOfGyrationFit!;
    expect(fit.points).toBeGreaterThan(5);
    // D ≈ 1.71 for off-lattice DLA in 2D (Tolman & Meakin 1989, Phys. Rev. A 40, 428; from memory);
    // small clusters bias the plain fit, so only a loose band is checked.
    expect(1 / fit.exponent).toBeGreaterThan(1.5);
    expect(1 / fit.exponent).toBeLessThan(1.95);
    const back = decodeEnsembleSummary(encodeEnsembleSummary(out.summary));
    expect(back.runs.map((r) => r.stateHash)).toEqual(out.results.map((r) => r.stateHash));
  });

  it('an interrupted run keeps checkpoints and continues to the same hashes', async () => {
    const store = new DirectoryArtifactStore(tmp());
    const big = validateSpec({ model: 'dla-offlattice-2d', particles: 200000, clusters: 2, seed: 5, checkpoint_every_particles: 20000 });
    const abort = new AbortController();
    const first = runEmbedded(big, {
      ensembleId: 'emb2',
      threads: 2,
      store,
      signal: abort.signal,
      onProgress: (p) => {
        if (p.particlesDone > 30000) abort.abort();
      },
    });
    await expect(first).rejects.toThrow(EmbeddedAborted);
    const cps = await store.list('emb2/');
    expect(cps.length).toBeGreaterThan(0);
    const cp = decodeCheckpoint((await store.get(checkpointKey('emb2', 0)))!);
    expect(cp.state.count).toBeLessThan(200000);
    const second = await runEmbedded(big, { ensembleId: 'emb2', threads: 2, store });
    // the reference hashes grow on worker threads: 2 x 200000 particles in-process would block the test runner
    const direct = await growInThreads(second.results.map((r) => runTaskFor('x', big, r.runIndex)));
    expect(second.results.map((r) => r.stateHash)).toEqual(direct.map((r) => r.stateHash));
    expect(second.results.some((r) => r.timings.resumes > 0)).toBe(true);
    // a third call only reads the stored results
    const third = await runEmbedded(big, { ensembleId: 'emb2', threads: 1, store });
    expect(third.reused).toBe(2);
    expect(third.results.map((r) => r.stateHash)).toEqual(second.results.map((r) => r.stateHash));
  });
});

describe('summary', () => {
  it('fits an exact power law exactly', () => {
    const xs = [10, 100, 1000, 10000];
    const f = logLogFit(xs, xs.map((x) => 0.7 * x ** 0.6), 0)!;
    expect(f.exponent).toBeCloseTo(0.6, 12);
    expect(f.prefactor).toBeCloseTo(0.7, 12);
    expect(f.rSquared).toBeCloseTo(1, 12);
    expect(logLogFit([10], [1])).toBeNull();
  });

  it('counts a run present twice once and passes results to the statistics hook', async () => {
    const r = await runTask(runTaskFor('e9', spec, 0));
    if (r.status !== 'done') throw new Error('not done');
    let seen = 0;
    const s = buildSummary(
      { ensembleId: 'e9', spec, createdAtMs: 0, results: [r.result, { ...r.result, stateHash: 'other' }] },
      { enrich: (runs) => ((seen = runs.length), { note: 'from the hook' }) },
    );
    expect(s.clustersDone).toBe(1);
    expect(seen).toBe(1);
    expect(s.runs[0].stateHash).toBe(r.result.stateHash);
    expect(summaryToJsonObject(s).statistics).toEqual({ note: 'from the hook' });
    const csv = summaryToCsv(s).trim().split('\n');
    expect(csv[0]).toBe('run_index,state_hash,size,radius_of_gyration,max_radius,center_offset,fold_amplitude_4,axis_ratio_4,fold_amplitude_6,axis_ratio_6,shell_count,fold_phase_4,fold_phase_6');
    expect(csv.length).toBe(1 + r.result.series.sizes.length);
  });
});

describe('worker-thread pool', () => {
  it('runs as many tasks at once as it has threads (no two runs share a thread)', async () => {
    const { TaskThreadPool } = await import('../worker/runtime/task-thread.js');
    const pool = new TaskThreadPool(2);
    const spec = validateSpec({ model: 'dla-offlattice-2d', particles: 20000, clusters: 4, seed: 3 });
    const tasks = [0, 1, 2, 3].map((i) => runTaskFor('pool-test', spec, i));
    const started: number[] = [];
    let concurrent = 0;
    let maxConcurrent = 0;
    await Promise.all(
      tasks.map(async (t) => {
        const h = pool.run(t, {
          onProgress: () => {
            if (!started.includes(t.runIndex)) {
              started.push(t.runIndex);
              concurrent++;
              maxConcurrent = Math.max(maxConcurrent, concurrent);
            }
          },
        });
        await h.outcome;
        concurrent--;
      }),
    );
    await pool.close();
    expect(maxConcurrent).toBe(2);
  }, 120_000);
});
