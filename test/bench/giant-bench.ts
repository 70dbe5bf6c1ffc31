/**
 * `npm run bench -- --only giant` (opt-in: not part of a plain `npm run bench`,
 * nor of CI): giant off-lattice DLA clusters in the plane (dla-offlattice-2d,
 * default parameters, seed 7), one fresh process per size.
 *
 * Per size (default 10^5, 10^6, 10^7; `--sizes` to choose, `--giant-1e8` adds
 * 10^8) it prints particles per second of growth, jumps per particle, the
 * peak resident memory of the process at the end of growth (maxRSS, which
 * includes Node's own ~50 MB), bytes per particle (that peak over N), and the
 * times to write the cluster's checkpoint to disk (streamed, framed:
 * docs/checkpoint-format.md), to read it back, and to rebuild the index from
 * it (a resumed kernel re-inserts every particle). The peak is read before
 * the checkpoint is written, so it is growth's alone.
 *
 * `--kill-resume` (with `--kill-size N`, default 10^6) also runs
 * `tendril grow --checkpoint-every 2` in a child process, SIGKILLs it once its
 * second checkpoint is on disk, resumes it with `--resume`, and compares the
 * final state hash with the uninterrupted one (rule: the two hex strings are
 * equal; "same hash" or "DIFFERENT").
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createKernel, modelParams } from '../../worker/models/registry.js';
import type { GrowthTask } from '../../worker/core/growth-kernel.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { readCheckpointFile, writeCheckpointFile } from '../../proto/checkpoint-file.js';
import { createProgress } from '../../coordinator/progress/progress.js';
import { argValue, isEntryPoint } from './bench-process.js';

const THIS_FILE = fileURLToPath(import.meta.url);
const CHILD_FLAG = '--giant-bench-child';
const CLI = join(THIS_FILE, '..', '..', '..', 'coordinator', 'cli.js');
export const DEFAULT_GIANT_SIZES = [100_000, 1_000_000, 10_000_000];
const SEED = '7';

export interface GiantBenchRow {
  bench: 'giant';
  engineVersion: string;
  particles: number;
  seed: string;
  particlesPerSecond: number;
  jumpsPerParticle: number;
  growSeconds: number;
  peakRssMB: number;
  bytesPerParticle: number;
  checkpointBytes: number;
  checkpointWriteSeconds: number;
  checkpointReadSeconds: number;
  indexRebuildSeconds: number;
  stateHash: string;
  nodeVersion: string;
}

function taskOf(particles: number): GrowthTask {
  return { model: modelParams('dla-offlattice-2d'), particles, ensembleSeed: SEED, runIndex: 0, recordsPerDecade: 10 };
}

/** In the child: grow, take the peak, then time the checkpoint's write, read and rebuild. */
function child(particles: number): void {
  const task = taskOf(particles);
  const progress = createProgress({ total: particles, unit: 'particles', label: `giant bench ${particles}`, mode: 'lines', lineIntervalSeconds: 60 });
  const kernel = createKernel(task);
  const t0 = performance.now();
  let chunk = 1000;
  while (!kernel.done) {
    kernel.growTo(Math.min(particles, kernel.count + chunk));
    chunk = Math.min(chunk * 2, 200_000);
    progress.update(kernel.count);
  }
  const growSeconds = (performance.now() - t0) / 1000;
  const peakRssMB = process.resourceUsage().maxRSS / 1024; // kilobytes
  const result = kernel.result();
  const dir = mkdtempSync(join(tmpdir(), 'tendril-giant-bench-'));
  try {
    const path = join(dir, 'giant.checkpoint');
    const run = { ...task, ensembleId: 'giant-bench', checkpointIntervalSeconds: 0, checkpointEveryParticles: 0, engineVersion: ENGINE_VERSION };
    const w0 = performance.now();
    writeCheckpointFile(path, { run, state: kernel.checkpointView!(), growSeconds, startedAtMs: 0, resumes: 0 });
    const checkpointWriteSeconds = (performance.now() - w0) / 1000;
    const checkpointBytes = statSync(path).size;
    const r0 = performance.now();
    const c = readCheckpointFile(path, particles);
    const checkpointReadSeconds = (performance.now() - r0) / 1000;
    const b0 = performance.now();
    const resumed = createKernel(task, c.state);
    const indexRebuildSeconds = (performance.now() - b0) / 1000;
    if (resumed.count !== particles) throw new Error(`resumed kernel holds ${resumed.count} particles, expected ${particles}`);
    const row: GiantBenchRow = {
      bench: 'giant',
      engineVersion: ENGINE_VERSION,
      particles,
      seed: SEED,
      particlesPerSecond: particles / growSeconds,
      jumpsPerParticle: (result.counters.jumps ?? 0) / particles,
      growSeconds,
      peakRssMB,
      bytesPerParticle: (peakRssMB * 1024 * 1024) / particles,
      checkpointBytes,
      checkpointWriteSeconds,
      checkpointReadSeconds,
      indexRebuildSeconds,
      stateHash: result.stateHash,
      nodeVersion: process.version,
    };
    process.stdout.write(JSON.stringify(row) + '\n');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function runChild(particles: number): Promise<GiantBenchRow> {
  return new Promise((resolvePromise, reject) => {
    const c = spawn(process.execPath, [THIS_FILE, CHILD_FLAG, String(particles)], { stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    c.stdout.setEncoding('utf8');
    c.stdout.on('data', (s: string) => (out += s));
    c.on('error', reject);
    c.on('close', (code) => {
      if (code !== 0) return reject(new Error(`giant bench child for ${particles} particles exited with code ${code}`));
      try {
        resolvePromise(JSON.parse(out.trim().split('\n').pop() ?? '') as GiantBenchRow);
      } catch {
        reject(new Error(`giant bench child for ${particles} particles printed no result`));
      }
    });
  });
}

export function formatGiantTable(rows: GiantBenchRow[]): string {
  const head = ['particles', 'particles/s', 'jumps/particle', 'grow s', 'peak RSS MB', 'B/particle', 'checkpoint MB', 'write s', 'read s', 'rebuild s'];
  const body = rows.map((r) => [
    String(r.particles),
    r.particlesPerSecond.toFixed(0),
    r.jumpsPerParticle.toFixed(1),
    r.growSeconds.toFixed(1),
    r.peakRssMB.toFixed(1),
    r.bytesPerParticle.toFixed(1),
    (r.checkpointBytes / 1e6).toFixed(1),
    r.checkpointWriteSeconds.toFixed(3),
    r.checkpointReadSeconds.toFixed(3),
    r.indexRebuildSeconds.toFixed(2),
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i].length)));
  const line = (cells: string[]): string => cells.map((c, i) => c.padStart(widths[i])).join('  ');
  return [line(head), ...body.map(line)].join('\n');
}

export interface KillResumeRow {
  bench: 'giant-kill-resume';
  particles: number;
  seed: string;
  killedAt: number;
  uninterruptedHash: string;
  resumedHash: string;
  verdict: 'same hash' | 'DIFFERENT';
}

function grow(args: string[]): void {
  const r = spawnSync(process.execPath, [CLI, 'grow', ...args], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`tendril grow ${args.join(' ')} failed: ${r.stderr.trim().split('\n')[0]}`);
}

function hashIn(dir: string): string {
  return (JSON.parse(readFileSync(join(dir, 'run-result.json'), 'utf8')) as { stateHash: string }).stateHash;
}

/** Grow with checkpoints, SIGKILL after the second one, resume, and compare with an uninterrupted run. */
export async function runKillResume(particles: number): Promise<KillResumeRow> {
  const work = mkdtempSync(join(tmpdir(), 'tendril-giant-kill-'));
  try {
    const whole = join(work, 'whole');
    grow(['--particles', String(particles), '--seed', SEED, '--out', whole, '--quiet']);
    const out = join(work, 'killed');
    const checkpoint = join(out, 'grow.checkpoint');
    const c = spawn(process.execPath, [CLI, 'grow', '--particles', String(particles), '--seed', SEED, '--out', out, '--quiet', '--checkpoint-every', '2'], { stdio: 'ignore' });
    let gone = false;
    const exited = new Promise<void>((resolve) => c.on('exit', () => ((gone = true), resolve())));
    let first = -1;
    // wait for the second checkpoint (the file is replaced by a rename: its mtime changes)
    for (;;) {
      if (gone) throw new Error(`tendril grow of ${particles} particles ended before its second checkpoint; choose a larger --kill-size`);
      if (existsSync(checkpoint)) {
        const m = statSync(checkpoint).mtimeMs;
        if (first < 0) first = m;
        else if (m !== first) break;
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    c.kill('SIGKILL');
    await exited;
    const killedAt = readCheckpointFile(checkpoint).state.count;
    grow(['--particles', String(particles), '--seed', SEED, '--out', out, '--quiet', '--resume']);
    const a = hashIn(whole);
    const b = hashIn(out);
    return { bench: 'giant-kill-resume', particles, seed: SEED, killedAt, uninterruptedHash: a, resumedHash: b, verdict: a === b ? 'same hash' : 'DIFFERENT' };
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

export interface GiantBenchOptions {
  sizes?: number[];
  killResume?: boolean;
  killSize?: number;
  write?: (text: string) => void;
}

export async function runGiantBenchmark(opts: GiantBenchOptions = {}): Promise<GiantBenchRow[]> {
  const sizes = opts.sizes ?? DEFAULT_GIANT_SIZES;
  const write = opts.write ?? ((s: string) => void process.stdout.write(s));
  write(`giant benchmark (dla-offlattice-2d, default parameters, seed ${SEED}, one fresh process per size)\n`);
  const rows: GiantBenchRow[] = [];
  for (const n of sizes) rows.push(await runChild(n));
  write(formatGiantTable(rows) + '\n');
  for (const r of rows) write(JSON.stringify(r) + '\n');
  if (opts.killResume) {
    const k = await runKillResume(opts.killSize ?? 1_000_000);
    write(`kill and resume: tendril grow of ${k.particles} particles SIGKILLed after its second checkpoint (at ${k.killedAt}), resumed: ${k.verdict} (rule: equal state hashes)\n`);
    write(JSON.stringify(k) + '\n');
  }
  return rows;
}

/** The giant part's options from the benchmark command line. */
export function giantOptionsFromArgs(argv: string[], sizes: number[] | undefined): GiantBenchOptions {
  const base = sizes ?? DEFAULT_GIANT_SIZES;
  return {
    sizes: argv.includes('--giant-1e8') ? [...base, 100_000_000] : base,
    killResume: argv.includes('--kill-resume'),
    killSize: argValue(argv, '--kill-size', 1_000_000),
  };
}

if (isEntryPoint(import.meta.url) && process.argv[2] === CHILD_FLAG) child(Number(process.argv[3]));
