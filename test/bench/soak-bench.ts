/**
 * Soak benchmark (opt-in, never in CI; issue #11): ensembles grown by two
 * `tendril worker` processes on a Redis of its own (AOF, fsync every second)
 * while a seeded chaos loop SIGKILLs a random worker every `--kill-every`
 * seconds (a fresh one replaces it) and `kill -9`s Redis every
 * `--redis-every` seconds (restarted on the same AOF). For `--minutes` of
 * wall time a new ensemble of `--round-clusters` clusters is launched
 * whenever the newest one has fewer than two queued runs per worker, so the
 * chaos lasts that long whatever the machine's speed; then the last
 * ensembles are finished (the chaos going on) and everything is checked.
 * Reports, as one JSON line:
 *   runsLost       planned runs with no stored result once the farm is idle
 *   runsDoubled    runs reported grown to completion by more than one job
 *                  (sum of the jobs' `done` counts minus the runs stored)
 *   hashesDiffering  stored state hashes that differ from the same run grown
 *                  undisturbed in this process (every resumed run, plus a
 *                  seeded sample of `--check` others)
 *   workerRssMb    resident memory of each worker just before it was killed
 *                  (in kill order), and of the survivors at the end
 * All three counts must be 0. While it runs, a progress line per kill goes to
 * stderr (wall minutes, runs done, kills, restarts, RSS of the last victim).
 *
 *   node dist/test/bench/soak-bench.js [--minutes 60] [--kill-every 60] [--redis-every 600]
 *        [--particles 50000] [--round-clusters 24] [--check 20]
 *
 * Needs the compiled tree (npm run build) and redis-server on the PATH.
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
  /** Clusters per ensemble (a new one is launched whenever the newest has little left queued). */
  roundClusters?: number;
  seed?: number;
}

export interface SoakResult {
  benchmark: 'soak';
  minutes: number;
  wallMinutes: number;
  /** Wall minutes of chaos (launching plus finishing), before the final checks. */
  chaosMinutes: number;
  ensembles: number;
  clusters: number;
  particles: number;
  workerKills: number;
  redisRestarts: number;
  runsLost: number;
  runsDoubled: number;
  runsResumed: number;
  hashesChecked: number;
  hashesDiffering: number;
  workerRssMb: { firstKilled: number | null; lastKilled: number | null; killed: number[]; survivorsAtEnd: number[] };
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
  // ensembles of roundClusters clusters are launched one after another for `minutes` of wall time, each when the
  // previous one has little left queued, so the chaos lasts `minutes` whatever the machine's speed; then the last
  // ones are finished (chaos continuing) and everything is checked
  const roundClusters = o.roundClusters ?? 24;
  const specOf = (round: number) =>
    validateSpec(
      { name: `soak-${round}`, model: 'dla-offlattice-2d', particles: o.particles, clusters: roundClusters, seed: String(777 + round), runs_per_job: 1, checkpoint_every_particles: Math.max(1, Math.floor(o.particles / 4)) },
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
  const ensembles: Array<{ id: string; spec: ReturnType<typeof specOf> }> = [];
  const started = performance.now();
  const launchEnds = started + o.minutes * 60_000;
  try {
    workers.push(await startBenchWorker(redisServer.url, prefix, artifacts, workerArgs), await startBenchWorker(redisServer.url, prefix, artifacts, workerArgs));
    let nextKill = performance.now() + o.killEverySeconds * 1000;
    let nextRedis = performance.now() + o.redisEverySeconds * 1000;
    // chaos until every ensemble is done (or half an hour past the launching time)
    const giveUp = launchEnds + 30 * 60_000;
    for (;;) {
      await sleep(500);
      const now = performance.now();
      const statuses = await store.statuses(ensembles.map((e) => e.id)).catch(() => undefined);
      const launching = now < launchEnds;
      if (statuses) {
        const last = statuses.at(-1);
        // a new ensemble when the newest has fewer queued runs than two per worker
        if (launching && (!last || last.runs.queued < 2 * workers.length)) {
          const spec = specOf(ensembles.length);
          const id = await launchEnsemble(store, queue, spec).catch(() => null);
          if (id) ensembles.push({ id, spec });
        } else {
          const allEnded = statuses.every((s) => s !== null && (s.state === 'done' || s.state === 'failed'));
          if ((!launching && allEnded) || now > giveUp) break;
        }
      } else if (now > giveUp) break;
      if (now >= nextKill && statuses) {
        // one progress line per kill on stderr, so a soak stopped early still leaves its figures
        const runsDone = statuses.reduce((t, s) => t + (s?.runs.done ?? 0), 0);
        process.stderr.write(
          JSON.stringify({ soakProgress: { wallMinutes: Number(((now - started) / 60_000).toFixed(2)), ensembles: ensembles.length, runsDone, runsPlanned: ensembles.length * roundClusters, workerKills, redisRestarts, killedRssMb: killedRss.slice(-1)[0] ?? null } }) + '\n',
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
    const chaosMinutes = (performance.now() - started) / 60_000;
    const survivorsAtEnd = workers.map((w) => rssMb(w.pid)).filter((v): v is number => v !== null);
    let runsLost = 0;
    const stored: Array<{ e: (typeof ensembles)[number]; r: Awaited<ReturnType<typeof store.results>>[number] }> = [];
    for (const e of ensembles) {
      const results = await store.results(e.id);
      runsLost += e.spec.clusters - results.length;
      for (const r of results) stored.push({ e, r });
    }
    let jobsDone = 0;
    for (const job of await queue.getCompleted(0, -1)) jobsDone += Number((job.returnvalue as { done?: number } | undefined)?.done ?? 0);
    const runsDoubled = Math.max(0, jobsDone - stored.length);
    const resumed = stored.filter((x) => x.r.timings.resumes > 0);
    const others = stored.filter((x) => x.r.timings.resumes === 0);
    const sample = [...resumed];
    for (let k = 0; k < o.check && others.length > 0; k++) sample.push(others.splice(Math.floor(random() * others.length), 1)[0]);
    let hashesDiffering = 0;
    for (const { e, r } of sample) {
      const k = createKernel(growthTaskOf(runTaskFor(e.id, e.spec, r.runIndex)));
      k.growTo(e.spec.particles);
      if (k.result().stateHash !== r.stateHash) hashesDiffering++;
    }
    return {
      benchmark: 'soak',
      minutes: o.minutes,
      wallMinutes: (performance.now() - started) / 60_000,
      chaosMinutes,
      ensembles: ensembles.length,
      clusters: ensembles.length * roundClusters,
      particles: o.particles,
      workerKills,
      redisRestarts,
      runsLost,
      runsDoubled,
      runsResumed: resumed.length,
      hashesChecked: sample.length,
      hashesDiffering,
      workerRssMb: { firstKilled: killedRss[0] ?? null, lastKilled: killedRss[killedRss.length - 1] ?? null, killed: killedRss, survivorsAtEnd },
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
    roundClusters: argValue(argv, '--round-clusters', 24),
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
