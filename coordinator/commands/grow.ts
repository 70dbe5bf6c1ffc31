/**
 * `tendril grow`: grow one cluster of any registered model (`--model KIND`,
 * parameters with `--param NAME=VALUE`, see `tendril models`) in this
 * process and write, into the output folder (created if missing):
 *
 *   run-result.json   the GrowthResult (deterministic: a function of the model
 *                     parameters, seed and engine version) with one extra
 *                     top-level field `timing` (wall-clock figures, which are
 *                     not deterministic and must never be compared)
 *   cluster.snapshot  the particle centres in arrival order, in the binary
 *                     format of coordinator/snapshot/cluster-snapshot.ts
 *   cluster.png       picture of the cluster coloured by arrival order
 *                     (coordinator/render/cluster-picture.ts)
 *
 * Growth runs as run index 0 of an ensemble whose seed is --seed, so
 * `tendril grow --seed S` grows the same cluster as run 0 of an ensemble with
 * seed S and the same parameters. The kernel is driven by growTo() in chunks
 * of about a quarter of a second so that the progress display stays live;
 * the chunking does not change the result (the kernel contract).
 */
import { writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Command } from 'commander';
import { UsageError } from '../usage-error.js';
import { checkOutFolder, makeOutFolder } from './out-folder.js';
import { checkModelParams, createKernel, MODEL_KINDS, modelDescriptor, modelParams } from '../../worker/models/registry.js';
import type { GrowthResult, GrowthTask, ModelParams } from '../../worker/core/growth-kernel.js';
import { axisOf } from '../../worker/core/positions.js';
import { RECORDS_PER_DECADE } from '../../worker/core/record-sizes.js';
import { encodeSnapshot } from '../snapshot/cluster-snapshot.js';
import { renderClusterPng, DEFAULT_PICTURE_SIZE } from '../render/cluster-picture.js';
import { clusterFigure } from '../report/plots.js';
import { pngRenderer } from '../report/png-plot.js';
import { createProgress, formatRate, type ProgressMode } from '../progress/progress.js';

export const RUN_RESULT_FILE = 'run-result.json';
export const SNAPSHOT_FILE = 'cluster.snapshot';
export const PICTURE_FILE = 'cluster.png';
/** The same picture with a title, a scale bar and a colour key (rendered from SVG; absent without the PNG renderer). */
export const FIGURE_FILE = 'cluster-figure.png';
/** The same range and default as a spec's records_per_decade (one source: worker/core/record-sizes.ts). */
export const DEFAULT_RECORDS_PER_DECADE = RECORDS_PER_DECADE.default;

export interface GrowOptions {
  particles: number;
  /** Normalised decimal string of an unsigned 64-bit integer. */
  seed: string;
  out: string;
  /** The model and its parameters (defaults filled in, checked against the model's descriptor). */
  model: ModelParams;
  pictureSize: number;
  recordsPerDecade: number;
  quiet: boolean;
}

export interface GrowTiming {
  /** When growth started (ISO 8601, UTC). */
  startedAt: string;
  /** Seconds spent growing the cluster. */
  growSeconds: number;
  /** Seconds spent writing the snapshot and picture. */
  writeSeconds: number;
  /** Seconds for the whole command. */
  wallSeconds: number;
  /** particles / growSeconds. */
  particlesPerSecond: number;
}

export type RunResultFile = GrowthResult & { timing: GrowTiming };

export interface GrowSummary {
  result: GrowthResult;
  timing: GrowTiming;
  radiusOfGyration: number;
  maxRadius: number;
  files: { runResult: string; snapshot: string; picture: string; figure: string | null };
}

const MAX_SEED = (1n << 64n) - 1n;
const NUMBER_RE = /^[+]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

function describeRange(lo: number, hi: number, loOpen: boolean): string {
  return `${loOpen ? '(' : '['}${lo}, ${hi}]`;
}

/** An integer option in [lo, hi]; accepts plain and exponent notation ("1e6"). */
export function parseIntegerOption(name: string, raw: unknown, lo: number, hi: number): number {
  const s = typeof raw === 'string' ? raw.trim() : String(raw);
  const v = NUMBER_RE.test(s) ? Number(s) : NaN;
  if (!Number.isSafeInteger(v) || v < lo || v > hi) {
    throw new UsageError(`--${name} must be an integer in [${lo}, ${hi}], got ${JSON.stringify(String(raw))}`);
  }
  return v;
}

/** A real option in (lo, hi] (loOpen) or [lo, hi]. */
export function parseNumberOption(name: string, raw: unknown, lo: number, hi: number, loOpen: boolean): number {
  const s = typeof raw === 'string' ? raw.trim() : String(raw);
  const v = NUMBER_RE.test(s) ? Number(s) : NaN;
  const ok = Number.isFinite(v) && (loOpen ? v > lo : v >= lo) && v <= hi;
  if (!ok) throw new UsageError(`--${name} must be a number in ${describeRange(lo, hi, loOpen)}, got ${JSON.stringify(String(raw))}`);
  return v;
}

/** An unsigned 64-bit integer in decimal; returned normalised (no leading zeros). */
export function parseSeedOption(name: string, raw: unknown): string {
  const s = typeof raw === 'string' ? raw.trim() : String(raw);
  if (!/^\d{1,20}$/.test(s) || BigInt(s) > MAX_SEED) {
    throw new UsageError(`--${name} must be an unsigned 64-bit integer in [0, ${MAX_SEED}] written in decimal, got ${JSON.stringify(String(raw))}`);
  }
  return BigInt(s).toString();
}

/**
 * The model of `--model KIND` and `--param NAME=VALUE` options (repeatable):
 * every parameter not given takes its default; an unknown name, a value that
 * is not a number or one outside the parameter's range is one line naming it.
 */
export function parseModelOptions(kindRaw: unknown, paramsRaw: unknown): ModelParams {
  const kind = kindRaw === undefined ? MODEL_KINDS[0] : String(kindRaw);
  let d;
  try {
    d = modelDescriptor(kind);
  } catch {
    throw new UsageError(`--model: ${JSON.stringify(kind)} is not a model; allowed: one of ${MODEL_KINDS.join(', ')} (see tendril models)`);
  }
  const given: Record<string, number> = {};
  const list = paramsRaw === undefined ? [] : Array.isArray(paramsRaw) ? paramsRaw : [paramsRaw];
  for (const item of list) {
    const m = /^([A-Za-z0-9_]+)=(.*)$/.exec(String(item));
    if (!m) throw new UsageError(`--param: ${JSON.stringify(String(item))} is not allowed; allowed: NAME=VALUE with NAME one of ${d.params.map((p) => p.name).join(', ') || '(none: ' + kind + ' has no parameters)'}`);
    const v = NUMBER_RE.test(m[2].trim()) || /^[-+]/.test(m[2].trim()) ? Number(m[2].trim()) : NaN;
    given[m[1]] = Number.isNaN(v) ? (m[2] as unknown as number) : v;
  }
  const model = modelParams(kind, given);
  try {
    checkModelParams(model);
  } catch (err) {
    throw new UsageError((err as Error).message.replace(/^params\./, '--param '));
  }
  return model;
}

/** Validate the raw commander options of `grow`; throws UsageError with one line. */
export function parseGrowOptions(raw: Record<string, unknown>): GrowOptions {
  const need = (key: string, flag: string, what: string): unknown => {
    const v = raw[key];
    if (v === undefined) throw new UsageError(`--${flag} is required (${what})`);
    return v;
  };
  const particles = parseIntegerOption('particles', need('particles', 'particles', 'an integer in [2, 100000000]'), 2, 100_000_000);
  const seed = parseSeedOption('seed', need('seed', 'seed', 'an unsigned 64-bit integer in decimal'));
  const outRaw = need('out', 'out', 'the output folder');
  if (typeof outRaw !== 'string' || outRaw.trim() === '') throw new UsageError(`--out must name a folder, got ${JSON.stringify(String(outRaw))}`);
  const model = parseModelOptions(raw.model, raw.param);
  const pictureSize = raw.pictureSize === undefined ? DEFAULT_PICTURE_SIZE : parseIntegerOption('picture-size', raw.pictureSize, 64, 8192);
  const recordsPerDecade =
    raw.recordsPerDecade === undefined ? DEFAULT_RECORDS_PER_DECADE : parseIntegerOption('records-per-decade', raw.recordsPerDecade, RECORDS_PER_DECADE.min, RECORDS_PER_DECADE.max);
  return { particles, seed, out: outRaw, model, pictureSize, recordsPerDecade, quiet: raw.quiet === true };
}

export function growTask(o: GrowOptions): GrowthTask {
  return {
    model: { kind: o.model.kind, params: { ...o.model.params } },
    particles: o.particles,
    ensembleSeed: o.seed,
    runIndex: 0,
    recordsPerDecade: o.recordsPerDecade,
  };
}

/** Radius of gyration about the centre of mass, and largest distance from the seed (particle 0). */
export function clusterRadii(x: Float64Array, y: Float64Array, n: number): { radiusOfGyration: number; maxRadius: number } {
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i];
    sy += y[i];
  }
  const cx = sx / n;
  const cy = sy / n;
  let s2 = 0;
  let m2 = 0;
  const x0 = x[0];
  const y0 = y[0];
  for (let i = 0; i < n; i++) {
    const dx = x[i] - cx;
    const dy = y[i] - cy;
    s2 += dx * dx + dy * dy;
    const ex = x[i] - x0;
    const ey = y[i] - y0;
    const d2 = ex * ex + ey * ey;
    if (d2 > m2) m2 = d2;
  }
  return { radiusOfGyration: Math.sqrt(s2 / n), maxRadius: Math.sqrt(m2) };
}

export interface GrowIo {
  stdout: NodeJS.WritableStream;
  stderr: NodeJS.WritableStream & { isTTY?: boolean };
  progressMode?: ProgressMode;
}

/** Grow, write the three files, and return what was written. */
export function runGrow(o: GrowOptions, io: GrowIo = { stdout: process.stdout, stderr: process.stderr }): GrowSummary {
  // checked now (an unwritable --out is refused before growing), created only when the files are written,
  // so Ctrl-C during growth leaves no empty folder
  const dir = checkOutFolder(o.out);
  const task = growTask(o);
  const kernel = createKernel(task);
  const startedAt = new Date().toISOString();
  const progress = createProgress({
    total: task.particles,
    unit: 'particles',
    label: 'grow',
    mode: o.quiet ? 'none' : io.progressMode ?? 'auto',
    stream: io.stderr,
  });
  progress.update(kernel.count); // the starting count: the baseline of the rate
  const t0 = performance.now();
  let chunk = 256;
  while (!kernel.done) {
    const c0 = performance.now();
    const before = kernel.count;
    kernel.growTo(Math.min(task.particles, before + chunk));
    const dt = performance.now() - c0;
    // aim for chunks of about 250 ms, growing at most 4-fold per step
    const perParticle = dt / Math.max(1, kernel.count - before);
    chunk = Math.max(64, Math.min(4 * chunk, Math.round(250 / Math.max(perParticle, 1e-6))));
    progress.update(kernel.count);
  }
  const growSeconds = (performance.now() - t0) / 1000;
  progress.stop();
  const result = kernel.result();
  const pos = kernel.positions();
  const x = axisOf(pos, 0);
  const y = axisOf(pos, 1);
  const radii = clusterRadii(x, y, pos.count);

  makeOutFolder(dir, o.out);
  const w0 = performance.now();
  const points = { dimension: 2 as const, count: pos.count, x, y, diameter: modelDescriptor(task.model.kind).contactDistance, arrivalOrder: true };
  const files = {
    runResult: join(dir, RUN_RESULT_FILE),
    snapshot: join(dir, SNAPSHOT_FILE),
    picture: join(dir, PICTURE_FILE),
    figure: null as string | null,
  };
  writeFileSync(files.snapshot, encodeSnapshot(points));
  writeFileSync(files.picture, renderClusterPng(points, { size: o.pictureSize }));
  const { renderer } = pngRenderer();
  if (renderer) {
    files.figure = join(dir, FIGURE_FILE);
    writeFileSync(files.figure, renderer.render(clusterFigure(points, null, Math.min(o.pictureSize, 1400)).figure.svg, 2));
  }
  const writeSeconds = (performance.now() - w0) / 1000;
  const timing: GrowTiming = {
    startedAt,
    growSeconds,
    writeSeconds,
    wallSeconds: (performance.now() - t0) / 1000,
    particlesPerSecond: growSeconds > 0 ? result.particles / growSeconds : 0,
  };
  const file: RunResultFile = { ...result, timing };
  writeFileSync(files.runResult, JSON.stringify(file, null, 2) + '\n');

  io.stdout.write(`${files.runResult}\n${files.snapshot}\n${files.picture}\n${files.figure ? `${files.figure}\n` : ''}`);
  io.stdout.write(
    `grew ${result.particles} particles (seed ${o.seed}): R_g = ${radii.radiusOfGyration.toFixed(2)}, ` +
      `R_max = ${radii.maxRadius.toFixed(2)}, ${formatRate(timing.particlesPerSecond)} particles/s over ${growSeconds.toFixed(1)} s\n`,
  );
  return { result, timing, ...radii, files };
}

export function register(program: Command): void {
  program
    .command('grow')
    .description('grow one cluster of a model (see tendril models) and write its run result, snapshot and picture')
    .option('--particles <n>', 'cluster size, seed particle included (integer in [2, 100000000])')
    .option('--seed <s>', 'ensemble seed, unsigned 64-bit integer in decimal (the cluster is run 0)')
    .option('--out <dir>', 'output folder, created if missing')
    .option('--model <kind>', `growth model, one of ${MODEL_KINDS.join(', ')} (default ${MODEL_KINDS[0]})`)
    .option('--param <name=value>', 'a model parameter (repeatable); every other one takes its default (see tendril models)', (v: string, prev: string[] = []) => [...prev, v])
    .option('--picture-size <px>', `side of cluster.png in pixels, in [64, 8192] (default ${DEFAULT_PICTURE_SIZE})`)
    .option('--records-per-decade <k>', `observable records per decade of size, in [${RECORDS_PER_DECADE.min}, ${RECORDS_PER_DECADE.max}] (default ${DEFAULT_RECORDS_PER_DECADE}, as in a spec)`)
    .option('--quiet', 'no progress display')
    .action((raw: Record<string, unknown>) => {
      runGrow(parseGrowOptions(raw));
    });
}
