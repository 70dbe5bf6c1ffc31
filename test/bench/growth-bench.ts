/**
 * Growth benchmark: for each cluster size, grow one cluster of a model
 * (off-lattice 2D DLA unless told otherwise; default model parameters,
 * ensemble seed 1, run 0) in a fresh child process,
 * so that the peak resident memory (process.resourceUsage().maxRSS) belongs
 * to that size alone and covers the whole process.
 *
 * Usage (after `npx tsc`):
 *   node dist/test/bench/growth-bench.js [--sizes 10000,100000,1000000] [--seed S] [--model KIND] [--repeat K]
 * or env TENDRIL_BENCH_SIZES=10000,100000. Default sizes: 10^4, 10^5, 10^6.
 *
 * Prints a table, then one JSON line per size:
 *   {"bench":"growth","model":...,"particles":...,"particlesPerSecond":...,"jumpsPerParticle":...,
 *    "shortStepsPerParticle":...,"returnsPerParticle":...,"wallSeconds":...,"cpuSeconds":...,"peakRssMB":...,...}
 * wallSeconds is the growth time inside the child (kernel construction
 * included, process start-up excluded).
 *
 * With --repeat K (1 to 15), each size is grown K times in turn, each in its
 * own child, and one more JSON line per size gives the median rate:
 *   {"bench":"growth-median","model":...,"particles":...,"runs":K,"particlesPerSecondMedian":...,
 *    "particlesPerSecondRuns":[...],"cpuSecondsMedian":...,"sameStateHash":true}
 * (this machine's speed moves by ±25 % from run to run with its neighbours'
 * load, so a single run says little; the median of odd K is the middle run).
 */
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { createKernel, defaultModelParams, modelDescriptor } from '../../worker/models/registry.js';
import type { GrowthTask } from '../../worker/core/growth-kernel.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { createProgress } from '../../coordinator/progress/progress.js';
import { isEntryPoint } from './bench-process.js';

export const DEFAULT_GROWTH_SIZES = [10_000, 100_000, 1_000_000];

export interface GrowthBenchRow {
  bench: 'growth';
  model: string;
  engineVersion: string;
  particles: number;
  seed: string;
  particlesPerSecond: number;
  jumpsPerParticle: number;
  shortStepsPerParticle: number;
  returnsPerParticle: number;
  wallSeconds: number;
  /** CPU seconds (user + system) of the child over the same span as wallSeconds: the figure to quote on a shared machine. */
  cpuSeconds: number;
  peakRssMB: number;
  stateHash: string;
  nodeVersion: string;
  /** Exact scans of the occupancy index per particle, and the fresh block and ring gathers among them (models whose kernel reports indexWork). */
  exactScansPerParticle?: number;
  blockGathersPerParticle?: number;
  ringGathersPerParticle?: number;
}

/** A kernel that reports its occupancy index's work (worker/models/dla-offlattice-2d/kernel.ts). */
interface IndexWorkReporter {
  indexWork: { exactScans: number; blockGathers: number; ringGathers: number };
}

const THIS_FILE = fileURLToPath(import.meta.url);
const CHILD_FLAG = '--growth-bench-child';

/** Parse "10000,1e5" into sizes; throws a one-line RangeError. */
export function parseSizes(text: string): number[] {
  const sizes = text.split(',').map((s) => s.trim()).filter((s) => s !== '').map(Number);
  if (sizes.length === 0 || sizes.some((n) => !Number.isSafeInteger(n) || n < 2 || n > 1e8)) {
    throw new RangeError(`--sizes must be a comma-separated list of integers in [2, 100000000], got "${text}"`);
  }
  return sizes;
}

/** Runs inside the child: grow one cluster and print one JSON row on stdout. */
function childMain(particles: number, seed: string, model: string): void {
  const task: GrowthTask = {
    model: defaultModelParams(model),
    particles,
    ensembleSeed: seed,
    runIndex: 0,
    recordsPerDecade: 20,
  };
  const progress = createProgress({ total: particles, unit: 'particles', label: `growth bench ${particles}`, mode: 'lines', lineIntervalSeconds: 30 });
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const kernel = createKernel(task);
  let chunk = 1000;
  while (!kernel.done) {
    kernel.growTo(Math.min(particles, kernel.count + chunk));
    chunk = Math.min(chunk * 2, 50_000);
    progress.update(kernel.count);
  }
  const seconds = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const result = kernel.result();
  const c = result.counters;
  const row: GrowthBenchRow = {
    bench: 'growth',
    model,
    engineVersion: ENGINE_VERSION,
    particles,
    seed,
    particlesPerSecond: particles / seconds,
    jumpsPerParticle: (c.jumps ?? 0) / particles,
    shortStepsPerParticle: (c.short_steps ?? 0) / particles,
    returnsPerParticle: (c.returns ?? 0) / particles,
    wallSeconds: seconds,
    cpuSeconds: (cpu.user + cpu.system) / 1e6,
    peakRssMB: process.resourceUsage().maxRSS / 1024, // maxRSS is in kilobytes
    stateHash: result.stateHash,
    nodeVersion: process.version,
  };
  if ('indexWork' in kernel) {
    const w = (kernel as unknown as IndexWorkReporter).indexWork;
    row.exactScansPerParticle = w.exactScans / particles;
    row.blockGathersPerParticle = w.blockGathers / particles;
    row.ringGathersPerParticle = w.ringGathers / particles;
  }
  process.stdout.write(JSON.stringify(row) + '\n');
}

function runChild(particles: number, seed: string, model: string): Promise<GrowthBenchRow> {
  return new Promise((resolvePromise, reject) => {
    const child = spawn(process.execPath, [THIS_FILE, CHILD_FLAG, String(particles), seed, model], { stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.setEncoding('utf8');
    child.stdout.on('data', (s: string) => (out += s));
    child.on('error', reject);
    child.on('close', (code) => {
      if (code !== 0) return reject(new Error(`growth bench child for ${particles} particles exited with code ${code}`));
      try {
        resolvePromise(JSON.parse(out.trim().split('\n').pop() ?? '') as GrowthBenchRow);
      } catch {
        reject(new Error(`growth bench child for ${particles} particles printed no result`));
      }
    });
  });
}

function fixed(v: number, digits: number): string {
  return v.toFixed(digits);
}

export function formatTable(rows: GrowthBenchRow[]): string {
  const head = ['particles', 'particles/s', 'jumps/particle', 'short steps/particle', 'returns/particle', 'seconds', 'CPU seconds', 'peak RSS MB'];
  const body = rows.map((r) => [
    String(r.particles),
    fixed(r.particlesPerSecond, 0),
    fixed(r.jumpsPerParticle, 1),
    fixed(r.shortStepsPerParticle, 2),
    fixed(r.returnsPerParticle, 2),
    fixed(r.wallSeconds, 2),
    fixed(r.cpuSeconds, 2),
    fixed(r.peakRssMB, 1),
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i].length)));
  const line = (cells: string[]): string => cells.map((c, i) => c.padStart(widths[i])).join('  ');
  return [line(head), ...body.map(line)].join('\n');
}

/** The median line of a size grown --repeat K times. */
export interface GrowthMedianRow {
  bench: 'growth-median';
  model: string;
  particles: number;
  runs: number;
  particlesPerSecondMedian: number;
  particlesPerSecondRuns: number[];
  cpuSecondsMedian: number;
  /** Every run ended on the same state hash (they must: same task, same bits). */
  sameStateHash: boolean;
  stateHash: string;
}

/** Median of a non-empty list (the mean of the middle two for an even count). */
export function median(values: number[]): number {
  if (values.length === 0) throw new RangeError('median of no values');
  const v = [...values].sort((a, b) => a - b);
  const h = v.length >> 1;
  return v.length % 2 === 1 ? v[h] : (v[h - 1] + v[h]) / 2;
}

/** The median line of the runs of one size (all rows of the same size and model). */
export function medianRow(rows: GrowthBenchRow[]): GrowthMedianRow {
  if (rows.length === 0) throw new RangeError('median row of no runs');
  return {
    bench: 'growth-median',
    model: rows[0].model,
    particles: rows[0].particles,
    runs: rows.length,
    particlesPerSecondMedian: median(rows.map((r) => r.particlesPerSecond)),
    particlesPerSecondRuns: rows.map((r) => r.particlesPerSecond),
    cpuSecondsMedian: median(rows.map((r) => r.cpuSeconds)),
    sameStateHash: rows.every((r) => r.stateHash === rows[0].stateHash),
    stateHash: rows[0].stateHash,
  };
}

export const REPEAT_RANGE = { min: 1, max: 15 } as const;

/** `--repeat K` (or `--repeat=K`) in argv: runs per size, default 1; throws a one-line RangeError. */
export function repeatFromArgs(argv: string[]): number {
  const i = argv.indexOf('--repeat');
  const eq = argv.find((a) => a.startsWith('--repeat='));
  const text = i >= 0 ? argv[i + 1] ?? '' : eq !== undefined ? eq.slice('--repeat='.length) : undefined;
  if (text === undefined) return 1;
  const k = Number(text);
  if (!/^\d+$/.test(text) || k < REPEAT_RANGE.min || k > REPEAT_RANGE.max) {
    throw new RangeError(`--repeat must be an integer in [${REPEAT_RANGE.min}, ${REPEAT_RANGE.max}], got "${text}"`);
  }
  return k;
}

export interface GrowthBenchOptions {
  sizes?: number[];
  /** Runs per size (each in its own child); with more than one, a median line per size. Default 1. */
  repeat?: number;
  seed?: string;
  /** Model kind; default dla-offlattice-2d. */
  model?: string;
  /** Where the table and JSON lines go; default stdout. */
  write?: (text: string) => void;
}

/** Grow one cluster per size, each in a fresh child process, and print the figures. */
export async function runGrowthBenchmark(opts: GrowthBenchOptions = {}): Promise<GrowthBenchRow[]> {
  const sizes = opts.sizes ?? DEFAULT_GROWTH_SIZES;
  const seed = opts.seed ?? '1';
  const write = opts.write ?? ((s: string) => void process.stdout.write(s));
  const model = opts.model ?? 'dla-offlattice-2d';
  const repeat = opts.repeat ?? 1;
  const rows: GrowthBenchRow[] = [];
  write(`growth benchmark (${model}, default parameters, seed ${seed}, one fresh process per ${repeat > 1 ? `run, ${repeat} runs per size` : 'size'})\n`);
  for (const n of sizes) for (let k = 0; k < repeat; k++) rows.push(await runChild(n, seed, model));
  write(formatTable(rows) + '\n');
  for (const r of rows) write(JSON.stringify(r) + '\n');
  if (repeat > 1) {
    for (const n of sizes) {
      const m = medianRow(rows.filter((r) => r.particles === n));
      write(`${n} particles: median ${m.particlesPerSecondMedian.toFixed(0)} particles/s over ${m.runs} runs (${m.particlesPerSecondRuns.map((v) => v.toFixed(0)).join(', ')})${m.sameStateHash ? '' : '; STATE HASHES DIFFER'}\n`);
      write(JSON.stringify(m) + '\n');
    }
  }
  return rows;
}

/** Sizes from `--sizes a,b,c` in argv, else env TENDRIL_BENCH_SIZES, else the defaults. */
export function sizesFromArgs(argv: string[], env: NodeJS.ProcessEnv = process.env): number[] {
  const i = argv.indexOf('--sizes');
  if (i >= 0) return parseSizes(argv[i + 1] ?? '');
  const eq = argv.find((a) => a.startsWith('--sizes='));
  if (eq !== undefined) return parseSizes(eq.slice('--sizes='.length));
  if (env.TENDRIL_BENCH_SIZES !== undefined && env.TENDRIL_BENCH_SIZES !== '') return parseSizes(env.TENDRIL_BENCH_SIZES);
  return DEFAULT_GROWTH_SIZES;
}

function seedFromArgs(argv: string[]): string {
  const i = argv.indexOf('--seed');
  const s = i >= 0 ? argv[i + 1] ?? '' : '1';
  if (!/^\d{1,20}$/.test(s) || BigInt(s) >= 1n << 64n) throw new RangeError(`--seed must be an unsigned 64-bit integer in decimal, got "${s}"`);
  return s;
}

if (isEntryPoint(import.meta.url)) {
  const argv = process.argv.slice(2);
  if (argv[0] === CHILD_FLAG) {
    childMain(Number(argv[1]), argv[2] ?? '1', argv[3] ?? 'dla-offlattice-2d');
  } else {
    try {
      const m = argv.indexOf('--model');
      await runGrowthBenchmark({ sizes: sizesFromArgs(argv), seed: seedFromArgs(argv), model: m >= 0 ? modelDescriptor(argv[m + 1]).kind : undefined, repeat: repeatFromArgs(argv) });
    } catch (err) {
      process.stderr.write(`growth bench: ${err instanceof Error ? err.message : String(err)}\n`);
      process.exit(1);
    }
  }
}
