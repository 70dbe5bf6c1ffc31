/**
 * `tendril probe INPUT --walkers N --seed S --out DIR [--jobs K]
 *  [--q-grid a:b:step] [--threads T] [--contact-sample M] [--min-step h]
 *  [--window lo:hi]`
 * (the settings, their ranges and defaults are those of a spec's [probe]
 * table and of POST /probes: coordinator/harmonic/probe-settings.ts)
 *
 * Probes the harmonic measure of INPUT (a 2D .snapshot, probed as disks of
 * radius = its contact distance around the centres, or a CSV of x,y,r
 * rows) with N walkers split into K jobs (job j uses the probe stream j of
 * seed S), in this process or on T worker threads; writes into DIR:
 *   probe-measures.json  τ(q), D_q, f(α), information dimension, maximum
 *                        concentration exponent and Beurling check,
 *                        logarithmic capacity ± error, convergence flags,
 *                        the fit window and the sign convention; plus
 *                        `timing` (wall clock, never compared)
 *                        (with the fit window, window and contact-radius
 *                        systematics, and warnings, also printed to stderr)
 *   probe-hits.csv       index,x,y,r,hits,measure per disk
 *   probe-measure.png    the set coloured by harmonic measure (quantiles of log ω)
 *   probe-measure-figure.png  the same with a title and its colour key
 *
 * A 3D snapshot (e.g. of dla-offlattice-3d) is probed as balls of radius =
 * its contact distance (worker/probe/probe-3d.ts), in this process, and
 * writes probe-measures.json (Newtonian capacity ± error, τ(q) from boxes)
 * and probe-hits.csv (index,x,y,z,r,hits,measure); no picture.
 */
import { measurePictureFigure } from '../report/harmonic-plots.js';
import { pngRenderer } from '../report/png-plot.js';
import { mkdirSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Command } from 'commander';
import { probeGeometryProblem } from '../../worker/probe/probe-limits.js';
import { UsageError } from '../usage-error.js';
import { parseRangeOption, parseSeedOption } from './option-values.js';
import { describeRange } from '../../worker/core/value-range.js';
import { defaultProbeJobs, PROBE_CONTACT_SAMPLE, PROBE_JOBS, PROBE_MIN_STEP, PROBE_Q_MAX_VALUES, PROBE_Q_VALUE, PROBE_WALKERS, probeSettingsProblems, type ProbeSettingSpec } from '../harmonic/probe-settings.js';
import { readProbeInput, type ProbeInput } from '../harmonic/probe-input.js';
import { probedPointsOf } from '../../worker/probe/probe-set.js';
import { runProbes } from '../harmonic/probe-run.js';
import { measurePictureGeometry, renderMeasurePng } from '../harmonic/measure-picture.js';
import { DEFAULT_PROBE_MIN_STEP } from '../../worker/probe/probe-2d.js';
import { readFileSync } from 'node:fs';
import { decodeSnapshot, type PointSet } from '../snapshot/cluster-snapshot.js';
import { ProbeGeometry3d, capacityFromProbes, runProbe3d } from '../../worker/probe/probe-3d.js';
import { boxSpectrum3d } from '../../worker/probe/box-spectrum-3d.js';
import { WINDOW_RULE, windowProblem } from '../harmonic/fit-window.js';
import { ballHitsCsv, diskHitsCsv } from '../harmonic/hits-csv.js';

export const MEASURES_FILE = 'probe-measures.json';
export const HITS_FILE = 'probe-hits.csv';
export const MEASURE_PICTURE_FILE = 'probe-measure.png';
export const MEASURE_FIGURE_FILE = 'probe-measure-figure.png';

/** Parse --window lo:hi (box sides relative to the set radius R; rule in fit-window.ts). */
export function parseWindowOption(raw: string): [number, number] {
  const parts = raw.split(':').map((t) => t.trim());
  const nums = parts.map((t) => (/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(t) ? Number(t) : NaN));
  if (nums.length !== 2 || windowProblem(nums) !== null) throw new UsageError(`--window: ${JSON.stringify(raw)} is not allowed; allowed: lo:hi, ${WINDOW_RULE}`);
  return [nums[0], nums[1]];
}

/** Parse a:b:step into the grid a, a+step, … ≤ b (at most 401 values, |q| ≤ 50). */
export function parseQGrid(raw: string): number[] {
  const parts = raw.split(':').map((s) => s.trim());
  const nums = parts.map((s) => (/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(s) ? Number(s) : NaN));
  const bad = `--q-grid: ${JSON.stringify(raw)} is not allowed; allowed: a:b:step with ${PROBE_Q_VALUE.min} <= a < b <= ${PROBE_Q_VALUE.max}, step > 0 and at most ${PROBE_Q_MAX_VALUES} values`;
  if (nums.length !== 3 || nums.some((v) => !Number.isFinite(v))) throw new UsageError(bad);
  const [a, b, step] = nums;
  if (!(a >= PROBE_Q_VALUE.min && b <= PROBE_Q_VALUE.max && a < b && step > 0) || (b - a) / step > PROBE_Q_MAX_VALUES - 1) throw new UsageError(bad);
  const out: number[] = [];
  const n = Math.floor((b - a) / step + 1e-9);
  for (let k = 0; k <= n; k++) out.push(Math.round((a + k * step) * 1e12) / 1e12);
  return out;
}

/** Help text of a shared probe setting: meaning, range with unit, default. */
function helpOf(s: ProbeSettingSpec): string {
  return `${s.meaning}; ${describeRange(s, s.unit)}`;
}

export const THREADS = { min: 1, max: 64, integer: true } as const;

export function register(program: Command): void {
  program
    .command('probe')
    .description('measure the harmonic measure of a cluster snapshot or a CSV of x,y,r disks with probe walkers')
    .argument('<input>', '.snapshot file or .csv of x,y,r rows')
    .option('--walkers <n>', helpOf(PROBE_WALKERS))
    .option('--seed <s>', 'unsigned 64-bit seed in decimal')
    .option('--out <dir>', 'output folder')
    .option('--jobs <k>', helpOf(PROBE_JOBS))
    .option('--q-grid <a:b:step>', 'q values for tau(q)', '-1:5:0.25')
    .option('--threads <t>', `worker threads, ${describeRange(THREADS)}`, '1')
    .option('--contact-sample <m>', helpOf(PROBE_CONTACT_SAMPLE), String(PROBE_CONTACT_SAMPLE.default))
    .option('--min-step <h>', helpOf(PROBE_MIN_STEP), String(PROBE_MIN_STEP.default))
    .option('--window <lo:hi>', 'fit window: smallest and largest box side relative to the set radius R (default: see the README)')
    .option('--lattice <name>', 'probe a snapshot of a lattice model (dla-square, eden-square: square; dla-triangular, eden-triangular: triangular) with lattice walkers onto its perimeter sites; allowed: square, triangular')
    .action(async (input: string, raw: Record<string, unknown>) => {
      const need = (k: string, what: string): unknown => {
        if (raw[k] === undefined) throw new UsageError(`--${k} is required (${what})`);
        return raw[k];
      };
      const walkers = parseRangeOption('--walkers', need('walkers', describeRange(PROBE_WALKERS, PROBE_WALKERS.unit)), PROBE_WALKERS, PROBE_WALKERS.unit);
      const seed = parseSeedOption('--seed', need('seed', 'an unsigned 64-bit integer in decimal'));
      const outRaw = need('out', 'the output folder');
      if (typeof outRaw !== 'string' || outRaw.trim() === '') throw new UsageError(`--out must name a folder, got ${JSON.stringify(String(outRaw))}`);
      const jobs = raw.jobs === undefined ? defaultProbeJobs(walkers) : parseRangeOption('--jobs', raw.jobs, PROBE_JOBS, PROBE_JOBS.unit);
      const tooMany = probeSettingsProblems({ walkers, jobs }, '--');
      if (tooMany.length > 0) throw new UsageError(tooMany[0]);
      const threads = parseRangeOption('--threads', raw.threads, THREADS);
      const contactSample = Math.min(walkers, parseRangeOption('--contact-sample', raw.contactSample, PROBE_CONTACT_SAMPLE, PROBE_CONTACT_SAMPLE.unit));
      const minStep = parseRangeOption('--min-step', raw.minStep, PROBE_MIN_STEP, PROBE_MIN_STEP.unit);
      const q = parseQGrid(String(raw.qGrid));
      const snapshot3d = readSnapshot3d(input);
      if (snapshot3d !== null) {
        writeProbe3d(input, snapshot3d, { walkers, seed, jobs, minStep, q, outRaw });
        return;
      }
      const window = raw.window === undefined ? null : parseWindowOption(String(raw.window));
      const latticeRaw = raw.lattice === undefined ? undefined : String(raw.lattice);
      if (latticeRaw !== undefined && latticeRaw !== 'square' && latticeRaw !== 'triangular') throw new UsageError(`--lattice: ${JSON.stringify(latticeRaw)} is not allowed; allowed: square, triangular`);
      const lattice = latticeRaw as 'square' | 'triangular' | undefined;
      let set: ProbeInput;
      try {
        set = readProbeInput(input);
      } catch (e) {
        throw new UsageError((e as Error).message);
      }
      if (lattice !== undefined) {
        if (set.kind !== 'snapshot') throw new UsageError(`--lattice: INPUT ${input} is a CSV of disks; --lattice applies to snapshots of lattice models only`);
        set = { ...set, lattice };
      } else {
        const shape = probeGeometryProblem(set, minStep, `INPUT ${input}`, '--min-step');
        if (shape !== null) throw new UsageError(shape);
      }
      const dir = resolve(outRaw);
      try {
        if (!statSync(dir).isDirectory()) throw new UsageError(`--out must name a folder, but "${outRaw}" is an existing file`);
      } catch (e) {
        if (e instanceof UsageError) throw e;
        mkdirSync(dir, { recursive: true });
      }
      let run;
      try {
        run = await runProbes(set, { walkers, seed, jobs, threads, q, contactSample, minStep, window });
      } catch (e) {
        if (e instanceof RangeError) throw new UsageError(`INPUT ${input}: ${e.message}`);
        throw e;
      }
      // the points that carry the measure: the disks, or the perimeter sites of a lattice set
      const pts = probedPointsOf(set);
      const what = set.lattice ? `perimeter sites of ${set.count} ${set.lattice}-lattice sites` : 'disks';
      const json = {
        input: { path: input, kind: set.kind, disks: set.count, ...(set.lattice ? { lattice: set.lattice, perimeterSites: pts.count } : {}) },
        seed, jobs, minStep,
        ...run.measures,
        timing: { probeSeconds: run.seconds, walkersPerSecond: walkers / run.seconds, threads },
      };
      writeFileSync(join(dir, MEASURES_FILE), JSON.stringify(json, null, 2) + '\n');
      writeFileSync(join(dir, HITS_FILE), diskHitsCsv(pts.count, pts.x, pts.y, pts.r, run.counts, walkers));
      const picture = renderMeasurePng(pts.count, pts.x, pts.y, set.lattice ? pts.r : set.drawRadius, run.counts);
      writeFileSync(join(dir, MEASURE_PICTURE_FILE), picture);
      const { renderer } = pngRenderer();
      if (renderer) {
        const drawRadius = set.lattice ? pts.r : set.drawRadius;
        const pixelsPerUnit = measurePictureGeometry(pts.count, pts.x, pts.y, drawRadius).scale;
        const unit = set.kind === 'snapshot' ? 'particle diameters' : 'units of x and y';
        const fig = measurePictureFigure({
          runIndex: 0, size: set.count, png: picture, scale: { pixelsPerUnit, unit },
          title: `Harmonic measure on ${pts.count} ${set.lattice ? 'perimeter sites' : 'disks'} (${walkers} walkers)`,
        });
        writeFileSync(join(dir, MEASURE_FIGURE_FILE), renderer.render(fig.svg, 2));
      }
      for (const w of run.measures.warnings) process.stderr.write(`warning: ${w}\n`);
      const cap = run.measures.capacity;
      process.stdout.write(
        `probed ${set.lattice ? `${pts.count} ${what}` : `${set.count} disks`} with ${walkers} walkers in ${run.seconds.toFixed(2)} s; ` +
        `tau'(1) = ${run.measures.spectrum.informationDimension.toFixed(3)}` +
        (cap ? `, capacity = ${cap.capacity.toPrecision(5)} +- ${cap.capacityError.toPrecision(2)}` : '') + `; wrote ${dir}\n`,
      );
    });
}

/** The point set of INPUT when it is a 3D snapshot, else null (2D inputs go the planar way). */
function readSnapshot3d(path: string): PointSet | null {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch {
    return null; // the planar reader reports unreadable inputs
  }
  if (bytes.length < 8 || bytes.subarray(0, 8).toString('latin1') !== 'TNDRLSNP') return null;
  try {
    const s = decodeSnapshot(bytes);
    return s.dimension === 3 ? s : null;
  } catch (e) {
    throw new UsageError(`INPUT ${path}: ${(e as Error).message}`);
  }
}

/**
 * Probe a 3D snapshot: capacity of the capture balls (radius = contact
 * distance), τ(q) from boxes of side 2^k contact distances (k = 1 … up to a
 * quarter of the cluster's extent, at least three sides), per-ball hits.
 */
function writeProbe3d(input: string, s: PointSet, o: { walkers: number; seed: string; jobs: number; minStep: number; q: number[]; outRaw: string }): void {
  const dir = resolve(o.outRaw);
  mkdirSync(dir, { recursive: true });
  const t0 = performance.now();
  const set = { count: s.count, x: s.x, y: s.y, z: s.z!, radius: s.diameter };
  const g = new ProbeGeometry3d(set);
  const run = runProbe3d(g, { seed: o.seed, walkers: o.walkers, jobs: o.jobs, minStep: o.minStep });
  const seconds = (performance.now() - t0) / 1000;
  const cap = capacityFromProbes(run.hitTotal, run.walkers, run.launchRadius);
  const sides: number[] = [];
  for (let e = 2 * s.diameter; e <= (g.extent * s.diameter) / 2 || sides.length < 3; e *= 2) sides.push(e);
  const spectrum = run.hitTotal > 0 ? boxSpectrum3d(s.x, s.y, s.z!, run.hits, o.q, sides) : null;
  const json = {
    input: { path: input, kind: 'snapshot-3d', balls: s.count, radius: s.diameter },
    dimension: 3,
    seed: o.seed,
    jobs: o.jobs,
    minStep: o.minStep,
    walkers: o.walkers,
    hits: run.hitTotal,
    capacity: {
      value: cap.capacity,
      error: cap.error,
      units: 'Newtonian capacity in units where a ball of radius a has capacity a (a thin disk of radius a has 2a/pi), in the snapshot\'s length units',
      launchRadius: run.launchRadius,
      rule: 'capacity = R_L * (probes that touch the set) / (probes launched uniformly on the sphere of radius R_L); error: binomial standard error',
    },
    spectrum: spectrum && {
      convention: 'Z(q, eps) = sum over boxes of side eps of mu_B^q ~ eps^tau(q); tau(q) = (q - 1) D_q',
      q: o.q,
      tau: spectrum.tau,
      boxSides: sides,
    },
    timing: { probeSeconds: seconds, walkersPerSecond: o.walkers / seconds },
  };
  writeFileSync(join(dir, MEASURES_FILE), JSON.stringify(json, null, 2) + '\n');
  writeFileSync(join(dir, HITS_FILE), ballHitsCsv(s.count, s.x, s.y, s.z!, s.diameter, run.hits));
  process.stdout.write(
    `probed ${s.count} balls (3D) with ${o.walkers} walkers in ${seconds.toFixed(2)} s; capacity = ${cap.capacity.toPrecision(5)} +- ${cap.error.toPrecision(2)}` +
      (spectrum ? `, tau(0) = ${(spectrum.tau[o.q.indexOf(0)] ?? NaN).toFixed(3)}` : '') +
      `; no picture for 3D sets; wrote ${dir}\n`,
  );
}
