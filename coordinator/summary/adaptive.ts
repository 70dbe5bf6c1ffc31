/**
 * Adaptive ensembles, shared by the embedded mode and the farm: the analysis
 * options a spec asks for, the stopping decision after a batch, and the batch
 * history that goes into the summary.
 *
 * Run i is always the task (ensemble seed, run index i), whichever batch
 * holds it, so an adaptive ensemble that stops at K clusters has exactly the
 * runs of a fixed ensemble of K clusters. The decision after a batch depends
 * only on the results of runs 0..K-1 (the analysis is deterministic), so a
 * restarted coordinator reaches the same decisions again.
 */
import type { RunResultData } from '../../proto/convert.js';
import { analyzeEnsemble, type AnalysisOptions, type EstimatorName } from '../stats/analyze-ensemble.js';
import { EnsembleStoppingMonitor, type StoppingDecision } from '../stats/adaptive-stopping.js';
import type { AnalysisSettings, EnsembleSpec, TargetEstimator } from '../spec/index.js';
import { messageOf } from '../../proto/errors.js';

export const ESTIMATOR_OF_TARGET: Record<TargetEstimator, EstimatorName> = {
  radius_of_gyration: 'radiusOfGyration',
  max_radius: 'maxRadius',
  mass_radius: 'massRadius',
};

/** The statistics library's options for the [analysis] settings of a spec. */
export function analysisOptionsOf(a: AnalysisSettings): AnalysisOptions {
  const o: AnalysisOptions = {};
  if (a.fitMinSize !== undefined || a.fitMaxSize !== undefined) o.fitWindow = { minSize: a.fitMinSize, maxSize: a.fitMaxSize };
  if (a.massRadiusMinRadius !== undefined || a.massRadiusMaxRadius !== undefined) {
    o.massRadiusWindow = { minRadius: a.massRadiusMinRadius, maxRadius: a.massRadiusMaxRadius };
  }
  if (a.resamples !== undefined) o.resamples = a.resamples;
  if (a.level !== undefined) o.level = a.level;
  if (a.corrections !== undefined) o.corrections = a.corrections;
  if (a.localSlopeWidth !== undefined) o.localSlopeWidthDecades = a.localSlopeWidth;
  return o;
}

export type AdaptiveOutcome = 'running' | 'target-reached' | 'cap-reached' | 'cancelled' | 'failed';

export interface AdaptiveBatch {
  /** 0-based batch number. */
  batch: number;
  /** Runs [fromRun, toRun) belong to this batch. */
  fromRun: number;
  toRun: number;
  /** Queue jobs firstJob .. firstJob+jobs-1 (farm); 0 in the embedded mode. */
  firstJob: number;
  jobs: number;
  /** Filled in once the batch is complete and judged. */
  judged: null | {
    clusters: number;
    D: number | null;
    halfWidth: number | null;
    interval: [number, number] | null;
    action: StoppingDecision['action'];
    reason: string;
  };
}

export interface AdaptiveHistory {
  target: {
    estimator: TargetEstimator;
    half_width: number;
    level: number;
    max_clusters: number;
    interval: 'bca';
  };
  outcome: AdaptiveOutcome;
  reason: string | null;
  batches: AdaptiveBatch[];
}

export function newAdaptiveHistory(spec: EnsembleSpec): AdaptiveHistory {
  const t = spec.target!;
  return {
    target: { estimator: t.estimator, half_width: t.halfWidth, level: t.level, max_clusters: t.maxClusters, interval: 'bca' },
    outcome: 'running',
    reason: null,
    batches: [],
  };
}

/**
 * Judge the ensemble after a complete batch: the results of runs 0..K-1
 * (K = clusters planned so far). Pure and deterministic.
 */
export function judgeBatch(spec: EnsembleSpec, runs: readonly RunResultData[]): NonNullable<AdaptiveBatch['judged']> & { nextBatch: number } {
  const t = spec.target;
  if (!t) throw new Error('judgeBatch: the spec has no [target]');
  const base = analysisOptionsOf(spec.analysis);
  const monitor = new EnsembleStoppingMonitor({
    targetHalfWidth: t.halfWidth,
    cap: t.maxClusters,
    estimator: ESTIMATOR_OF_TARGET[t.estimator],
    interval: 'bca',
    minBatch: t.minBatch,
    minClusters: t.minClusters,
    analysis: { ...base, resamples: base.resamples ?? 1000, level: t.level, localSlopes: false, corrections: false },
  });
  const r = monitor.afterBatch(runs);
  return {
    clusters: r.clustersDone,
    D: r.D,
    halfWidth: r.halfWidth,
    interval: r.interval,
    action: r.decision.action,
    reason: r.decision.reason,
    nextBatch: r.decision.action === 'continue' ? r.decision.nextBatch : 0,
  };
}

/** Analysis for a summary; never throws (an impossible analysis becomes { available: false, reason }). */
export function safeAnalysis(runs: readonly RunResultData[], options: AnalysisOptions): unknown {
  if (runs.length === 0) return { available: false, reason: 'no run has finished yet' };
  try {
    return analyzeEnsemble(runs, options);
  } catch (err) {
    return { available: false, reason: messageOf(err) };
  }
}
