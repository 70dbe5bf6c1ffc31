/**
 * Soak benchmark (opt-in, never in CI; issue #11): one ensemble grown by two
 * `tendril worker` processes on a Redis of its own (AOF, fsync every second)
 * while a seeded chaos loop SIGKILLs a random worker every `--kill-every`
 * seconds (a fresh one replaces it) and `kill -9`s Redis every
 * `--redis-every` seconds (restarted on the same AOF). Reports, as one JSON
 * line:
 *   runsLost       planned runs with no stored result once the farm is idle
 *   runsDoubled    runs reported grown to completion by more than one job
 *                  (sum of the jobs' `done` counts minus the runs stored)
 *   hashesDiffering  stored state hashes that differ from the same run grown
 *                  undisturbed in this process (every resumed run, plus a
 *                  seeded sample of `--check` others)
 *   workerRssMb    resident memory of workers sampled just before each kill
 *                  (first and last), and of the survivors at the end
 * All three counts must be 0. While it runs, a progress line per kill goes to
 * stderr (wall minutes, runs done, kills, restarts, RSS of the last victim).
 *
 *   node dist/test/bench/soak-bench.js [--minutes 60] [--kill-every 60] [--redis-every 600]
 *        [--particles 50000] [--check 20]
 *
 * The cluster count is sized from one timed run so that the ensemble lasts
 * about `--minutes` on two workers. Needs the compiled tree (npm run build)
 * and redis-server on the PATH.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { launchEnsemble, runQueue } from '../../coordinator/farm/queue.js';
import { EnsembleStore } from '../../coordinator/farm/store.js';
import { runTaskFor } from '../../coordinator/plan.js';
import { validateSpec } from '../../coordinator/spec/index.js';
import { growthTaskOf } from '../../proto/convert.js';
import { createKernel } from '../../worker/models/registry.js';
import { argValue, isEntryPoint, startBenchWorker } from './bench-process.js';

export interface SoakOptions {
  minutes: number;
  killEverySeconds: number;
  redisEverySeconds: number;
  particles: number;
  check: number;
  seed?: number;
}

export interface SoakResult {
  benchmark: 'soak';
  minutes: number;
  wallMinutes: number;
  clusters: number;
  particles: number;
  workerKills: number;
  redisRestarts: number;
  runsLost: number;
  runsDoubled: number;
  runsResumed: number;
  hashesChecked: number;
  hashesDiffering: number;
  workerRssMb: { firstKilled: number | null; lastKilled: number | null; survivorsAtEnd: number[] };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      s.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
    });
  });
}

function rssMb(pid: number | undefined): number | null {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Math.round(Number(m[1]) / 1024) : null;
  } catch {
    return null;
  }
}

/** Seeded uniform numbers in [0, 1) (mulberry32). */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

class SoakRedis {
  child: ChildProcess | null = null;
  constructor(readonly port: number, readonly dir: string) {}
  get url(): string {
    return `redis://127.0.0.1:${this.port}`;
  }
  async start(): Promise<void> {
    this.child = spawn('redis-server', ['--port', String(this.port), '--bind', '127.0.0.1', '--dir', this.dir, '--appendonly', 'yes', '--appendfsync', 'everysec', '--save', ''], { stdio: 'ignore' });
    const probe = new Redis(this.url, { lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
    probe.on('error', () => undefined);
    for (let i = 0; i < 400; i++) {
      try {
        if (probe.status !== 'ready') await probe.connect();
        if ((await probe.ping()) === 'PONG') break;
      } catch {
        probe.disconnect();
      }
      await sleep(50);
    }
    probe.disconnect();
  }
  async kill9(): Promise<void> {
    const c = this.child;
    if (!c || c.exitCode !== null) return;
    const done = new Promise((r) => c.once('exit', r));
    c.kill('SIGKILL');
    await done;
  }
}

export async function runSoak(o: SoakOptions): Promise<SoakResult> {
  const random = rng(o.seed ?? 20261203);
  // one undisturbed run sizes the ensemble: two workers for `minutes`
  const probeSpec = validateSpec({ model: 'dla-offlattice-2d', particles: o.particles, clusters: 1, seed: 1 });
  const t0 = performance.now();
  createKernel(growthTaskOf(runTaskFor('size', probeSpec, 0))).growTo(o.particles);
  const perRun = (performance.now() - t0) / 1000;
  const clusters = Math.max(4, Math.round((o.minutes * 60 * 2) / perRun));
  const spec = validateSpec(
    { name: 'soak', model: 'dla-offlattice-2d', particles: o.particles, clusters, seed: '777', runs_per_job: 1, checkpoint_every_particles: Math.max(1, Math.floor(o.particles / 4)) },
    { maxTotalParticles: Number.MAX_SAFE_INTEGER },
  );

  const dir = mkdtempSync(join(tmpdir(), 'tendril-soak-'));
  const redisServer = new SoakRedis(await freePort(), join(dir));
  await redisServer.start();
  const artifacts = join(dir, 'artifacts');
  const prefix = 'soak';
  const redis = new Redis(redisServer.url, { maxRetriesPerRequest: null });
  redis.on('error', () => undefined);
  const store = new EnsembleStore(redis, prefix);
  const queue = runQueue(redis, prefix);
  queue.on('error', () => undefined);
  const workerArgs = ['--lock-ms', '5000', '--stalled-ms', '2000', '--progress-ms', '1000'];
  const workers: ChildProcess[] = [];
  let workerKills = 0;
  let redisRestarts = 0;
  const killedRss: number[] = [];
  const started = performance.now();
  try {
    workers.push(await startBenchWorker(redisServer.url, prefix, artifacts, workerArgs), await startBenchWorker(redisServer.url, prefix, artifacts, workerArgs));
    const id = await launchEnsemble(store, queue, spec);
    let nextKill = performance.now() + o.killEverySeconds * 1000;
    let nextRedis = performance.now() + o.redisEverySeconds * 1000;
    // chaos until the ensemble is done (or three times the planned length)
    const giveUp = performance.now() + 3 * o.minutes * 60_000 + 120_000;
    for (;;) {
      await sleep(500);
      const now = performance.now();
      const status = await store.status(id).catch(() => undefined);
      const state = status?.state;
      if (state === 'done' || state === 'failed' || now > giveUp) break;
      if (now >= nextKill && status) {
        // one progress line per kill on stderr, so a soak stopped early still leaves its figures
        process.stderr.write(
          JSON.stringify({ soakProgress: { wallMinutes: Number(((now - started) / 60_000).toFixed(2)), runsDone: status.runs.done, clusters: spec.clusters, workerKills, redisRestarts, killedRssMb: killedRss.slice(-1)[0] ?? null } }) + '\n',
        );
      }
      if (now >= nextKill) {
        nextKill = now + o.killEverySeconds * 1000;
        const i = Math.floor(random() * workers.length);
        const victim = workers[i];
        const rss = rssMb(victim.pid);
        if (rss !== null) killedRss.push(rss);
        victim.kill('SIGKILL');
        workerKills++;
        workers[i] = await startBenchWorker(redisServer.url, prefix, artifacts, workerArgs);
      }
      if (now >= nextRedis) {
        nextRedis = now + o.redisEverySeconds * 1000;
        await redisServer.kill9();
        await sleep(1000);
        await redisServer.start();
        redisRestarts++;
      }
    }
    const survivorsAtEnd = workers.map((w) => rssMb(w.pid)).filter((v): v is number => v !== null);
    const results = await store.results(id);
    const runsLost = spec.clusters - results.length;
    let jobsDone = 0;
    for (const job of await queue.getCompleted(0, -1)) jobsDone += Number((job.returnvalue as { done?: number } | undefined)?.done ?? 0);
    const runsDoubled = Math.max(0, jobsDone - results.length);
    const resumed = results.filter((r) => r.timings.resumes > 0);
    const others = results.filter((r) => r.timings.resumes === 0);
    const sample = [...resumed];
    for (let k = 0; k < o.check && others.length > 0; k++) sample.push(others.splice(Math.floor(random() * others.length), 1)[0]);
    let hashesDiffering = 0;
    for (const r of sample) {
      const k = createKernel(growthTaskOf(runTaskFor(id, spec, r.runIndex)));
      k.growTo(spec.particles);
      if (k.result().stateHash !== r.stateHash) hashesDiffering++;
    }
    return {
      benchmark: 'soak',
      minutes: o.minutes,
      wallMinutes: (performance.now() - started) / 60_000,
      clusters: spec.clusters,
      particles: spec.particles,
      workerKills,
      redisRestarts,
      runsLost,
      runsDoubled,
      runsResumed: resumed.length,
      hashesChecked: sample.length,
      hashesDiffering,
      workerRssMb: { firstKilled: killedRss[0] ?? null, lastKilled: killedRss[killedRss.length - 1] ?? null, survivorsAtEnd },
    };
  } finally {
    for (const w of workers) if (w.exitCode === null && w.signalCode === null) w.kill('SIGKILL');
    await queue.close().catch(() => undefined);
    redis.disconnect();
    await redisServer.kill9();
    rmSync(dir, { recursive: true, force: true });
  }
}

if (isEntryPoint(import.meta.url)) {
  const argv = process.argv.slice(2);
  runSoak({
    minutes: argValue(argv, '--minutes', 60),
    killEverySeconds: argValue(argv, '--kill-every', 60),
    redisEverySeconds: argValue(argv, '--redis-every', 600),
    particles: argValue(argv, '--particles', 50_000),
    check: argValue(argv, '--check', 20),
  }).then(
    (r) => {
      process.stdout.write(JSON.stringify(r) + '\n');
      process.exit(r.runsLost === 0 && r.runsDoubled === 0 && r.hashesDiffering === 0 ? 0 : 1);
    },
    (err: Error) => {
      process.stderr.write(`soak-bench: ${err.message}\n`);
      process.exit(2);
    },
  );
}
