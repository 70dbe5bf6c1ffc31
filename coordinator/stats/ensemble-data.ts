/**
 * Turns per-cluster run results into typed-array matrices of logarithms, one
 * row per cluster (clusters in ascending run index, duplicates of a run index
 * counted once), one column per recorded size (or radius).
 *
 * Averaging across clusters is done on the logarithms (ensemble mean of
 * log R, i.e. the geometric mean of R), not on R itself, because
 *  - the cluster-to-cluster scatter is multiplicative, so log R has the
 *    additive, nearly symmetric noise a least-squares line assumes;
 *  - the slope of the mean of log R is exactly the mean of the per-cluster
 *    slopes, so every cluster enters the exponent with equal weight and the
 *    bootstrap of the exponent is a bootstrap of a mean;
 *  - log <R> = <log R> + var(log R)/2 + ..., and var(log R) changes with N
 *    (the scatter accumulates along the growth history), which would bias the
 *    slope of log <R> by d var / d log N / 2. The mean of log R has no such term.
 *
 * A column enters only if every cluster has a finite, positive value there
 * (e.g. R_g = 0 at N = 1 is left out).
 */

import type { GrowthResult } from '../../worker/core/growth-kernel.js';
import { TendrilError } from '../../proto/errors.js';

/** log y against log x for K clusters on a common abscissa grid. */
export interface LogLogData {
  /** Abscissa values (N or r), length S. */
  abscissa: Float64Array;
  /** Natural log of the abscissa. */
  x: Float64Array;
  /** Row-major K x S matrix of natural logs of the ordinate. */
  y: Float64Array;
  rows: number;
  columns: number;
  /** Ensemble mean of y per column. */
  mean: Float64Array;
}

export interface EnsembleData {
  clusters: number;
  runIndices: number[];
  duplicatesDropped: number;
  modelKind: string | null;
  /** Largest recorded size common to all clusters. */
  finalSize: number;
  radiusOfGyration: LogLogData;
  maxRadius: LogLogData;
  /** Null if no cluster carries mass-radius counts. */
  massRadius: LogLogData | null;
  /** Final radius of gyration of each cluster (last common size). */
  finalRadiusOfGyration: Float64Array;
  notes: string[];
}

/** One-line input error naming the field, its value and what is allowed. */
export class StatsInputError extends TendrilError {
  override name = 'StatsInputError';
  readonly kind = 'stats-input';
}

function columnMeans(y: Float64Array, rows: number, columns: number): Float64Array {
  const m = new Float64Array(columns);
  for (let c = 0; c < rows; c++) for (let s = 0; s < columns; s++) m[s] += y[c * columns + s];
  for (let s = 0; s < columns; s++) m[s] /= rows;
  return m;
}

function buildLogLog(abscissa: number[], values: (c: number, s: number) => number, rows: number): LogLogData {
  const keep: number[] = [];
  for (let s = 0; s < abscissa.length; s++) {
    if (!(abscissa[s] > 0) || !Number.isFinite(abscissa[s])) continue;
    let ok = true;
    for (let c = 0; c < rows && ok; c++) { const v = values(c, s); if (!(v > 0) || !Number.isFinite(v)) ok = false; }
    if (ok) keep.push(s);
  }
  const columns = keep.length;
  const ab = new Float64Array(columns), x = new Float64Array(columns), y = new Float64Array(rows * columns);
  for (let j = 0; j < columns; j++) { ab[j] = abscissa[keep[j]]; x[j] = Math.log(ab[j]); }
  for (let c = 0; c < rows; c++) for (let j = 0; j < columns; j++) y[c * columns + j] = Math.log(values(c, keep[j]));
  return { abscissa: ab, x, y, rows, columns, mean: columnMeans(y, rows, columns) };
}

/** M at log radius lr by linear interpolation of log M in log r; NaN outside the cluster's grid or where counts <= 0. */
function interpMass(radii: number[], counts: number[], lr: number): number {
  const n = Math.min(radii.length, counts.length);
  let lo = 0, hi = n - 1;
  if (n === 0 || !(radii[0] > 0)) return NaN;
  const r = Math.exp(lr);
  if (r < radii[0] * (1 - 1e-12) || r > radii[hi] * (1 + 1e-12)) return NaN;
  while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (radii[mid] <= r) lo = mid; else hi = mid; }
  const m0 = counts[lo], m1 = counts[hi];
  if (!(m0 > 0) || !(m1 > 0)) return NaN;
  if (hi === lo || radii[hi] === radii[lo]) return Math.log(m0);
  const t = (lr - Math.log(radii[lo])) / (Math.log(radii[hi]) - Math.log(radii[lo]));
  return Math.exp(Math.log(m0) + Math.min(Math.max(t, 0), 1) * (Math.log(m1) - Math.log(m0)));
}

function sameArray(a: number[], b: number[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Validate and convert run results; throws StatsInputError with a one-line message on bad input. */
export function extractEnsembleData(input: readonly GrowthResult[]): EnsembleData {
  if (!Array.isArray(input) || input.length === 0) throw new StatsInputError('runs: got 0 run results, need at least 1');
  const notes: string[] = [];
  const byIndex = new Map<number, GrowthResult>();
  let duplicatesDropped = 0;
  for (let i = 0; i < input.length; i++) {
    const r = input[i];
    if (!r || !r.series || !Array.isArray(r.series.sizes)) throw new StatsInputError(`runs[${i}].series: missing or not a series of sizes`);
    if (!Number.isSafeInteger(r.runIndex) || r.runIndex < 0) throw new StatsInputError(`runs[${i}].runIndex: ${String(r.runIndex)} is not a non-negative integer`);
    const prev = byIndex.get(r.runIndex);
    if (prev) {
      if (prev.stateHash !== r.stateHash) {
        throw new StatsInputError(`runs[${i}].stateHash: run index ${r.runIndex} appears twice with different state hashes (${prev.stateHash} vs ${r.stateHash}); a run must be deterministic`);
      }
      duplicatesDropped++;
      continue;
    }
    byIndex.set(r.runIndex, r);
  }
  if (duplicatesDropped > 0) notes.push(`${duplicatesDropped} duplicate run result(s) with the same run index counted once`);
  const runs = [...byIndex.values()].sort((a, b) => a.runIndex - b.runIndex);
  const k = runs.length;
  const kinds = new Set(runs.map((r) => r.model?.kind ?? ''));
  if (kinds.size > 1) throw new StatsInputError(`runs[].model.kind: mixed model kinds ${[...kinds].join(', ')}; an ensemble has one model`);
  const modelKind = runs[0].model?.kind ?? null;
  const seeds = new Set(runs.map((r) => r.ensembleSeed));
  if (seeds.size > 1) throw new StatsInputError(`runs[].ensembleSeed: ${seeds.size} different ensemble seeds (${[...seeds].slice(0, 3).join(', ')}...); analyse one ensemble at a time`);

  // common size grid: the shortest series, checked to be a prefix of all others
  let shortest = runs[0];
  for (const r of runs) if (r.series.sizes.length < shortest.series.sizes.length) shortest = r;
  const sizes = shortest.series.sizes;
  const len = sizes.length;
  for (const r of runs) {
    const s = r.series;
    if (s.radiusOfGyration.length < len || s.maxRadius.length < len) {
      throw new StatsInputError(`run ${r.runIndex} series: radiusOfGyration/maxRadius have ${Math.min(s.radiusOfGyration.length, s.maxRadius.length)} entries, sizes has ${s.sizes.length}`);
    }
    for (let i = 0; i < len; i++) {
      if (s.sizes[i] !== sizes[i]) {
        throw new StatsInputError(`run ${r.runIndex} series.sizes[${i}]: ${s.sizes[i]} differs from ${sizes[i]} of run ${shortest.runIndex}; all runs of an ensemble need the same size grid`);
      }
    }
  }
  if (runs.some((r) => r.series.sizes.length > len)) notes.push(`series truncated to the ${len} sizes common to all runs (up to N = ${sizes[len - 1]})`);
  const finalSize = len > 0 ? sizes[len - 1] : 0;
  const rg = buildLogLog(sizes, (c, s) => runs[c].series.radiusOfGyration[s], k);
  const rmax = buildLogLog(sizes, (c, s) => runs[c].series.maxRadius[s], k);
  const finalRg = new Float64Array(k);
  for (let c = 0; c < k; c++) finalRg[c] = len > 0 ? runs[c].series.radiusOfGyration[len - 1] : NaN;

  let massRadius: LogLogData | null = null;
  const withMass = runs.filter((r) => r.massRadius && Array.isArray(r.massRadius.radii) && r.massRadius.radii.length > 0);
  if (withMass.length === k) {
    const first = runs[0].massRadius;
    if (runs.every((r) => sameArray(r.massRadius.radii, first.radii))) {
      massRadius = buildLogLog(first.radii, (c, s) => runs[c].massRadius.counts[s], k);
    } else {
      // common grid: radii of the first run inside the range every run covers; log-log interpolation
      let lo = 0, hi = Infinity;
      for (const r of runs) { lo = Math.max(lo, r.massRadius.radii[0]); hi = Math.min(hi, r.massRadius.radii[r.massRadius.radii.length - 1]); }
      const grid = first.radii.filter((v) => v >= lo && v <= hi && v > 0);
      massRadius = buildLogLog(grid, (c, s) => interpMass(runs[c].massRadius.radii, runs[c].massRadius.counts, Math.log(grid[s])), k);
      notes.push('mass-radius radii differ between runs: counts interpolated (linear in log-log) onto a common grid');
    }
  } else if (withMass.length > 0) {
    notes.push(`${k - withMass.length} run(s) carry no mass-radius counts: mass-radius estimator left out`);
  }
  return { clusters: k, runIndices: runs.map((r) => r.runIndex), duplicatesDropped, modelKind, finalSize, radiusOfGyration: rg, maxRadius: rmax, massRadius, finalRadiusOfGyration: finalRg, notes };
}
