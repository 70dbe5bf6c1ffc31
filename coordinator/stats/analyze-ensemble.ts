/**
 * analyzeEnsemble: the one entry point of the ensemble statistics library.
 * Pure (no I/O); the output is plain JSON (every number finite, or null).
 *
 * Output fields (EnsembleAnalysis), for the README's summary schema:
 *
 *   schema            'tendril.ensemble-statistics/1'
 *   modelKind         model kind of the runs (e.g. 'dla-offlattice-2d') or null
 *   clusters          clusters analysed (distinct run indices)
 *   duplicatesDropped run results whose run index was already present (counted once)
 *   finalSize         largest cluster size N recorded by every run
 *   averaging         how clusters are combined: the ensemble mean of log R (log M), see ensemble-data.ts
 *   estimators        { radiusOfGyration, maxRadius, massRadius }: EstimatorSummary each
 *       .name            estimator key
 *       .quantity        'R_g(N)', 'R_max(N)' or 'M(r)'
 *       .method          one-line description of the fit
 *       .available       false when it could not be formed (then .reason says why; other fields null)
 *       .D               fractal dimension from the fit window
 *       .slope           fitted log-log slope (1/D for R(N), D for M(r))
 *       .amplitude       prefactor of the fitted power law (R = A N^slope, M = A r^slope)
 *       .residualRms     rms residual of the fit of the ensemble-mean curve (natural log units)
 *       .interval        IntervalSummary for D: level, percentile [lo, hi], bca [lo, hi], status
 *                        ('ok' | 'degenerate' | 'too-few-clusters' | 'unstable' | 'unavailable'),
 *                        notes, biasCorrection z0, acceleration a, standardError, replicatesUsed
 *       .fitWindow       { variable 'N' | 'r', from, to (requested bounds), firstUsed, lastUsed,
 *                          points, source 'default' | 'user', rule (text of the rule applied) }
 *       .localSlopes     null, or { method, widthDecades, points: [{ at, D, percentile, bca, status }] }:
 *                        effective D from a sliding OLS window of widthDecades (full width) centred at `at`
 *   corrections       { radiusOfGyration, maxRadius }: CorrectionsSummary or null (disabled)
 *       .available, .reason, .method, .window { from, to, points, source, rule }
 *       .D, .omega, .amplitude, .correctionAmplitude (B), .relativeCorrection (B N_min^-omega):
 *                        each { value, interval } (value null when undetermined)
 *       .omegaStatus     'resolved' | 'undetermined'; .omegaReason says why when undetermined
 *       .rss, .rssPowerLaw, .points
 *   consistency       ConsistencyPanel (see consistency-panel.ts): rows (estimators side by side, with the
 *                     published value's difference), pairs (paired-bootstrap difference intervals and
 *                     agreement), bounds (Kesten's D >= 3/2 for 2D DLA, D <= d), reference, rules
 *   options           the options actually used: seed (string), resamples, level, minClusters, windows,
 *                     localSlopeWidthDecades, corrections on/off, omegaRange, jackknifeGroups,
 *                     embeddingDimension, generator ('Random.forRun(seed, 0, STREAM_BOOTSTRAP)')
 *   notes             remarks about the input (duplicates, truncation, fallbacks of windows)
 */

import { rangeProblem } from '../../worker/core/value-range.js';
import type { GrowthResult } from '../../worker/core/growth-kernel.js';
import { parseSeed } from '../../worker/core/random.js';
import { bootstrapInterval, unavailableInterval, type IntervalSummary } from './bca.js';
import { bootstrapRandom, drawResample, jackknifeMeans, weightedColumnMeans, weightedMean } from './bootstrap.js';
import { buildConsistencyPanel, type ConsistencyPanel } from './consistency-panel.js';
import { extractEnsembleData, StatsInputError, type EnsembleData, type LogLogData } from './ensemble-data.js';
import { applyWeights, fitLine, rowSlopes, slopeWeights } from './log-log-fit.js';
import { localWindows, type LocalWindow } from './local-slopes.js';
import { referenceFor } from './reference-values.js';
import { CorrectionsFitter, DEFAULT_CORRECTIONS_FIT, type CorrectionsFit } from './scaling-corrections-fit.js';

export type EstimatorName = 'radiusOfGyration' | 'maxRadius' | 'massRadius';
export const ESTIMATOR_NAMES: readonly EstimatorName[] = ['radiusOfGyration', 'maxRadius', 'massRadius'];

export interface SizeWindow { minSize?: number; maxSize?: number }
export interface RadiusWindow { minRadius?: number; maxRadius?: number }

export interface AnalysisOptions {
  /** Bootstrap seed; default: the ensemble seed of the run with the lowest index. */
  seed?: string | number;
  /** Bootstrap resamples B; default 2000, allowed 10..1000000. */
  resamples?: number;
  /** Confidence level; default 0.95, allowed 0.5..0.999. */
  level?: number;
  /** Fewest clusters for which intervals are given; default 5, allowed 2..1000000. */
  minClusters?: number;
  /** Fit window in N for R_g and R_max; default see DEFAULT_SIZE_WINDOW_RULE. */
  fitWindow?: SizeWindow;
  /** Fit window in r for M(r); default see DEFAULT_RADIUS_WINDOW_RULE. */
  massRadiusWindow?: RadiusWindow;
  /** Compute local slopes with bands; default true. */
  localSlopes?: boolean;
  /** Full width of the local-slope window in decades; default 0.5, allowed 0.05..3. */
  localSlopeWidthDecades?: number;
  /** Run the corrections-to-scaling fit; default true. */
  corrections?: boolean;
  /** Window in N of the corrections fit; default see DEFAULT_CORRECTIONS_WINDOW_RULE. */
  correctionsWindow?: SizeWindow;
  /** Search range of omega; default [0.05, 4]. */
  omegaRange?: [number, number];
  /** Groups of the delete-a-group jackknife for the corrections fit's BCa acceleration; default 100. */
  jackknifeGroups?: number;
  /** Embedding dimension d for the check D <= d; default from the model's reference entry. */
  embeddingDimension?: number;
  /** Estimators to compute; default all three. */
  estimators?: EstimatorName[];
}

export const DEFAULT_SIZE_WINDOW_RULE =
  'N from max(100, N_final * 10^-1.5) to N_final (the last 1.5 decades: the effective dimension of DLA drifts with N, and a wider window reaches into the drift of the small clusters); if fewer than 4 recorded sizes fall inside, the last 4 usable sizes';

/** Decades of N below the final size covered by the default size window (see DEFAULT_SIZE_WINDOW_RULE). */
export const DEFAULT_SIZE_WINDOW_DECADES = 1.5;
export const DEFAULT_RADIUS_WINDOW_RULE =
  'r from max(5, R_g(N_lo)) to 0.5 * (smallest final R_g of the ensemble), where N_lo is the lower end of the R_g/R_max size window and R_g(N_lo) the ensemble mean radius of gyration there ' +
  '(geometric mean, interpolated in log N): the part of a cluster within r of its seed was laid down while the cluster was about that big, so M(r) then describes the same stage of growth as the R_g(N) and R_max(N) fits, and the upper end keeps to the frozen interior; ' +
  'if fewer than 4 radii fall inside, r from 1 to the smallest final R_g';

/** exp of the ensemble-mean log ordinate of `d` at abscissa `at`, interpolated linearly in log abscissa (clamped to the recorded range). */
function meanAt(d: LogLogData, at: number): number {
  const lx = Math.log(at);
  const n = d.columns;
  if (n === 0) return NaN;
  if (lx <= d.x[0]) return Math.exp(d.mean[0]);
  if (lx >= d.x[n - 1]) return Math.exp(d.mean[n - 1]);
  let j = 1;
  while (d.x[j] < lx) j++;
  const f = (lx - d.x[j - 1]) / (d.x[j] - d.x[j - 1]);
  return Math.exp(d.mean[j - 1] + f * (d.mean[j] - d.mean[j - 1]));
}
export const DEFAULT_CORRECTIONS_WINDOW_RULE = 'N from max(10, N_final * 10^-4) to N_final';

export interface FitWindowSummary {
  variable: 'N' | 'r';
  from: number;
  to: number;
  firstUsed: number | null;
  lastUsed: number | null;
  points: number;
  source: 'default' | 'user';
  rule: string;
}

export interface LocalSlopePoint {
  at: number;
  D: number | null;
  percentile: [number, number] | null;
  bca: [number, number] | null;
  status: IntervalSummary['status'];
}

export interface EstimatorSummary {
  name: EstimatorName;
  quantity: string;
  method: string;
  available: boolean;
  reason: string | null;
  D: number | null;
  slope: number | null;
  amplitude: number | null;
  residualRms: number | null;
  interval: IntervalSummary;
  fitWindow: FitWindowSummary | null;
  localSlopes: { method: string; widthDecades: number; points: LocalSlopePoint[] } | null;
}

export interface ValueWithInterval { value: number | null; interval: IntervalSummary }

export interface CorrectionsSummary {
  estimator: 'radiusOfGyration' | 'maxRadius';
  available: boolean;
  reason: string | null;
  method: string;
  window: { from: number; to: number; points: number; source: 'default' | 'user'; rule: string } | null;
  D: ValueWithInterval;
  omega: ValueWithInterval;
  omegaStatus: 'resolved' | 'undetermined';
  omegaReason: string | null;
  amplitude: ValueWithInterval;
  correctionAmplitude: ValueWithInterval;
  relativeCorrection: ValueWithInterval;
  rss: number | null;
  rssPowerLaw: number | null;
  points: number;
}

export interface EnsembleAnalysis {
  schema: 'tendril.ensemble-statistics/1';
  modelKind: string | null;
  clusters: number;
  duplicatesDropped: number;
  finalSize: number;
  averaging: string;
  estimators: Record<EstimatorName, EstimatorSummary>;
  corrections: { radiusOfGyration: CorrectionsSummary | null; maxRadius: CorrectionsSummary | null };
  consistency: ConsistencyPanel;
  options: {
    seed: string;
    generator: string;
    resamples: number;
    level: number;
    minClusters: number;
    fitWindow: SizeWindow | 'default';
    massRadiusWindow: RadiusWindow | 'default';
    localSlopes: boolean;
    localSlopeWidthDecades: number;
    corrections: boolean;
    correctionsWindow: SizeWindow | 'default';
    omegaRange: [number, number];
    jackknifeGroups: number;
    embeddingDimension: number | null;
    estimators: EstimatorName[];
  };
  notes: string[];
}

const QUANTITY: Record<EstimatorName, string> = { radiusOfGyration: 'R_g(N)', maxRadius: 'R_max(N)', massRadius: 'M(r)' };

function checkNumber(field: string, v: unknown, lo: number, hi: number, integer = false): number {
  const problem = rangeProblem(field, v, { min: lo, max: hi, integer });
  if (problem !== null) throw new StatsInputError(problem);
  return v as number;
}

function checkWindow(field: string, lo: number | undefined, hi: number | undefined): void {
  if (lo !== undefined) checkNumber(`${field}.min`, lo, 0, Number.MAX_VALUE);
  if (hi !== undefined) checkNumber(`${field}.max`, hi, 0, Number.MAX_VALUE);
  if (lo !== undefined && hi !== undefined && !(lo < hi)) throw new StatsInputError(`${field}: lower bound ${lo} is not below upper bound ${hi}`);
}

/** Index range [from, to) of abscissa values within [lo, hi] (relative tolerance 1e-9). */
function indexRange(ab: Float64Array, lo: number, hi: number): [number, number] {
  let from = 0;
  while (from < ab.length && ab[from] < lo * (1 - 1e-9)) from++;
  let to = from;
  while (to < ab.length && ab[to] <= hi * (1 + 1e-9)) to++;
  return [from, to];
}

interface Setup {
  name: EstimatorName;
  data: LogLogData;
  invert: boolean;
  from: number;
  to: number;
  window: FitWindowSummary;
  clusterSlopes: Float64Array;
  slope: number;
  intercept: number;
  residualRms: number;
  rep: Float64Array;
  local: LocalWindow[];
  localRep: Float64Array;
  corr: CorrSetup | null;
  scratch: Float64Array;
  needMean: boolean;
}

interface CorrSetup {
  from: number;
  to: number;
  fitter: CorrectionsFitter;
  point: CorrectionsFit;
  window: NonNullable<CorrectionsSummary['window']>;
  repD: Float64Array; repOmega: Float64Array; repA: Float64Array; repB: Float64Array; repRel: Float64Array;
}

function unavailableEstimator(name: EstimatorName, reason: string, level: number, window: FitWindowSummary | null): EstimatorSummary {
  return {
    name, quantity: QUANTITY[name], method: methodText(name), available: false, reason, D: null, slope: null, amplitude: null, residualRms: null,
    interval: unavailableInterval(level, 'unavailable', reason), fitWindow: window, localSlopes: null,
  };
}

function methodText(name: EstimatorName): string {
  return name === 'massRadius'
    ? 'OLS fit of the ensemble mean of ln M against ln r over the fit window; D = slope'
    : `OLS fit of the ensemble mean of ln ${name === 'radiusOfGyration' ? 'R_g' : 'R_max'} against ln N over the fit window; D = 1/slope`;
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/**
 * Analyse an ensemble of growth results: fractal dimension from three
 * estimators with percentile and BCa intervals, local slopes with bands,
 * corrections-to-scaling fits and a consistency panel. Deterministic: the
 * same runs (in any order) and options give the same output bit for bit.
 * Throws StatsInputError (one line naming the field) on invalid input.
 */
export function analyzeEnsemble(runs: readonly GrowthResult[], options: AnalysisOptions = {}): EnsembleAnalysis {
  const data = extractEnsembleData(runs);
  const k = data.clusters;
  const notes = [...data.notes];
  const resamples = checkNumber('resamples', options.resamples ?? 2000, 10, 1_000_000, true);
  const level = checkNumber('level', options.level ?? 0.95, 0.5, 0.999);
  const minClusters = checkNumber('minClusters', options.minClusters ?? 5, 2, 1_000_000, true);
  const widthDecades = checkNumber('localSlopeWidthDecades', options.localSlopeWidthDecades ?? 0.5, 0.05, 3);
  const jackknifeGroups = checkNumber('jackknifeGroups', options.jackknifeGroups ?? 100, 2, 1_000_000, true);
  const omegaRange = options.omegaRange ?? [DEFAULT_CORRECTIONS_FIT.omegaMin, DEFAULT_CORRECTIONS_FIT.omegaMax];
  checkNumber('omegaRange[0]', omegaRange[0], 1e-3, 100);
  checkNumber('omegaRange[1]', omegaRange[1], 1e-3, 100);
  if (!(omegaRange[0] < omegaRange[1])) throw new StatsInputError(`omegaRange: lower end ${omegaRange[0]} is not below upper end ${omegaRange[1]}`);
  checkWindow('fitWindow', options.fitWindow?.minSize, options.fitWindow?.maxSize);
  checkWindow('massRadiusWindow', options.massRadiusWindow?.minRadius, options.massRadiusWindow?.maxRadius);
  checkWindow('correctionsWindow', options.correctionsWindow?.minSize, options.correctionsWindow?.maxSize);
  const estimatorNames = options.estimators ?? [...ESTIMATOR_NAMES];
  for (const e of estimatorNames) if (!ESTIMATOR_NAMES.includes(e)) throw new StatsInputError(`estimators: "${String(e)}" is not one of ${ESTIMATOR_NAMES.join(', ')}`);
  let seedText: string;
  const seedIn = options.seed ?? runs.find((r) => r.runIndex === data.runIndices[0])?.ensembleSeed ?? '0';
  try { seedText = parseSeed(seedIn).toString(); } catch { throw new StatsInputError(`seed: "${String(seedIn)}" is not an unsigned 64-bit integer`); }
  const reference = referenceFor(data.modelKind);
  const embeddingDimension = options.embeddingDimension !== undefined
    ? checkNumber('embeddingDimension', options.embeddingDimension, 1, 3, true)
    : reference?.embeddingDimension ?? null;
  const doLocal = options.localSlopes ?? true;
  const doCorrections = options.corrections ?? true;
  const bootstrapOn = k >= minClusters;
  const tooFew = `${k} cluster(s): intervals need at least ${minClusters}`;
  if (!bootstrapOn) notes.push(tooFew);

  // --- set up the estimators
  const setups: Setup[] = [];
  const summaries = {} as Record<EstimatorName, EstimatorSummary>;
  let minFinalRg = Infinity;
  for (let c = 0; c < k; c++) if (data.finalRadiusOfGyration[c] < minFinalRg) minFinalRg = data.finalRadiusOfGyration[c];
  for (const name of ESTIMATOR_NAMES) {
    if (!estimatorNames.includes(name)) { summaries[name] = unavailableEstimator(name, 'not requested', level, null); continue; }
    const d = name === 'massRadius' ? data.massRadius : data[name];
    if (!d || d.columns < 2) { summaries[name] = unavailableEstimator(name, d ? `only ${d.columns} usable point(s)` : 'no mass-radius counts in the runs', level, null); continue; }
    const ab = d.abscissa;
    let lo: number, hi: number, source: 'default' | 'user', rule: string;
    let [from, to] = [0, 0];
    if (name === 'massRadius') {
      const user = options.massRadiusWindow;
      if (user && (user.minRadius !== undefined || user.maxRadius !== undefined)) {
        lo = user.minRadius ?? 0; hi = user.maxRadius ?? Infinity; source = 'user'; rule = 'user-set window in r';
        [from, to] = indexRange(ab, lo, hi);
      } else {
        source = 'default'; rule = DEFAULT_RADIUS_WINDOW_RULE;
        const sizeUser = options.fitWindow;
        const sizeLo = sizeUser?.minSize !== undefined ? sizeUser.minSize : Math.max(100, data.finalSize * Math.pow(10, -DEFAULT_SIZE_WINDOW_DECADES));
        const stage = data.radiusOfGyration.columns > 0 ? meanAt(data.radiusOfGyration, sizeLo) : NaN;
        lo = Number.isFinite(stage) ? Math.max(5, stage) : 5; hi = 0.5 * minFinalRg;
        [from, to] = indexRange(ab, lo, hi);
        if (to - from < 4) { lo = 1; hi = minFinalRg; [from, to] = indexRange(ab, lo, hi); notes.push(`massRadius: default window had fewer than 4 radii; widened to r in [1, ${hi.toPrecision(4)}]`); }
      }
    } else {
      const user = options.fitWindow;
      if (user && (user.minSize !== undefined || user.maxSize !== undefined)) {
        lo = user.minSize ?? 0; hi = user.maxSize ?? Infinity; source = 'user'; rule = 'user-set window in N';
        [from, to] = indexRange(ab, lo, hi);
      } else {
        source = 'default'; rule = DEFAULT_SIZE_WINDOW_RULE;
        hi = data.finalSize; lo = Math.max(100, hi * Math.pow(10, -DEFAULT_SIZE_WINDOW_DECADES));
        [from, to] = indexRange(ab, lo, hi);
        if (to - from < 4) {
          to = d.columns; from = Math.max(0, to - 4); lo = ab[from]; hi = ab[to - 1];
          notes.push(`${name}: default window had fewer than 4 sizes; using the last ${to - from} usable sizes N in [${lo}, ${hi}]`);
        }
      }
    }
    const window: FitWindowSummary = {
      variable: name === 'massRadius' ? 'r' : 'N', from: finiteOrNull(lo) ?? 0, to: finiteOrNull(hi) ?? ab[ab.length - 1],
      firstUsed: to > from ? ab[from] : null, lastUsed: to > from ? ab[to - 1] : null, points: to - from, source, rule,
    };
    if (to - from < 2) {
      if (source === 'user') {
        throw new StatsInputError(`${name === 'massRadius' ? 'massRadiusWindow' : 'fitWindow'}: [${lo}, ${hi}] holds ${to - from} usable point(s), need at least 2 (usable values run from ${ab[0]} to ${ab[ab.length - 1]})`);
      }
      summaries[name] = unavailableEstimator(name, `fit window holds ${to - from} usable point(s), need at least 2`, level, window);
      continue;
    }
    const w = slopeWeights(d.x, from, to)!;
    const clusterSlopes = rowSlopes(d.y, k, d.columns, w, from);
    const line = fitLine(d.x, d.mean, from, to);
    let slope = 0;
    for (let c = 0; c < k; c++) slope += clusterSlopes[c];
    slope /= k;
    const local = doLocal ? localWindows(d.x, widthDecades) : [];
    let corr: CorrSetup | null = null;
    if (doCorrections && name !== 'massRadius') {
      const user = options.correctionsWindow;
      let clo: number, chi: number, csrc: 'default' | 'user', crule: string;
      if (user && (user.minSize !== undefined || user.maxSize !== undefined)) {
        clo = user.minSize ?? 0; chi = user.maxSize ?? Infinity; csrc = 'user'; crule = 'user-set window in N';
      } else {
        chi = data.finalSize; clo = Math.max(10, chi * 1e-4); csrc = 'default'; crule = DEFAULT_CORRECTIONS_WINDOW_RULE;
      }
      const [cf, ct] = indexRange(ab, clo, chi);
      const cwin = { from: finiteOrNull(clo) ?? 0, to: finiteOrNull(chi) ?? ab[ab.length - 1], points: ct - cf, source: csrc, rule: crule };
      if (ct - cf >= 6) {
        const fitter = new CorrectionsFitter(d.x.subarray(cf, ct), { ...DEFAULT_CORRECTIONS_FIT, omegaMin: omegaRange[0], omegaMax: omegaRange[1] });
        const point = fitter.fit(d.mean.subarray(cf, ct));
        const mk = () => new Float64Array(bootstrapOn ? resamples : 0);
        corr = { from: cf, to: ct, fitter, point, window: cwin, repD: mk(), repOmega: mk(), repA: mk(), repB: mk(), repRel: mk() };
      } else {
        notes.push(`${name}: corrections fit needs at least 6 sizes in its window, found ${ct - cf}`);
      }
    }
    const needMean = bootstrapOn && (local.length > 0 || corr !== null);
    setups.push({
      name, data: d, invert: name !== 'massRadius', from, to, window, clusterSlopes, slope, intercept: line.intercept, residualRms: line.residualRms,
      rep: new Float64Array(bootstrapOn ? resamples : 0), local, localRep: new Float64Array(bootstrapOn ? resamples * local.length : 0),
      corr, scratch: new Float64Array(d.columns), needMean,
    });
  }

  // --- bootstrap: one resample of whole clusters feeds every estimator (paired replicates)
  if (bootstrapOn) {
    const rng = bootstrapRandom(seedText);
    const counts = new Int32Array(k), drawn = new Int32Array(k), weights = new Float64Array(k);
    const repTol = 1e-3; // in ln omega: 0.1%, far below any bootstrap spread of omega
    for (let b = 0; b < resamples; b++) {
      const used = drawResample(rng, counts, drawn, weights);
      for (const e of setups) {
        const sl = weightedMean(e.clusterSlopes, counts, drawn, used);
        e.rep[b] = e.invert ? 1 / sl : sl;
        if (!e.needMean) continue;
        const cols = e.data.columns;
        weightedColumnMeans(e.data.y, cols, k, drawn, weights, used, e.scratch);
        for (let j = 0; j < e.local.length; j++) {
          const lw = e.local[j];
          const ls = applyWeights(lw.weights, e.scratch, lw.from);
          e.localRep[j * resamples + b] = e.invert ? 1 / ls : ls;
        }
        if (e.corr) {
          const f = e.corr.fitter.fit(e.scratch.subarray(e.corr.from, e.corr.to), repTol, 5, 2);
          e.corr.repD[b] = f.dimension; e.corr.repOmega[b] = f.omega; e.corr.repA[b] = f.amplitude;
          e.corr.repB[b] = f.correctionAmplitude; e.corr.repRel[b] = f.relativeCorrection;
        }
      }
    }
  }

  // --- point estimates, jackknife, intervals
  const jackD = new Map<EstimatorName, Float64Array>();
  const corrections: EnsembleAnalysis['corrections'] = { radiusOfGyration: null, maxRadius: null };
  for (const e of setups) {
    const D = e.invert ? 1 / e.slope : e.slope;
    let interval: IntervalSummary;
    if (bootstrapOn) {
      const jm = jackknifeMeans(e.clusterSlopes);
      const jd = new Float64Array(k);
      for (let c = 0; c < k; c++) jd[c] = e.invert ? 1 / jm[c] : jm[c];
      jackD.set(e.name, jd);
      interval = bootstrapInterval(D, e.rep, jd, level);
    } else {
      interval = unavailableInterval(level, 'too-few-clusters', tooFew);
    }
    let localSlopes: EstimatorSummary['localSlopes'] = null;
    if (doLocal) {
      const cols = e.data.columns;
      const points: LocalSlopePoint[] = [];
      const jl = new Float64Array(k);
      for (let j = 0; j < e.local.length; j++) {
        const lw = e.local[j];
        const ls = applyWeights(lw.weights, e.data.mean, lw.from);
        const dl = e.invert ? 1 / ls : ls;
        let iv: IntervalSummary;
        if (bootstrapOn) {
          for (let c = 0; c < k; c++) {
            const lc = applyWeights(lw.weights, e.data.y, c * cols + lw.from);
            const v = (k * ls - lc) / (k - 1);
            jl[c] = e.invert ? 1 / v : v;
          }
          iv = bootstrapInterval(dl, e.localRep.subarray(j * resamples, (j + 1) * resamples), jl, level);
        } else {
          iv = unavailableInterval(level, 'too-few-clusters', tooFew);
        }
        points.push({ at: e.data.abscissa[lw.center], D: finiteOrNull(dl), percentile: iv.percentile, bca: iv.bca, status: iv.status });
      }
      localSlopes = {
        method: `OLS slope of the ensemble mean of ln ${QUANTITY[e.name].replace('(N)', '').replace('(r)', '')} over a sliding window of ${widthDecades} decade(s) full width centred at each point; ${e.invert ? 'D = 1/slope' : 'D = slope'}`,
        widthDecades, points,
      };
    }
    summaries[e.name] = {
      name: e.name, quantity: QUANTITY[e.name], method: methodText(e.name), available: true, reason: null,
      D: finiteOrNull(D), slope: finiteOrNull(e.slope), amplitude: finiteOrNull(Math.exp(e.intercept)), residualRms: finiteOrNull(e.residualRms),
      interval, fitWindow: e.window, localSlopes,
    };
    if (e.corr && e.name !== 'massRadius') corrections[e.name] = summarizeCorrections(e, data, bootstrapOn, level, jackknifeGroups, tooFew, omegaRange);
  }
  if (doCorrections) {
    for (const n of ['radiusOfGyration', 'maxRadius'] as const) {
      if (!corrections[n]) corrections[n] = unavailableCorrections(n, summaries[n].available ? 'too few sizes in the corrections window' : summaries[n].reason ?? 'unavailable', level);
    }
  }

  // --- consistency panel
  const panelEstimates = setups.map((e) => ({ name: e.name as string, D: summaries[e.name].D, interval: summaries[e.name].interval }));
  for (const n of ['radiusOfGyration', 'maxRadius'] as const) {
    const c = corrections[n];
    if (c && c.available) panelEstimates.push({ name: `${n}Corrected`, D: c.D.value, interval: c.D.interval });
  }
  const pairs: { a: string; b: string; difference: number | null; interval: IntervalSummary }[] = [];
  for (let i = 0; i < setups.length; i++) {
    for (let j = i + 1; j < setups.length; j++) {
      const ea = setups[i], eb = setups[j];
      const da = summaries[ea.name].D, db = summaries[eb.name].D;
      const diff = da !== null && db !== null ? da - db : null;
      let iv: IntervalSummary;
      if (bootstrapOn && diff !== null) {
        const rep = new Float64Array(resamples);
        for (let b = 0; b < resamples; b++) rep[b] = ea.rep[b] - eb.rep[b];
        const ja = jackD.get(ea.name)!, jb = jackD.get(eb.name)!;
        const jd = new Float64Array(k);
        for (let c = 0; c < k; c++) jd[c] = ja[c] - jb[c];
        iv = bootstrapInterval(diff, rep, jd, level);
      } else {
        iv = unavailableInterval(level, bootstrapOn ? 'unavailable' : 'too-few-clusters', bootstrapOn ? 'an estimate is missing' : tooFew);
      }
      pairs.push({ a: ea.name, b: eb.name, difference: diff, interval: iv });
    }
  }
  const consistency = buildConsistencyPanel(data.modelKind, reference, embeddingDimension, panelEstimates, pairs);

  return {
    schema: 'tendril.ensemble-statistics/1',
    modelKind: data.modelKind,
    clusters: k,
    duplicatesDropped: data.duplicatesDropped,
    finalSize: data.finalSize,
    averaging: 'ensemble mean of ln R (ln M) at each size (geometric mean of R): multiplicative scatter, and the fitted slope is then the mean of per-cluster slopes',
    estimators: summaries,
    corrections,
    consistency,
    options: {
      seed: seedText,
      generator: 'Random.forRun(seed, 0, STREAM_BOOTSTRAP); whole clusters resampled with replacement',
      resamples, level, minClusters,
      fitWindow: options.fitWindow ?? 'default',
      massRadiusWindow: options.massRadiusWindow ?? 'default',
      localSlopes: doLocal, localSlopeWidthDecades: widthDecades,
      corrections: doCorrections,
      correctionsWindow: options.correctionsWindow ?? 'default',
      omegaRange: [omegaRange[0], omegaRange[1]], jackknifeGroups, embeddingDimension,
      estimators: [...estimatorNames],
    },
    notes,
  };
}

function unavailableCorrections(name: 'radiusOfGyration' | 'maxRadius', reason: string, level: number): CorrectionsSummary {
  const none = (): ValueWithInterval => ({ value: null, interval: unavailableInterval(level, 'unavailable', reason) });
  return {
    estimator: name, available: false, reason, method: CORRECTIONS_METHOD, window: null,
    D: none(), omega: none(), omegaStatus: 'undetermined', omegaReason: reason, amplitude: none(), correctionAmplitude: none(), relativeCorrection: none(),
    rss: null, rssPowerLaw: null, points: 0,
  };
}

const CORRECTIONS_METHOD =
  'least squares of ln R = ln A + (1/D) ln N + ln(1 + B N^-omega) on the ensemble-mean ln R; profile over omega (log grid, golden-section refinement), Gauss-Newton in (ln A, 1/D, B)';

function summarizeCorrections(
  e: Setup, data: EnsembleData, bootstrapOn: boolean, level: number, groups: number, tooFew: string, omegaRange: [number, number],
): CorrectionsSummary {
  const c = e.corr!;
  const p = c.point;
  const k = data.clusters;
  const names = ['D', 'omega', 'amplitude', 'correctionAmplitude', 'relativeCorrection'] as const;
  const pointVals = [p.dimension, p.omega, p.amplitude, p.correctionAmplitude, p.relativeCorrection];
  const reps = [c.repD, c.repOmega, c.repA, c.repB, c.repRel];
  const ivs: IntervalSummary[] = [];
  if (bootstrapOn) {
    // delete-a-group jackknife (contiguous groups in run-index order) for the acceleration
    const g = Math.min(k, groups);
    const jack = names.map(() => new Float64Array(g));
    const cols = e.data.columns;
    const m = new Float64Array(c.to - c.from);
    for (let gi = 0; gi < g; gi++) {
      const a = Math.floor((gi * k) / g), b = Math.floor(((gi + 1) * k) / g);
      for (let s = c.from; s < c.to; s++) {
        let sum = e.data.mean[s] * k;
        for (let r = a; r < b; r++) sum -= e.data.y[r * cols + s];
        m[s - c.from] = sum / (k - (b - a));
      }
      const f = c.fitter.fit(m, 1e-3, 5, 2);
      const v = [f.dimension, f.omega, f.amplitude, f.correctionAmplitude, f.relativeCorrection];
      for (let q = 0; q < names.length; q++) jack[q][gi] = v[q];
    }
    for (let q = 0; q < names.length; q++) ivs.push(bootstrapInterval(pointVals[q], reps[q], jack[q], level));
  } else {
    for (let q = 0; q < names.length; q++) ivs.push(unavailableInterval(level, 'too-few-clusters', tooFew));
  }
  let omegaReason: string | null = null;
  if (p.correctionNegligible) omegaReason = 'the correction term is zero within rounding (pure power law): omega is not determined by the data';
  else if (p.omegaAtBound) omegaReason = `the best omega lies at an end of the search range [${omegaRange[0]}, ${omegaRange[1]}]`;
  else {
    const rel = ivs[4].bca ?? ivs[4].percentile;
    if (rel && rel[0] <= 0 && rel[1] >= 0) omegaReason = 'the interval of the correction amplitude contains 0: no correction resolved, omega undetermined';
  }
  const status = omegaReason ? 'undetermined' : 'resolved';
  const vi = (q: number, hide = false): ValueWithInterval => ({
    value: hide ? null : finiteOrNull(pointVals[q]),
    interval: hide ? unavailableInterval(level, 'unavailable', omegaReason ?? 'undetermined') : ivs[q],
  });
  return {
    estimator: e.name as 'radiusOfGyration' | 'maxRadius', available: true, reason: null, method: CORRECTIONS_METHOD, window: c.window,
    D: vi(0), omega: vi(1, status === 'undetermined'), omegaStatus: status, omegaReason,
    amplitude: vi(2), correctionAmplitude: vi(3), relativeCorrection: vi(4),
    rss: finiteOrNull(p.rss), rssPowerLaw: finiteOrNull(p.rssPowerLaw), points: p.points,
  };
}
