/**
 * `tendril probe INPUT --walkers N --seed S --out DIR [--jobs K]
 *  [--q-grid a:b:step] [--threads T] [--contact-sample M] [--min-step h]`
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
 *   probe-hits.csv       index,x,y,r,hits,measure per disk
 *   probe-measure.png    the set coloured by log harmonic measure
 */
import { mkdirSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Command } from 'commander';
import { probeGeometryProblem } from '../../worker/probe/probe-limits.js';
import { UsageError } from '../usage-error.js';
import { parseIntegerOption, parseNumberOption, parseSeedOption } from './grow.js';
import { readProbeInput } from '../harmonic/probe-input.js';
import { runProbes } from '../harmonic/probe-run.js';
import { renderMeasurePng } from '../harmonic/measure-picture.js';
import { DEFAULT_PROBE_MIN_STEP } from '../../worker/probe/probe-2d.js';

export const MEASURES_FILE = 'probe-measures.json';
export const HITS_FILE = 'probe-hits.csv';
export const MEASURE_PICTURE_FILE = 'probe-measure.png';

/** Parse a:b:step into the grid a, a+step, … ≤ b (at most 401 values, |q| ≤ 50). */
export function parseQGrid(raw: string): number[] {
  const parts = raw.split(':').map((s) => s.trim());
  const nums = parts.map((s) => (/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(s) ? Number(s) : NaN));
  const bad = `--q-grid must be a:b:step with -50 <= a < b <= 50, step > 0 and at most 401 values, got ${JSON.stringify(raw)}`;
  if (nums.length !== 3 || nums.some((v) => !Number.isFinite(v))) throw new UsageError(bad);
  const [a, b, step] = nums;
  if (!(a >= -50 && b <= 50 && a < b && step > 0) || (b - a) / step > 400) throw new UsageError(bad);
  const out: number[] = [];
  const n = Math.floor((b - a) / step + 1e-9);
  for (let k = 0; k <= n; k++) out.push(Math.round((a + k * step) * 1e12) / 1e12);
  return out;
}

export function register(program: Command): void {
  program
    .command('probe')
    .description('measure the harmonic measure of a cluster snapshot or a CSV of x,y,r disks with probe walkers')
    .argument('<input>', '.snapshot file or .csv of x,y,r rows')
    .option('--walkers <n>', 'probe walkers in total, integer in [100, 10000000000]')
    .option('--seed <s>', 'unsigned 64-bit seed in decimal')
    .option('--out <dir>', 'output folder')
    .option('--jobs <k>', 'independent probe jobs, integer in [1, 4096]', '8')
    .option('--q-grid <a:b:step>', 'q values for tau(q)', '-1:5:0.25')
    .option('--threads <t>', 'worker threads, integer in [1, 64]', '1')
    .option('--contact-sample <m>', 'contact points kept for the capacity, integer in [3, 20000]', '4000')
    .option('--min-step <h>', 'straight-step length near contact in units of the largest radius, in (0, 1]', String(DEFAULT_PROBE_MIN_STEP))
    .action(async (input: string, raw: Record<string, unknown>) => {
      const need = (k: string, what: string): unknown => {
        if (raw[k] === undefined) throw new UsageError(`--${k} is required (${what})`);
        return raw[k];
      };
      const walkers = parseIntegerOption('walkers', need('walkers', 'an integer in [100, 10000000000]'), 100, 1e10);
      const seed = parseSeedOption('seed', need('seed', 'an unsigned 64-bit integer in decimal'));
      const outRaw = need('out', 'the output folder');
      if (typeof outRaw !== 'string' || outRaw.trim() === '') throw new UsageError(`--out must name a folder, got ${JSON.stringify(String(outRaw))}`);
      const jobs = parseIntegerOption('jobs', raw.jobs, 1, 4096);
      if (jobs > walkers) throw new UsageError(`--jobs must be at most --walkers (${walkers}), got ${jobs}`);
      const threads = parseIntegerOption('threads', raw.threads, 1, 64);
      const contactSample = Math.min(walkers, parseIntegerOption('contact-sample', raw.contactSample, 3, 20000));
      const minStep = parseNumberOption('min-step', raw.minStep, 0, 1, true);
      const q = parseQGrid(String(raw.qGrid));
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
        run = await runProbes(set, { walkers, seed, jobs, threads, q, contactSample, minStep });
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
      const cap = run.measures.capacity;
      process.stdout.write(
        `probed ${set.count} disks with ${walkers} walkers in ${run.seconds.toFixed(2)} s; ` +
        `tau'(1) = ${run.measures.spectrum.informationDimension.toFixed(3)}` +
        (cap ? `, capacity = ${cap.capacity.toPrecision(5)} +- ${cap.capacityError.toPrecision(2)}` : '') + `; wrote ${dir}\n`,
      );
    });
}
