/**
 * Probe scaling benchmark: one grown DLA cluster (default 10^6 particles)
 * probed with W walkers (default 10^7) as a probe request on the farm
 * (coordinator/farm/probe-requests.ts), first by one `tendril worker`
 * process, then by two, each with one thread, through BullMQ on Redis
 * (REDIS_URL). Reports both wall times (launch until the measures are
 * stored) and the scaling ratio t2 / (t1 / 2) (1 = perfect; the target is
 * at most 1.2), and whether both runs gave identical measures.
 *
 *   node dist/test/bench/probe-scaling-bench.js [--particles N] [--walkers W] [--jobs K]
 *
 * Needs the compiled tree (npm run build). Prints one JSON line.
 */
import { axisOf } from '../../worker/core/positions.js';
import type { ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { runQueue } from '../../coordinator/farm/queue.js';
import { launchProbeRequest, ProbeRequestStore } from '../../coordinator/farm/probe-requests.js';
import { createKernel, defaultModelParams } from '../../worker/models/registry.js';
import { argValue, isEntryPoint, startBenchWorker, stopBenchWorkers } from './bench-process.js';

export interface ProbeScalingResult {
  benchmark: 'probe-scaling';
  particles: number;
  walkers: number;
  jobs: number;
  growSeconds: number;
  oneWorkerSeconds: number;
  twoWorkerSeconds: number;
  oneWorkerWalkersPerSecond: number;
  twoWorkerWalkersPerSecond: number;
  /** t2 / (t1 / 2): 1 = perfect scaling; the target is at most 1.2. */
  scalingRatio: number;
  sameMeasures: boolean;
}

export async function runProbeScalingBenchmark(o: { particles?: number; walkers?: number; jobs?: number; redisUrl?: string } = {}): Promise<ProbeScalingResult> {
  const particles = o.particles ?? 1_000_000;
  const walkers = o.walkers ?? 10_000_000;
  const jobs = o.jobs ?? 40;
  const redisUrl = o.redisUrl ?? process.env.REDIS_URL ?? 'redis://127.0.0.1:6379';
  let t = performance.now();
  const kernel = createKernel({ model: defaultModelParams('dla-offlattice-2d'), particles, ensembleSeed: '2027', runIndex: 0, recordsPerDecade: 10 });
  kernel.growTo(particles);
  const growSeconds = (performance.now() - t) / 1000;
  const p = kernel.positions();
  const set = { count: particles, x: axisOf(p, 0, particles), y: axisOf(p, 1, particles), r: new Float64Array(particles).fill(1) };
  const prefix = `tendril-bench-probe-${process.pid}`;
  const redis = new Redis(redisUrl, { maxRetriesPerRequest: null });
  const store = new ProbeRequestStore(redis, prefix);
  const queue = runQueue(redis, prefix);
  const settings = { name: 'probe scaling', walkers, seed: '99', jobs, q: [0, 1, 2, 3], contactSample: 4000, minStep: 0.02, window: null };
  const timed = async (workers: number): Promise<{ seconds: number; measures: string }> => {
    const artifacts = mkdtempSync(join(tmpdir(), 'tendril-probe-bench-'));
    const children: ChildProcess[] = [];
    try {
      for (let w = 0; w < workers; w++) children.push(await startBenchWorker(redisUrl, prefix, artifacts));
      t = performance.now();
      const id = await launchProbeRequest(store, queue, settings, set);
      for (;;) {
        const s = await store.status(id);
        if (s?.state === 'failed') throw new Error(`probe request failed: ${s.failure}`);
        if (s?.state === 'done') {
          const seconds = (performance.now() - t) / 1000;
          const m = { ...s.measures };
          await store.purge(id);
          return { seconds, measures: JSON.stringify(m) };
        }
        await new Promise((r) => setTimeout(r, 100));
      }
    } finally {
      await stopBenchWorkers(children);
      rmSync(artifacts, { recursive: true, force: true });
    }
  };
  try {
    const one = await timed(1);
    const two = await timed(2);
    return {
      benchmark: 'probe-scaling', particles, walkers, jobs, growSeconds,
      oneWorkerSeconds: one.seconds, twoWorkerSeconds: two.seconds,
      oneWorkerWalkersPerSecond: walkers / one.seconds, twoWorkerWalkersPerSecond: walkers / two.seconds,
      scalingRatio: two.seconds / (one.seconds / 2),
      sameMeasures: one.measures === two.measures,
    };
  } finally {
    await queue.obliterate({ force: true }).catch(() => undefined);
    await queue.close();
    redis.disconnect();
  }
}

if (isEntryPoint(import.meta.url)) {
  const a = process.argv;
  const r = await runProbeScalingBenchmark({ particles: argValue(a, '--particles', 1_000_000), walkers: argValue(a, '--walkers', 10_000_000), jobs: argValue(a, '--jobs', 40) });
  process.stdout.write(`probe scaling: ${r.walkers} walkers on ${r.particles} particles: 1 worker ${r.oneWorkerSeconds.toFixed(1)} s, 2 workers ${r.twoWorkerSeconds.toFixed(1)} s, ratio ${r.scalingRatio.toFixed(3)}\n`);
  process.stdout.write(JSON.stringify(r) + '\n');
}
