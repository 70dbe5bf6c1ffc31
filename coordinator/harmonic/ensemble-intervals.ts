/**
 * Ensemble-level intervals for a per-cluster harmonic measure (τ(q), D_q,
 * log capacity, …): the cluster bootstrap of coordinator/stats (whole
 * clusters resampled with replacement) of the ensemble mean, with the
 * percentile and BCa intervals of coordinator/stats/bca.ts (jackknife
 * acceleration from leave-one-cluster-out means).
 */
import { bootstrapRandom, bootstrapScalar, jackknifeMeans, weightedMean } from '../stats/bootstrap.js';
import { bootstrapInterval, unavailableInterval, type IntervalSummary } from '../stats/bca.js';

export interface EnsembleValue {
  mean: number;
  clusters: number;
  interval: IntervalSummary;
}

export function ensembleMeanInterval(
  perCluster: readonly number[], seed: string | number, resamples = 2000, level = 0.95,
): EnsembleValue {
  const k = perCluster.length;
  const v = Float64Array.from(perCluster);
  let s = 0;
  for (const x of perCluster) s += x;
  const mean = k > 0 ? s / k : NaN;
  if (k < 3) return { mean, clusters: k, interval: unavailableInterval(level, 'too-few-clusters', `${k} clusters; at least 3 are needed`) };
  const rng = bootstrapRandom(seed);
  const reps = bootstrapScalar(k, resamples, rng, (counts, drawn, used) => weightedMean(v, counts, drawn, used));
  return { mean, clusters: k, interval: bootstrapInterval(mean, reps, jackknifeMeans(v), level) };
}
