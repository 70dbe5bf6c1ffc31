/**
 * Benchmarks of the lattice and Eden models: one cluster per (model, size),
 * each in a fresh child process so that the peak resident memory
 * (process.resourceUsage().maxRSS) belongs to that cluster alone. Records
 * at 10 sizes per decade (the smallest allowed), seed 1, run 0.
 *
 *   eden     eden-square and eden-triangular at 10^6 and 10^7 (target:
 *            2·10^6 particles/s at 10^7), eden-offlattice-2d at 10^5 and 10^6
 *   lattice  dla-square (m = 1) at 10^5 and 10^6, dla-triangular at 10^5:
 *            particles/s, moves (exact jumps + single steps) per particle,
 *            peak RSS
 *   dbm-lattice  the lattice breakdown model at η = 2 at 10^3, 3·10^3 and
 *            10^4 (target: 10^4 in under 5 minutes on one core), first with
 *            the walker sampler (dbm-square-walkers: particles/s, walkers
 *            per particle, CPU seconds), then with the potential solve
 *            (dbm-square: solver (conjugate-gradient) iterations per
 *            particle; hours at 10^4); peak RSS for both
 *
 * `--sizes a,b` replaces the sizes of every model of the part; `--models a,b`
 * keeps only those models of the part. Prints one line for people and one
 * JSON line per cluster.
 */
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { createKernel, modelParams } from '../../worker/models/registry.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { isEntryPoint } from './bench-process.js';

export interface LatticeBenchRow {
  bench: 'lattice';
  engineVersion: string;
  model: string;
  params: Record<string, number>;
  particles: number;
  particlesPerSecond: number;
  /** Counters divided by the particle count. */
  perParticle: Record<string, number>;
  /** Walker moves (jumps + steps) per particle, for lattice DLA and the DBM walker sampler; null for Eden. */
  movesPerParticle: number | null;
  /** Walkers released per particle (lattice DLA, the DBM walker sampler); null for models without walkers. */
  walkersPerParticle: number | null;
  wallSeconds: number;
  /** CPU time of the growth (user + system), and particles per CPU second: on a shared, loaded machine the wall time also counts time spent waiting for a core. */
  cpuSeconds: number;
  particlesPerCpuSecond: number;
  peakRssMB: number;
  stateHash: string;
  nodeVersion: string;
}

const THIS_FILE = fileURLToPath(import.meta.url);
const CHILD_FLAG = '--lattice-bench-child';

export type LatticeBenchPart = 'eden' | 'lattice' | 'dbm-lattice';

export const LATTICE_BENCH_PLAN: Record<LatticeBenchPart, { model: string; params: Record<string, number>; sizes: number[] }[]> = {
  eden: [
    { model: 'eden-square', params: {}, sizes: [1_000_000, 10_000_000] },
    { model: 'eden-triangular', params: {}, sizes: [1_000_000, 10_000_000] },
    { model: 'eden-offlattice-2d', params: {}, sizes: [100_000, 1_000_000] },
  ],
  lattice: [
    { model: 'dla-square', params: {}, sizes: [100_000, 1_000_000] },
    { model: 'dla-triangular', params: {}, sizes: [100_000] },
  ],
  'dbm-lattice': [
    { model: 'dbm-square-walkers', params: { eta: 2 }, sizes: [1_000, 3_000, 10_000] },
    { model: 'dbm-square', params: { eta: 2 }, sizes: [1_000, 3_000, 10_000] },
  ],
};

function childMain(model: string, particles: number, paramsJson: string): void {
  const params = JSON.parse(paramsJson) as Record<string, number>;
  const task = { model: modelParams(model, params), particles, ensembleSeed: '1', runIndex: 0, recordsPerDecade: 10 };
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const kernel = createKernel(task);
  kernel.growTo(particles);
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(c0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  const result = kernel.result();
  const perParticle: Record<string, number> = {};
  for (const [k, v] of Object.entries(result.counters)) perParticle[k] = v / particles;
  const c = result.counters;
  const row: LatticeBenchRow = {
    bench: 'lattice',
    engineVersion: ENGINE_VERSION,
    model,
    params,
    particles,
    particlesPerSecond: particles / seconds,
    perParticle,
    movesPerParticle: c.jumps !== undefined && c.steps !== undefined ? (c.jumps + c.steps) / particles : null,
    walkersPerParticle: c.walkers !== undefined ? c.walkers / particles : null,
    wallSeconds: seconds,
    cpuSeconds,
    particlesPerCpuSecond: particles / cpuSeconds,
    peakRssMB: process.resourceUsage().maxRSS / 1024,
    stateHash: result.stateHash,
    nodeVersion: process.version,
  };
  process.stdout.write(JSON.stringify(row) + '\n');
}

function runChild(model: string, particles: number, params: Record<string, number>): Promise<LatticeBenchRow> {
  return new Promise((resolvePromise, reject) => {
    const child = spawn(process.execPath, [THIS_FILE, CHILD_FLAG, model, String(particles), JSON.stringify(params)], { stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.setEncoding('utf8');
    child.stdout.on('data', (s: string) => (out += s));
    child.on('error', reject);
    child.on('close', (code) => {
      if (code !== 0) return reject(new Error(`lattice bench child for ${model} at ${particles} exited with code ${code}`));
      try {
        resolvePromise(JSON.parse(out.trim().split('\n').pop() ?? '') as LatticeBenchRow);
      } catch {
        reject(new Error(`lattice bench child for ${model} at ${particles} printed no result`));
      }
    });
  });
}

/** Run one part ('eden', 'lattice' or 'dbm-lattice'); `sizes` replaces the planned sizes when given, `models` keeps only those models. */
export async function runLatticeBenchmark(part: LatticeBenchPart, sizes?: number[], models?: string[]): Promise<LatticeBenchRow[]> {
  const rows: LatticeBenchRow[] = [];
  const plan = LATTICE_BENCH_PLAN[part].filter((p) => models === undefined || models.includes(p.model));
  if (plan.length === 0) throw new RangeError(`--models: none of ${models?.join(', ')} is in the ${part} part; allowed: ${LATTICE_BENCH_PLAN[part].map((p) => p.model).join(', ')}`);
  for (const p of plan) {
    for (const n of sizes ?? p.sizes) {
      const r = await runChild(p.model, n, p.params);
      const iterations = r.perParticle.solver_iterations;
      const walkers = r.walkersPerParticle !== null && r.walkersPerParticle > 1.5 ? `, ${r.walkersPerParticle.toFixed(1)} walkers/particle` : '';
      const moves = r.movesPerParticle !== null ? `, ${r.movesPerParticle.toFixed(1)} moves/particle${walkers}` : iterations !== undefined ? `, ${iterations.toFixed(1)} solver iterations/particle` : '';
      process.stdout.write(`${part}: ${r.model} ${r.particles}: ${Math.round(r.particlesPerSecond)} particles/s over ${r.wallSeconds.toFixed(1)} s (CPU ${r.cpuSeconds.toFixed(1)} s, ${Math.round(r.particlesPerCpuSecond)} per CPU second)${moves}, peak RSS ${r.peakRssMB.toFixed(0)} MB\n`);
      process.stdout.write(JSON.stringify(r) + '\n');
      rows.push(r);
    }
  }
  return rows;
}

if (isEntryPoint(import.meta.url) && process.argv[2] === CHILD_FLAG) {
  childMain(process.argv[3], Number(process.argv[4]), process.argv[5] ?? '{}');
}
