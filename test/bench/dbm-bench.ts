/**
 * Benchmark of the off-lattice DBM (dbm-offlattice-2d): for η = 0.5, 2 and 4
 * one cluster (seed 1, run 0, default parameters otherwise) grown in chunks,
 * printing at N = 10^2, 2·10^2, 5·10^2, 10^3, … up to the target size
 * (10^5 for η <= 2, 10^4 for η = 4: the targets of issue 13) the wall and
 * CPU seconds so far (the process's user + system time, which on a shared
 * machine is the fair measure of one core), particles per second (wall and
 * per CPU second) and walkers per particle over the last stretch, jumps per
 * walker, and the load average at that moment. A cluster that has not
 * reached its target when its budget runs out stops there and says so
 * (budget: --dbm-seconds, default 600 CPU seconds per η, the target's ten
 * minutes on one core). `--dbm-etas 0.5,2` runs only those η of the plan.
 * One line for people and one JSON line per reported size. The budget is
 * read between chunks of 10 particles. For η > 1 the model's default method
 * is used (params.method = 1, the history method, unless --dbm-method 0
 * asks for the exact one); `capped` counts accepted attempts whose estimate
 * exceeded the normaliser (kernel.ts header).
 */
import { loadavg } from 'node:os';
import { createKernel, modelParams } from '../../worker/models/registry.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';

export interface DbmBenchRow {
  bench: 'dbm';
  engineVersion: string;
  eta: number;
  particles: number;
  /** Wall seconds since the cluster started. */
  seconds: number;
  /** CPU seconds (user + system) of the process since the cluster started. */
  cpuSeconds: number;
  /** Particles per wall second, and per CPU second, over the stretch since the previous row. */
  particlesPerSecond: number;
  particlesPerCpuSecond: number;
  /** Walk-on-spheres jumps per walker since the start. */
  jumpsPerWalker: number;
  /** One-minute load average when the row was taken. */
  load: number;
  /** Walkers per added particle over that stretch, and since the start. */
  walkersPerParticle: number;
  walkersPerParticleTotal: number;
  targetParticles: number;
  reachedTarget: boolean;
  budgetSeconds: number;
  nodeVersion: string;
  /** params.method (0 exact, 1 history; η <= 1 ignores it) and the capped acceptances since the start. */
  method: number;
  capped: number;
}

export const DBM_BENCH_PLAN: Array<{ eta: number; target: number }> = [
  { eta: 0.5, target: 100_000 },
  { eta: 2, target: 100_000 },
  { eta: 4, target: 10_000 },
];

function reportSizes(target: number): number[] {
  const out: number[] = [];
  for (let d = 100; d <= target; d *= 10) for (const m of [1, 2, 5]) if (m * d <= target) out.push(m * d);
  if (out.at(-1) !== target) out.push(target);
  return out;
}

function cpuSecondsSince(start: NodeJS.CpuUsage): number {
  const u = process.cpuUsage(start);
  return (u.user + u.system) / 1e6;
}

export function runDbmBenchmark(budgetSeconds = 600, plan = DBM_BENCH_PLAN, method?: number): DbmBenchRow[] {
  const rows: DbmBenchRow[] = [];
  for (const { eta, target } of plan) {
    const model = modelParams('dbm-offlattice-2d', method === undefined ? { eta } : { eta, method });
    const kernel = createKernel({ model, particles: target, ensembleSeed: '1', runIndex: 0, recordsPerDecade: 10 });
    const t0 = performance.now();
    const cpu0 = process.cpuUsage();
    let lastT = t0;
    let lastCpu = 0;
    let lastN = 1;
    let lastWalkers = 0;
    let outOfTime = false;
    for (const size of reportSizes(target)) {
      while (kernel.count < size) {
        kernel.growTo(Math.min(size, kernel.count + 10));
        if (cpuSecondsSince(cpu0) > budgetSeconds) { outOfTime = true; break; }
      }
      const now = performance.now();
      const cpu = cpuSecondsSince(cpu0);
      const n = kernel.count;
      const walkers = kernel.counters.walkers;
      const row: DbmBenchRow = {
        bench: 'dbm', engineVersion: ENGINE_VERSION, eta, particles: n,
        seconds: (now - t0) / 1000,
        cpuSeconds: cpu,
        particlesPerSecond: (n - lastN) / ((now - lastT) / 1000),
        particlesPerCpuSecond: (n - lastN) / Math.max(1e-9, cpu - lastCpu),
        jumpsPerWalker: kernel.counters.jumps / Math.max(1, walkers),
        load: loadavg()[0],
        walkersPerParticle: (walkers - lastWalkers) / Math.max(1, n - lastN),
        walkersPerParticleTotal: walkers / Math.max(1, n - 1),
        targetParticles: target, reachedTarget: n >= target, budgetSeconds, nodeVersion: process.version,
        method: model.params.method, capped: kernel.counters.capped,
      };
      rows.push(row);
      process.stdout.write(`dbm eta=${eta}: N = ${n} after ${row.cpuSeconds.toFixed(1)} CPU s (${row.seconds.toFixed(1)} s wall, load ${row.load.toFixed(1)}), ${row.particlesPerCpuSecond.toFixed(1)} particles per CPU second, ${row.walkersPerParticle.toFixed(1)} walkers/particle over the last stretch (method ${row.method}, ${row.capped} capped)${outOfTime ? ` (stopped: budget of ${budgetSeconds} CPU s spent before N = ${size}; target ${target} not reached)` : ''}\n`);
      process.stdout.write(JSON.stringify(row) + '\n');
      lastT = now;
      lastCpu = cpu;
      lastN = n;
      lastWalkers = walkers;
      if (outOfTime) break;
    }
  }
  return rows;
}
