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
 *   probe-measure.png    the set coloured by log harmonic measure
 */
import { mkdirSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Command } from 'commander';
import { probeGeometryProblem } from '../../worker/probe/probe-limits.js';
import { UsageError } from '../usage-error.js';
import { parseRangeOption, parseSeedOption } from './option-values.js';
import { describeRange } from '../../worker/core/value-range.js';
import { defaultProbeJobs, PROBE_CONTACT_SAMPLE, PROBE_JOBS, PROBE_MIN_STEP, PROBE_Q_MAX_VALUES, PROBE_Q_VALUE, PROBE_WALKERS, probeSettingsProblems, type ProbeSettingSpec } from '../harmonic/probe-settings.js';
import { readProbeInput } from '../harmonic/probe-input.js';
import { runProbes } from '../harmonic/probe-run.js';
import { renderMeasurePng } from '../harmonic/measure-picture.js';
import { WINDOW_RULE, windowProblem } from '../harmonic/fit-window.js';

export const MEASURES_FILE = 'probe-measures.json';
export const HITS_FILE = 'probe-hits.csv';
export const MEASURE_PICTURE_FILE = 'probe-measure.png';

/** Parse --window lo:hi (box sides relative to the set radius R; rule in fit-window.ts). */
export function parseWindowOption(raw: string): [number, number] {
  const parts = raw.split(':').map((t) => t.trim());
  const nums = parts.map((t) => (/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(t) ? Number(t) : NaN));
  if (nums.length !== 2 || windowProblem(nums) !== null) throw new UsageError(`--window must be lo:hi, ${WINDOW_RULE}, got ${JSON.stringify(raw)}`);
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
      const window = raw.window === undefined ? null : parseWindowOption(String(raw.window));
      let set;
      try {
        set = readProbeInput(input);
      } catch (e) {
        throw new UsageError((e as Error).message);
      }
      const shape = probeGeometryProblem(set, minStep, `INPUT ${input}`, '--min-step');
      if (shape !== null) throw new UsageError(shape);
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
      const json = {
        input: { path: input, kind: set.kind, disks: set.count },
        seed, jobs, minStep,
        ...run.measures,
        timing: { probeSeconds: run.seconds, walkersPerSecond: walkers / run.seconds, threads },
      };
      writeFileSync(join(dir, MEASURES_FILE), JSON.stringify(json, null, 2) + '\n');
      const lines = ['index,x,y,r,hits,measure'];
      for (let i = 0; i < set.count; i++) {
        const r = typeof set.r === 'number' ? set.r : set.r[i];
        lines.push(`${i},${set.x[i]},${set.y[i]},${r},${run.counts[i]},${run.counts[i] / walkers}`);
      }
      writeFileSync(join(dir, HITS_FILE), lines.join('\n') + '\n');
      writeFileSync(join(dir, MEASURE_PICTURE_FILE), renderMeasurePng(set.count, set.x, set.y, set.drawRadius, run.counts));
      for (const w of run.measures.warnings) process.stderr.write(`warning: ${w}\n`);
      const cap = run.measures.capacity;
      process.stdout.write(
        `probed ${set.count} disks with ${walkers} walkers in ${run.seconds.toFixed(2)} s; ` +
        `tau'(1) = ${run.measures.spectrum.informationDimension.toFixed(3)}` +
        (cap ? `, capacity = ${cap.capacity.toPrecision(5)} +- ${cap.capacityError.toPrecision(2)}` : '') + `; wrote ${dir}\n`,
      );
    });
}
