/**
 * Workers as a Slurm job array (deploy/slurm/tendril-worker.sbatch) on a real
 * single-node Slurm cluster that the test starts itself (test/slurm-cluster.ts).
 * Three array tasks on a node with room for two: while tasks 0 and 1 grow
 * runs, task 0 is cancelled with scancel and task 1's batch shell alone gets
 * SIGTERM (what --signal=B:TERM@60 sends before the time limit), which it must
 * pass on to its workers. Both hand their runs back; task 2 starts on the freed
 * cores, resumes them from their checkpoints, finishes the ensemble and exits
 * by itself once the queue is empty. Every per-run hash must equal the
 * embedded mode's, and every run is counted once.
 * Skipped, with the reason printed, where the daemons cannot run (not root,
 * slurm-wlm or munge missing, a daemon that does not come up).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { launchEnsemble, runQueue } from '../coordinator/farm/queue.js';
import { EnsembleStore } from '../coordinator/farm/store.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { CLI, deleteKeys, REDIS_URL, ROOT, sleep, tempDir, uniquePrefix, waitFor } from './farm-helpers.js';
import { startSlurm, type SlurmCluster } from './slurm-cluster.js';

const SBATCH = join(ROOT, 'deploy', 'slurm', 'tendril-worker.sbatch');
const prefix = uniquePrefix('slurm');
const artifacts = tempDir('slurm-artifacts');
const redis = new Redis(REDIS_URL, { maxRetriesPerRequest: null });
const store = new EnsembleStore(redis, prefix);
const queue = runQueue(redis, prefix);
let slurm: SlurmCluster | undefined;
let skipReason: string | undefined;

beforeAll(async () => {
  const got = await startSlurm();
  if ('reason' in got) skipReason = got.reason;
  else slurm = got;
});

afterAll(async () => {
  if (slurm) {
    try {
      slurm.run('scancel', ['--user=root']);
    } catch {
      // nothing left to cancel
    }
    await slurm.stop();
  }
  await queue.close();
  await deleteKeys(redis, prefix);
  redis.disconnect();
  rmSync(artifacts, { recursive: true, force: true });
});

function outputs(dir: string): Record<string, string> {
  const o: Record<string, string> = {};
  for (const f of readdirSync(dir).filter((n) => n.startsWith('out-'))) o[f] = readFileSync(join(dir, f), 'utf8');
  return o;
}

describe('Slurm job array of workers', () => {
  it('array tasks cancelled or warned of their time limit mid-run hand their runs back; the next task completes the ensemble with the embedded hashes, each run counted once', async (ctx) => {
    if (!slurm) {
      console.warn(`slurm-array test skipped: ${skipReason}`);
      ctx.skip();
      return;
    }
    const s = slurm;
    // runs of a few seconds each, checkpointed often, one run per job
    const particles = 200_000;
    const spec = validateSpec({ name: 'slurm', model: 'dla-offlattice-2d', particles, clusters: 4, seed: '2718', runs_per_job: 1, checkpoint_every_particles: 20_000 });
    const id = await launchEnsemble(store, queue, spec);
    const env = {
      ...s.env,
      REDIS_URL,
      TENDRIL_PREFIX: prefix,
      TENDRIL_ARTIFACTS: artifacts,
      TENDRIL: `${process.execPath} ${CLI}`,
      TENDRIL_EXIT_WHEN_IDLE: '3',
      TENDRIL_WORKER_ARGS: '--lock-ms 3000 --stalled-ms 1000 --progress-ms 200',
    };
    const jobId = execFileSync('sbatch', ['--parsable', '--array=0-2', '--cpus-per-task=1', `--output=${join(s.dir, 'out-%A_%a.txt')}`, SBATCH], { env, cwd: s.dir, encoding: 'utf8' }).trim().split(';')[0];
    expect(jobId).toMatch(/^\d+$/);
    // tasks 0 and 1 grow a run each (task 2 waits for cores): cancel task 0, warn task 1's batch shell
    await waitFor('two array tasks growing', async () => {
      const st = await store.status(id);
      return st && st.runs.running === 2 && st.particles.done > 20_000;
    }, 300_000);
    expect(s.run('squeue', ['-h', '-j', jobId, '-t', 'PENDING', '-o', '%i']).trim()).toBe(`${jobId}_2`);
    s.run('scancel', [`${jobId}_0`]);
    s.run('scancel', ['--batch', '--signal=TERM', `${jobId}_1`]);
    const done = await waitFor('ensemble done', async () => {
      const st = await store.status(id);
      return st?.state === 'done' ? st : undefined;
    }, 900_000);
    // the remaining task ends by itself once the queue stays empty
    await waitFor('array finished', async () => s.run('squeue', ['-h', '-j', jobId]).trim() === '', 120_000);
    await sleep(500);
    const out = outputs(s.dir);
    const t0 = out[`out-${jobId}_0.txt`] ?? '';
    const t1 = out[`out-${jobId}_1.txt`] ?? '';
    const t2 = out[`out-${jobId}_2.txt`] ?? '';
    expect(t0).toContain('SIGTERM: checkpointing active runs and handing them back');
    // only the batch shell of task 1 was signalled: it passed the signal on
    expect(t1).toContain(`task ${jobId}_1 got SIGTERM: passing it to 1 worker(s)`);
    expect(t1).toContain('SIGTERM: checkpointing active runs and handing them back');
    expect(t1).toContain('all workers ended (exit 0)');
    expect(t2).toContain('the run queue had no pending job for 3 s: exiting');
    expect(t2).toContain('all workers ended (exit 0)');

    expect(done.runs).toEqual({ planned: 4, queued: 0, running: 0, done: 4, failed: 0 });
    expect(done.particles.done).toBe(4 * particles); // each run counted once
    const farm = await store.results(id);
    expect(farm.map((r) => r.runIndex)).toEqual([0, 1, 2, 3]);
    // the runs tasks 0 and 1 held were resumed from their checkpoints
    expect(farm.some((r) => r.timings.resumes >= 1)).toBe(true);
    const local = await runEmbedded(spec, { ensembleId: 'local', threads: 1 });
    expect(farm.map((r) => r.stateHash)).toEqual(local.results.map((r) => r.stateHash));
  });
});
