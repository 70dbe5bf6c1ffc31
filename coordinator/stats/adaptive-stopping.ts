/**
 * Adaptive stopping: grow an ensemble batch by batch until the confidence
 * interval of D is as narrow as asked, or the cluster cap is reached.
 *
 * decideStopping is a pure rule:
 *   1. half-width known, at least minClusters done, half-width <= target -> 'target-reached'
 *   2. clusters done >= cap                                              -> 'cap-reached'
 *   3. otherwise 'continue' with a next batch sized from the 1/sqrt(K)
 *      scaling of a bootstrap interval: projected K = K (h / target)^2 * 1.1
 *      (10% margin), batch = projected - K, clamped to [minBatch, maxBatch],
 *      to at most doubling the ensemble per step (early half-widths are
 *      noisy), and to the clusters left under the cap. Without a half-width
 *      yet (too few clusters), the batch brings the ensemble to minClusters.
 *
 * EnsembleStoppingMonitor is the driver-agnostic helper: the farm (or the
 * embedded runner) calls afterBatch(allResultsSoFar) after each batch and
 * gets the decision plus the estimate it was based on.
 */

import { rangeProblem } from '../../worker/core/value-range.js';
import type { GrowthResult } from '../../worker/core/growth-kernel.js';
import { analyzeEnsemble, type AnalysisOptions, type EstimatorName } from './analyze-ensemble.js';
import { StatsInputError } from './ensemble-data.js';

export interface StoppingInput {
  /** Current interval half-width of the monitored quantity, or null if no interval yet. */
  halfWidth: number | null;
  /** Target half-width (> 0). */
  targetHalfWidth: number;
  clustersDone: number;
  /** Most clusters allowed. */
  cap: number;
  /** Smallest batch; default 8. */
  minBatch?: number;
  /** Largest batch; default cap. */
  maxBatch?: number;
  /** Fewest clusters before the target may be declared reached; default 20. */
  minClusters?: number;
}

export type StoppingDecision =
  | { action: 'continue'; nextBatch: number; projectedClusters: number; reason: string }
  | { action: 'target-reached'; reason: string }
  | { action: 'cap-reached'; reason: string };

function need(field: string, v: unknown, lo: number, hi: number, integer: boolean): number {
  const problem = rangeProblem(field, v, { min: lo, max: hi, integer });
  if (problem !== null) throw new StatsInputError(problem);
  return v as number;
}

export function decideStopping(input: StoppingInput): StoppingDecision {
  const target = need('targetHalfWidth', input.targetHalfWidth, Number.MIN_VALUE, Number.MAX_VALUE, false);
  const cap = need('cap', input.cap, 1, Number.MAX_SAFE_INTEGER, true);
  const done = need('clustersDone', input.clustersDone, 0, Number.MAX_SAFE_INTEGER, true);
  const minBatch = need('minBatch', input.minBatch ?? 8, 1, Number.MAX_SAFE_INTEGER, true);
  const maxBatch = need('maxBatch', input.maxBatch ?? cap, minBatch, Number.MAX_SAFE_INTEGER, true);
  const minClusters = need('minClusters', input.minClusters ?? 20, 1, Number.MAX_SAFE_INTEGER, true);
  const h = input.halfWidth;
  if (h !== null && !(Number.isFinite(h) && h >= 0)) throw new StatsInputError(`halfWidth: ${String(h)} is not a finite number >= 0 (or null)`);
  if (h !== null && done >= minClusters && h <= target) {
    return { action: 'target-reached', reason: `half-width ${h.toPrecision(3)} <= target ${target.toPrecision(3)} with ${done} clusters` };
  }
  if (done >= cap) {
    return { action: 'cap-reached', reason: `${done} clusters reached the cap of ${cap}; half-width ${h === null ? 'unknown' : h.toPrecision(3)}, target ${target.toPrecision(3)}` };
  }
  let projected: number;
  if (h === null || done === 0) projected = Math.max(minClusters, done + minBatch);
  else projected = Math.max(minClusters, Math.ceil(done * (h / target) * (h / target) * 1.1 - 1e-9));
  let batch = projected - done;
  batch = Math.max(batch, minBatch);
  batch = Math.min(batch, maxBatch);
  if (done > 0) batch = Math.min(batch, Math.max(done, minBatch));
  batch = Math.min(batch, cap - done);
  return {
    action: 'continue', nextBatch: batch, projectedClusters: Math.min(projected, cap),
    reason: h === null ? `no interval yet with ${done} clusters` : `half-width ${h.toPrecision(3)} > target ${target.toPrecision(3)}; about ${projected} clusters projected`,
  };
}

export interface MonitorOptions {
  targetHalfWidth: number;
  cap: number;
  /** Estimator whose D interval is monitored; default 'radiusOfGyration'. */
  estimator?: EstimatorName;
  /** Interval used; default 'bca'. */
  interval?: 'bca' | 'percentile';
  minBatch?: number;
  maxBatch?: number;
  minClusters?: number;
  /**
   * Options of the analysis run after each batch; default: 1000 resamples,
   * no local slopes and no corrections fit (only the monitored interval matters).
   */
  analysis?: AnalysisOptions;
}

export interface MonitorReport {
  decision: StoppingDecision;
  clustersDone: number;
  D: number | null;
  halfWidth: number | null;
  interval: [number, number] | null;
}

export class EnsembleStoppingMonitor {
  readonly history: MonitorReport[] = [];
  constructor(private readonly opts: MonitorOptions) {
    decideStopping({ halfWidth: null, targetHalfWidth: opts.targetHalfWidth, clustersDone: 0, cap: opts.cap, minBatch: opts.minBatch, maxBatch: opts.maxBatch, minClusters: opts.minClusters });
  }

  /** First batch size, before any result exists. */
  firstBatch(): number {
    const d = decideStopping({ halfWidth: null, targetHalfWidth: this.opts.targetHalfWidth, clustersDone: 0, cap: this.opts.cap, minBatch: this.opts.minBatch, maxBatch: this.opts.maxBatch, minClusters: this.opts.minClusters });
    return d.action === 'continue' ? d.nextBatch : 0;
  }

  /** Call with all results so far (any order; duplicates of a run index count once). */
  afterBatch(runs: readonly GrowthResult[]): MonitorReport {
    const est = this.opts.estimator ?? 'radiusOfGyration';
    const a = analyzeEnsemble(runs, { resamples: 1000, localSlopes: false, corrections: false, ...this.opts.analysis, estimators: [est] });
    const s = a.estimators[est];
    const iv = (this.opts.interval ?? 'bca') === 'bca' ? s.interval.bca ?? s.interval.percentile : s.interval.percentile;
    const ok = s.interval.status === 'ok' || s.interval.status === 'degenerate';
    const halfWidth = ok && iv ? (iv[1] - iv[0]) / 2 : null;
    const decision = decideStopping({
      halfWidth, targetHalfWidth: this.opts.targetHalfWidth, clustersDone: a.clusters, cap: this.opts.cap,
      minBatch: this.opts.minBatch, maxBatch: this.opts.maxBatch, minClusters: this.opts.minClusters,
    });
    const report: MonitorReport = { decision, clustersDone: a.clusters, D: s.D, halfWidth, interval: ok ? iv : null };
    this.history.push(report);
    return report;
  }
}
