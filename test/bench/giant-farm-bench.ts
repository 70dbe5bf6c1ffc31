/**
 * `npm run bench -- --only giant-farm` (opt-in: not part of a plain
 * `npm run bench`, nor of CI): one giant off-lattice DLA cluster in the
 * plane (dla-offlattice-2d, default parameters, seed 7, one cluster) grown
 * as one farm job by one `tendril worker` (one thread) over Redis
 * (REDIS_URL), with a checkpoint every N/5 particles streamed by the growth
 * thread into the artifact folder.
 *
 * The first worker is SIGKILLed once two checkpoints are stored; a fresh
 * worker resumes from the newest and finishes. Printed as one JSON line:
 * the write time of each checkpoint and the read time of the resume (both
 * from the workers' 'run checkpointed' / 'run resumed' log lines, measured
 * in the growth thread), the checkpoint's size, each worker's peak resident
 * memory (VmHWM of /proc/PID/status just before it ends; Linux only) and
 * CPU seconds (utime + stime of /proc/PID/stat), the work lost to the kill
 * (the kill comes half-way between the second and third checkpoints; lost =
 * the particles last reported before the kill, or the newest checkpoint's if
 * more, minus the count resumed from; rule: at most one checkpoint
 * interval), and the final state hash.
 *
 *   node dist/test/bench/run-benchmarks.js --only giant-farm [--farm-size 10000000] [--no-kill]
 *
 * With --no-kill the first worker grows the cluster to its end (no kill, no
 * resume): its peak is that of a worker that grew all of it, to set beside
 * the resumed worker's (the resume fields are then null).
 *
 * Needs the compiled tree (npm run build) and Redis at REDIS_URL.
 */
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { launchEnsemble } from '../../coordinator/farm/queue.js';
import { validateSpec } from '../../coordinator/spec/index.js';
import { checkpointKey } from '../../worker/runtime/job-contract.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { argValue, isEntryPoint, type LoggedBenchWorker, startLoggedBenchWorker, stopBenchWorkers, until } from './bench-process.js';
import { openBenchFarm } from './bench-farm.js';

export const DEFAULT_GIANT_FARM_SIZE = 10_000_000;
const SEED = '7';
const CHECKPOINTS_PER_RUN = 5;

export interface GiantFarmRow {
  bench: 'giant-farm';
  engineVersion: string;
  particles: number;
  seed: string;
  checkpointEveryParticles: number;
  /** Checkpoints written by the first worker: particles and seconds of each write (in its growth thread). */
  checkpoints: Array<{ particles: number; writeSeconds: number }>;
  /** Bytes of the newest checkpoint file at the kill. */
  checkpointBytes: number;
  /** Whether the first worker was killed (false with --no-kill: it grew the whole cluster, and the resume fields are null). */
  killed: boolean;
  killedAtParticles: number | null;
  resumedFromParticles: number | null;
  lostParticles: number | null;
  /** lost <= checkpointEveryParticles. */
  lostWithinOneInterval: boolean | null;
  resumeReadSeconds: number | null;
  /** Checkpoints written by the second worker. */
  resumedCheckpoints: Array<{ particles: number; writeSeconds: number }>;
  firstWorker: { peakRssMB: number; cpuSeconds: number };
  secondWorker: { peakRssMB: number; cpuSeconds: number } | null;
  /** Peak RSS of the worker that grew the cluster to its end, per particle. */
  bytesPerParticle: number;
  growSecondsTotal: number;
  resumes: number;
  stateHash: string;
  nodeVersion: string;
}

/** One worker thread, progress every second, and the log lines this benchmark reads. */
const WORKER_ARGS = ['--progress-ms', '1000', '--log-level', 'info'];

/** Peak resident memory (MiB) and CPU seconds (user + system) of a live Linux process. */
function usageOf(pid: number): { peakRssMB: number; cpuSeconds: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const hwm = Number(/^VmHWM:\s+(\d+) kB$/m.exec(status)?.[1] ?? NaN);
  // fields after the command name in parentheses: utime and stime are the 14th and 15th of the whole line
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const rest = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  const ticks = Number(rest[11]) + Number(rest[12]);
  return { peakRssMB: Math.round((hwm / 1024) * 10) / 10, cpuSeconds: ticks / 100 };
}

export async function runGiantFarmBenchmark(particles = DEFAULT_GIANT_FARM_SIZE, redisUrl = process.env.REDIS_URL ?? 'redis://127.0.0.1:6379', kill = true): Promise<GiantFarmRow> {
  const every = Math.max(1, Math.floor(particles / CHECKPOINTS_PER_RUN));
  const spec = validateSpec(
    { name: `giant farm ${particles}`, model: 'dla-offlattice-2d', particles, clusters: 1, seed: SEED, checkpoint_every_particles: every, checkpoint_interval_seconds: 86_400 },
    { maxTotalParticles: Number.MAX_SAFE_INTEGER },
  );
  const farm = openBenchFarm(redisUrl, 'giant-farm');
  const { prefix, artifacts, redis, store, queue } = farm;
  const procs: LoggedBenchWorker[] = [];
  try {
    const first = await startLoggedBenchWorker(redisUrl, prefix, artifacts, WORKER_ARGS);
    procs.push(first);
    const id = await launchEnsemble(store, queue, spec);
    const written = (p: LoggedBenchWorker) => p.log().filter((l) => l.ensembleId === id && l.msg === 'run checkpointed').map((l) => ({ particles: l.particles as number, writeSeconds: l.seconds ?? NaN }));
    process.stderr.write(`giant-farm: growing ${particles} particles as one farm job, checkpoint every ${every}${kill ? '' : ', no kill'}\n`);
    /** Usage of a live worker, sampled every second until the ensemble is done: the last sample before the result is stored is the peak of growth. */
    const untilDone = async (p: LoggedBenchWorker) => {
      let usage = { peakRssMB: NaN, cpuSeconds: NaN };
      await until(async () => {
        if (p.child.exitCode === null) usage = usageOf(p.child.pid!);
        return (await store.status(id))?.state === 'done';
      }, 1000);
      return p.child.exitCode === null ? usageOf(p.child.pid!) : usage;
    };
    if (!kill) {
      const whole = await untilDone(first);
      const [result] = await store.results(id);
      return {
        bench: 'giant-farm', engineVersion: ENGINE_VERSION, particles, seed: SEED, checkpointEveryParticles: every,
        checkpoints: written(first), checkpointBytes: 0, killed: false, killedAtParticles: null, resumedFromParticles: null,
        lostParticles: null, lostWithinOneInterval: null, resumeReadSeconds: null, resumedCheckpoints: [],
        firstWorker: whole, secondWorker: null, bytesPerParticle: Math.round((whole.peakRssMB * 1024 * 1024) / particles),
        growSecondsTotal: result.timings.growSeconds, resumes: result.timings.resumes, stateHash: result.stateHash, nodeVersion: process.version,
      };
    }
    // killed half-way between two checkpoints, after the second
    const progress = async () => Number((await redis.hget(`${prefix}:ensemble:${id}:progress`, '0')) ?? 0);
    await until(async () => written(first).length >= 2 && (await progress()) >= written(first)[1].particles + every / 2, 1000);
    const firstUsage = usageOf(first.child.pid!);
    first.child.kill('SIGKILL');
    await first.exited;
    const checkpoints = written(first);
    // the count last reported (a lower bound of the count at the kill: reports come every second), or the newest checkpoint if larger
    const killedAtParticles = Math.max(await progress(), checkpoints[checkpoints.length - 1].particles);
    const checkpointBytes = statSync(join(artifacts, checkpointKey(id, 0))).size;
    process.stderr.write(`giant-farm: first worker killed at ${killedAtParticles} particles after ${checkpoints.length} checkpoints; a fresh worker resumes\n`);

    const second = await startLoggedBenchWorker(redisUrl, prefix, artifacts, WORKER_ARGS);
    procs.push(second);
    const secondUsage = await untilDone(second);
    const resumed = second.log().find((l) => l.ensembleId === id && l.msg === 'run resumed');
    if (!resumed) throw new Error('the second worker did not log a resume');
    const [result] = await store.results(id);
    const resumedFromParticles = resumed.particles as number;
    const lostParticles = killedAtParticles - resumedFromParticles;
    return {
      bench: 'giant-farm',
      engineVersion: ENGINE_VERSION,
      particles,
      seed: SEED,
      checkpointEveryParticles: every,
      checkpoints,
      checkpointBytes,
      killed: true,
      killedAtParticles,
      resumedFromParticles,
      lostParticles,
      lostWithinOneInterval: lostParticles <= every,
      resumeReadSeconds: resumed.seconds ?? NaN,
      resumedCheckpoints: written(second),
      firstWorker: firstUsage,
      secondWorker: secondUsage,
      bytesPerParticle: Math.round((secondUsage.peakRssMB * 1024 * 1024) / particles),
      growSecondsTotal: result.timings.growSeconds,
      resumes: result.timings.resumes,
      stateHash: result.stateHash,
      nodeVersion: process.version,
    };
  } finally {
    await stopBenchWorkers(procs.map((p) => p.child));
    await farm.close();
  }
}

/** `--farm-size N` from the arguments, default 10^7. */
export function giantFarmSizeFromArgs(argv: string[]): number {
  return argValue(argv, '--farm-size', DEFAULT_GIANT_FARM_SIZE);
}

/** False with `--no-kill` (the first worker grows the whole cluster). */
export function giantFarmKillFromArgs(argv: string[]): boolean {
  return !argv.includes('--no-kill');
}

if (isEntryPoint(import.meta.url)) {
  runGiantFarmBenchmark(giantFarmSizeFromArgs(process.argv.slice(2)), undefined, giantFarmKillFromArgs(process.argv.slice(2))).then(
    (r) => process.stdout.write(JSON.stringify(r) + '\n'),
    (err: Error) => {
      process.stderr.write(`giant-farm-bench: ${err.message}\n`);
      process.exit(1);
    },
  );
}
