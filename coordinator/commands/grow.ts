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
 *                     (coordinator/render/model-picture.ts: disks, or four
 *                     depth-shaded views of balls in 3D), for models whose
 *                     descriptor declares a picture
 *
 * Growth runs as run index 0 of an ensemble whose seed is --seed, so
 * `tendril grow --seed S` grows the same cluster as run 0 of an ensemble with
 * seed S and the same parameters. The kernel is driven by growTo() in chunks
 * of about a quarter of a second so that the progress display stays live;
 * the chunking does not change the result (the kernel contract).
 */
import { existsSync, mkdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { readCheckpointFile, writeCheckpointFile } from '../../proto/checkpoint-file.js';
import type { RunTaskData } from '../../proto/convert.js';
import { firstLine, messageOf } from '../../proto/errors.js';
import { ENGINE_VERSION } from '../../worker/core/engine-version.js';
import { canonicalJson } from '../../worker/core/canonical-json.js';
import { join, resolve } from 'node:path';
import type { Command } from 'commander';
import { UsageError } from '../usage-error.js';
import { describeRange } from '../../worker/core/value-range.js';
import { optionNumber, parseRangeOption, parseSeedOption } from './option-values.js';
import { checkModelForSize, checkModelParams, createKernel, MODEL_KINDS, modelDescriptor, modelParams } from '../../worker/models/registry.js';
import type { ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask, ModelParams } from '../../worker/core/growth-kernel.js';
import { writeSnapshotFile } from '../snapshot/cluster-snapshot.js';
import { DEFAULT_PICTURE_SIZE, renderClusterPng } from '../render/cluster-picture.js';
import { clusterFigure } from '../report/plots.js';
import { pngRenderer } from '../report/png-plot.js';
import { RECORDS_PER_DECADE as SHARED_RECORDS_PER_DECADE } from '../../worker/core/record-sizes.js';
import { checkOutFolder, makeOutFolder } from './out-folder.js';
import { collectGarbage } from './collect-garbage.js';
import { noPictureReason, picturePointsOf, renderModelPicture } from '../render/model-picture.js';
import { createProgress, formatRate, type ProgressMode } from '../progress/progress.js';

export const RUN_RESULT_FILE = 'run-result.json';
export const SNAPSHOT_FILE = 'cluster.snapshot';
export const PICTURE_FILE = 'cluster.png';
/** The picture with a title, a scale bar and a colour key (rendered from SVG; absent without the PNG renderer). */
export const FIGURE_FILE = 'cluster-figure.png';
/** The same default as a spec's records_per_decade (one source: worker/core/record-sizes.ts). */
export const DEFAULT_RECORDS_PER_DECADE = SHARED_RECORDS_PER_DECADE.default;

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
  /** Write OUT/grow.checkpoint every this many seconds of growth; 0 = never. */
  checkpointEverySeconds: number;
  /** Continue from OUT/grow.checkpoint (written by an interrupted grow with checkpoints). */
  resume: boolean;
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
  /** picture is null when the model declares no picture. */
  files: { runResult: string; snapshot: string; picture: string | null; figure: string | null };
}

/** Limits of grow's own options (the model's parameters come from its descriptor). */
/** Up to 10^9: the positions (16 GB at 10^9) stay within a typed array's 2^32 entries; the index's int32 fields within range (docs in README, Giant clusters). */
export const GROW_PARTICLES = { min: 2, max: 1_000_000_000, integer: true } as const;
export const PICTURE_SIZE = { min: 64, max: 8192, integer: true } as const;
export const RECORDS_PER_DECADE = { min: SHARED_RECORDS_PER_DECADE.min, max: SHARED_RECORDS_PER_DECADE.max, integer: true } as const;
export const CHECKPOINT_EVERY_SECONDS = { min: 0.5, max: 86_400 } as const;
/** The checkpoint of an unfinished grow, in the output folder (framed layout: docs/checkpoint-format.md); removed when the cluster is complete. */
export const CHECKPOINT_FILE = 'grow.checkpoint';

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
    given[m[1]] = optionNumber(m[2]) as number; // text that is no number is refused by the parameter check, quoted
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
    if (v === undefined) throw new UsageError(`--${flag}: missing; allowed: ${what}`);
    return v;
  };
  const particles = parseRangeOption('--particles', need('particles', 'particles', describeRange(GROW_PARTICLES)), GROW_PARTICLES);
  const seed = parseSeedOption('--seed', need('seed', 'seed', 'an unsigned 64-bit integer in decimal'));
  const outRaw = need('out', 'out', 'a folder name (created if missing)');
  if (typeof outRaw !== 'string' || outRaw.trim() === '') throw new UsageError(`--out: ${JSON.stringify(String(outRaw))} is not allowed; allowed: a folder name`);
  const model = parseModelOptions(raw.model, raw.param);
  try {
    // the model's own checks against the cluster size (e.g. the min_step floor), named by the option that set the value
    checkModelForSize(model, particles);
  } catch (err) {
    throw new UsageError(messageOf(err).replace(/^params\./, '--param '));
  }
  const noPicture = noPictureReason(model.kind);
  if (noPicture !== null && raw.pictureSize !== undefined) throw new UsageError(`--picture-size: not allowed for this model; ${noPicture}`);
  const pictureSize = raw.pictureSize === undefined ? DEFAULT_PICTURE_SIZE : parseRangeOption('--picture-size', raw.pictureSize, PICTURE_SIZE, 'pixels');
  const recordsPerDecade = raw.recordsPerDecade === undefined ? DEFAULT_RECORDS_PER_DECADE : parseRangeOption('--records-per-decade', raw.recordsPerDecade, RECORDS_PER_DECADE);
  const checkpointEverySeconds =
    raw.checkpointEvery === undefined ? 0 : parseRangeOption('--checkpoint-every', raw.checkpointEvery, CHECKPOINT_EVERY_SECONDS, 'seconds');
  return { particles, seed, out: outRaw, model, pictureSize, recordsPerDecade, quiet: raw.quiet === true, checkpointEverySeconds, resume: raw.resume === true };
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

/** Radius of gyration about the centre of mass, and largest distance from the seed (particle 0), in any dimension. */
export function clusterRadii(p: ClusterPositions): { radiusOfGyration: number; maxRadius: number } {
  const n = p.count;
  const d = p.dimension;
  const c = p.coords;
  const centre = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let k = 0; k < d; k++) centre[k] += c[i * d + k];
  for (let k = 0; k < d; k++) centre[k] /= n;
  let s2 = 0;
  let m2 = 0;
  for (let i = 0; i < n; i++) {
    let r2 = 0;
    let e2 = 0;
    for (let k = 0; k < d; k++) {
      const a = c[i * d + k] - centre[k];
      const e = c[i * d + k] - c[k];
      r2 += a * a;
      e2 += e * e;
    }
    s2 += r2;
    if (e2 > m2) m2 = e2;
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
  // checked now (an unusable --out is refused before growing), created only when the files are written,
  // so Ctrl-C during growth leaves no empty folder
  const dir = checkOutFolder(o.out);
  const task = growTask(o);
  const checkpointPath = join(dir, CHECKPOINT_FILE);
  const resumed = o.resume ? resumeCheckpoint(checkpointPath, o) : null;
  const kernel = resumed === null ? createKernel(task) : resumed.kernel;
  const spentBefore = resumed?.growSeconds ?? 0;
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
  let lastCheckpoint = t0;
  let checkpointPause = 0;
  while (!kernel.done) {
    if (o.checkpointEverySeconds > 0 && performance.now() - lastCheckpoint >= 1000 * o.checkpointEverySeconds) {
      const c0 = performance.now();
      if (!existsSync(dir)) makeOutFolder(dir, o.out);
      writeCheckpointFile(checkpointPath, {
        run: growRunTask(task, o.checkpointEverySeconds),
        state: kernel.checkpointView ? kernel.checkpointView() : kernel.checkpoint(),
        growSeconds: spentBefore + (c0 - t0 - checkpointPause) / 1000,
        startedAtMs: Date.parse(startedAt),
        resumes: resumed === null ? 0 : resumed.resumes + 1,
      });
      lastCheckpoint = performance.now();
      checkpointPause += lastCheckpoint - c0;
    }
    const c0 = performance.now();
    const before = kernel.count;
    kernel.growTo(Math.min(task.particles, before + chunk));
    const dt = performance.now() - c0;
    // aim for chunks of about 250 ms, growing at most 4-fold per step
    const perParticle = dt / Math.max(1, kernel.count - before);
    chunk = Math.max(64, Math.min(4 * chunk, Math.round(250 / Math.max(perParticle, 1e-6))));
    progress.update(kernel.count);
  }
  const growSeconds = spentBefore + (performance.now() - t0 - checkpointPause) / 1000;
  progress.stop();
  const result = kernel.result();
  const pos = kernel.positions();
  const radii = clusterRadii(pos);

  makeOutFolder(dir, o.out);
  // the index is released by now (worker/index/occupancy-index-2d.ts release()); give its arrays back before drawing
  collectGarbage();
  const w0 = performance.now();
  const d = modelDescriptor(task.model.kind);
  const files = {
    runResult: join(dir, RUN_RESULT_FILE),
    snapshot: join(dir, SNAPSHOT_FILE),
    picture: d.picture === null ? null : join(dir, PICTURE_FILE),
    figure: null as string | null,
  };
  // streamed from the kernel's positions: no copy of the cluster is made for the outputs
  writeSnapshotFile(files.snapshot, pos, d.contactDistance);
  if (files.picture !== null && d.picture === 'disks') {
    const inPlace = { positions: pos, diameter: d.contactDistance };
    writeFileSync(files.picture, renderClusterPng(inPlace, { size: o.pictureSize }));
    // planar clusters: the same picture with a title, a scale bar in particle diameters and a colour key
    const { renderer } = pngRenderer();
    if (renderer) {
      files.figure = join(dir, FIGURE_FILE);
      writeFileSync(files.figure, renderer.render(clusterFigure(inPlace, null, Math.min(o.pictureSize, 1400)).figure.svg, 2));
    }
  } else if (files.picture !== null) {
    const picturePoints = picturePointsOf(task.model.kind, pos);
    if (picturePoints !== null) writeFileSync(files.picture, renderModelPicture(task.model.kind, picturePoints, o.pictureSize));
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
  // the cluster is complete and written: its checkpoint is no longer needed
  rmSync(checkpointPath, { force: true });

  io.stdout.write(`${files.runResult}\n${files.snapshot}\n${files.picture ?? `no ${PICTURE_FILE}: ${noPictureReason(task.model.kind)}`}\n${files.figure ? `${files.figure}\n` : ''}`);
  io.stdout.write(
    `grew ${result.particles} particles (seed ${o.seed}): R_g = ${radii.radiusOfGyration.toFixed(2)}, ` +
      `R_max = ${radii.maxRadius.toFixed(2)}, ${formatRate(timing.particlesPerSecond)} particles/s over ${growSeconds.toFixed(1)} s\n`,
  );
  return { result, timing, ...radii, files };
}

/** The run task written into grow's checkpoints (run 0 of an ensemble named "grow"). */
function growRunTask(task: GrowthTask, everySeconds: number): RunTaskData {
  return { ...task, model: { kind: task.model.kind, params: { ...task.model.params } }, ensembleId: 'grow', checkpointIntervalSeconds: everySeconds, checkpointEveryParticles: 0, engineVersion: ENGINE_VERSION };
}

/** The kernel resumed from OUT/grow.checkpoint; one-line UsageError when there is none or it is of another cluster. */
function resumeCheckpoint(path: string, o: GrowOptions): { kernel: GrowthKernel; growSeconds: number; resumes: number } {
  if (!existsSync(path)) throw new UsageError(`--resume: no checkpoint at "${path}"; allowed: the --out folder of an unfinished tendril grow run with --checkpoint-every`);
  const task = growTask(o);
  let c;
  try {
    c = readCheckpointFile(path, task.particles);
  } catch (err) {
    throw new UsageError(`--resume: "${path}" cannot be read: ${firstLine(messageOf(err))}`);
  }
  const s = c.state;
  if (s.engineVersion !== ENGINE_VERSION) throw new UsageError(`--resume: the checkpoint was written by engine ${s.engineVersion}; allowed: one of this build's engine ${ENGINE_VERSION}`);
  for (const [field, was, now] of [
    ['--model', s.task.model.kind, task.model.kind],
    ['--particles', s.task.particles, task.particles],
    ['--seed', s.task.ensembleSeed, task.ensembleSeed],
    ['--records-per-decade', s.task.recordsPerDecade, task.recordsPerDecade],
    ['--param', canonicalJson(s.task.model.params), canonicalJson(task.model.params)],
  ] as const) {
    if (was !== now) throw new UsageError(`${field}: ${String(now)} differs from the checkpoint's ${String(was)}; allowed: the options of the interrupted run`);
  }
  try {
    return { kernel: createKernel(task, s as GrowthCheckpoint), growSeconds: c.growSeconds, resumes: c.resumes };
  } catch (err) {
    throw new UsageError(`--resume: "${path}" cannot be resumed: ${firstLine(messageOf(err))}`);
  }
}

export function register(program: Command): void {
  program
    .command('grow')
    .description('grow one cluster of a model (see tendril models) and write its run result, snapshot and picture')
    .option('--particles <n>', 'cluster size, seed particle included (integer in [2, 1000000000])')
    .option('--seed <s>', 'ensemble seed, unsigned 64-bit integer in decimal (the cluster is run 0)')
    .option('--out <dir>', 'output folder, created if missing')
    .option('--model <kind>', `growth model, one of ${MODEL_KINDS.join(', ')} (default ${MODEL_KINDS[0]})`)
    .option('--param <name=value>', 'a model parameter (repeatable); every other one takes its default (see tendril models)', (v: string, prev: string[] = []) => [...prev, v])
    .option('--picture-size <px>', `side of cluster.png in pixels, in [64, 8192] (default ${DEFAULT_PICTURE_SIZE})`)
    .option('--records-per-decade <k>', `observable records per decade of size, in [${RECORDS_PER_DECADE.min}, ${RECORDS_PER_DECADE.max}] (default ${DEFAULT_RECORDS_PER_DECADE}, as in a spec)`)
    .option('--quiet', 'no progress display')
    .option('--checkpoint-every <s>', `write OUT/${CHECKPOINT_FILE} every this many seconds of growth, in [${CHECKPOINT_EVERY_SECONDS.min}, ${CHECKPOINT_EVERY_SECONDS.max}] (default: none)`)
    .option('--resume', `continue from OUT/${CHECKPOINT_FILE} (same options as the interrupted run); the result is the same bits as an uninterrupted run`)
    .action((raw: Record<string, unknown>) => {
      runGrow(parseGrowOptions(raw));
    });
}
