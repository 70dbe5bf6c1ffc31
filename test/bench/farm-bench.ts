/**
 * Farm overhead benchmark: the same ensemble grown (a) by two `tendril
 * worker` processes through BullMQ on Redis and (b) by the embedded mode on
 * two threads. Reports the throughput ratio farm / embedded and the per-job
 * queue round trip (launch of a one-run ensemble of a tiny cluster until its
 * result is stored), as one JSON line.
 *
 *   node dist/test/bench/farm-bench.js [--clusters 20] [--particles 300000]
 *
 * Needs the compiled tree (npm run build) and Redis at REDIS_URL.
 */
import type { ChildProcess } from 'node:child_process';
import { runEmbedded } from '../../coordinator/embedded/index.js';
import { launchEnsemble } from '../../coordinator/farm/queue.js';
import { validateSpec } from '../../coordinator/spec/index.js';
import { isEntryPoint, startBenchWorker, stopBenchWorkers, until } from './bench-process.js';
import { openBenchFarm } from './bench-farm.js';

export interface FarmBenchOptions {
  clusters?: number;
  particles?: number;
  redisUrl?: string;
  /** Tiny one-run ensembles timed for the queue round trip. */
  roundTrips?: number;
}

export interface FarmBenchResult {
  benchmark: 'farm-overhead';
  clusters: number;
  particles: number;
  embeddedSeconds: number;
  farmSeconds: number;
  embeddedParticlesPerSecond: number;
  farmParticlesPerSecond: number;
  /** farm throughput / embedded throughput (1 = no overhead). */
  throughputRatio: number;
  /** Median seconds from launching a one-run ensemble of 10 particles until its result is stored. */
  queueRoundTripSeconds: number;
  sameHashes: boolean;
  /** Mean kernel time per run (timings.growSeconds) in each mode: tells CPU contention from scheduling gaps. */
  embeddedGrowSecondsPerRun: number;
  farmGrowSecondsPerRun: number;
}

/** Workers report progress once a second (the default 2 s would delay the last run's accounting). */
const PROGRESS = ['--progress-ms', '1000'];

function meanGrow(runs: Array<{ timings: { growSeconds: number } }>): number {
  return runs.reduce((a, r) => a + r.timings.growSeconds, 0) / Math.max(1, runs.length);
}

export async function runFarmBenchmark(opts: FarmBenchOptions = {}): Promise<FarmBenchResult> {
  const clusters = opts.clusters ?? 20;
  // 3·10^5 particles: about two seconds per run, so that the per-job cost is judged against jobs of a realistic length
  const particles = opts.particles ?? 300_000;
  const redisUrl = opts.redisUrl ?? process.env.REDIS_URL ?? 'redis://127.0.0.1:6379';
  const spec = validateSpec({ name: 'farm bench', model: 'dla-offlattice-2d', particles, clusters, seed: '1234567', runs_per_job: 1 }, { maxTotalParticles: Number.MAX_SAFE_INTEGER });

  const t0 = performance.now();
  const local = await runEmbedded(spec, { ensembleId: 'bench-local', threads: 2 });
  const embeddedSeconds = (performance.now() - t0) / 1000;

  const benchFarm = openBenchFarm(redisUrl, 'farm');
  const { prefix, artifacts, store, queue } = benchFarm;
  const workers: ChildProcess[] = [];
  try {
    workers.push(await startBenchWorker(redisUrl, prefix, artifacts, PROGRESS), await startBenchWorker(redisUrl, prefix, artifacts, PROGRESS));
    const t1 = performance.now();
    const id = await launchEnsemble(store, queue, spec);
    await until(async () => (await store.status(id))?.state === 'done', 50);
    const farmSeconds = (performance.now() - t1) / 1000;
    const farm = await store.results(id);
    const sameHashes = farm.map((r) => r.stateHash).join() === local.results.map((r) => r.stateHash).join();

    const tiny = validateSpec({ model: 'dla-offlattice-2d', particles: 10, clusters: 1, seed: 1 });
    const trips: number[] = [];
    for (let i = 0; i < (opts.roundTrips ?? 20); i++) {
      const s = performance.now();
      const tid = await launchEnsemble(store, queue, tiny);
      await until(async () => store.hasResult(tid, 0), 2);
      trips.push((performance.now() - s) / 1000);
    }
    trips.sort((a, b) => a - b);
    const total = clusters * particles;
    return {
      benchmark: 'farm-overhead',
      clusters,
      particles,
      embeddedSeconds,
      farmSeconds,
      embeddedParticlesPerSecond: total / embeddedSeconds,
      farmParticlesPerSecond: total / farmSeconds,
      throughputRatio: embeddedSeconds / farmSeconds,
      queueRoundTripSeconds: trips[Math.floor(trips.length / 2)],
      sameHashes,
      embeddedGrowSecondsPerRun: meanGrow(local.results),
      farmGrowSecondsPerRun: meanGrow(farm),
    };
  } finally {
    await stopBenchWorkers(workers);
    await benchFarm.close();
  }
}

function arg(name: string): number | undefined {
  const i = process.argv.indexOf(name);
  return i > 0 ? Number(process.argv[i + 1]) : undefined;
}

if (isEntryPoint(import.meta.url)) {
  runFarmBenchmark({ clusters: arg('--clusters'), particles: arg('--particles') }).then(
    (r) => process.stdout.write(JSON.stringify(r) + '\n'),
    (err: Error) => {
      process.stderr.write(`farm-bench: ${err.message}\n`);
      process.exit(1);
    },
  );
}
