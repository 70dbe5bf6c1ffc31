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

import type { HarmonicMeasures } from './probe-analysis.js';

export interface EnsembleHarmonicSummary {
  clusters: number;
  q: number[];
  tau: EnsembleValue[];
  informationDimension: EnsembleValue;
  maxConcentrationExponent: EnsembleValue;
  /** Mean of log capacity over clusters (clusters without a capacity are left out). */
  logCapacity: EnsembleValue;
}

/** Bootstrap intervals over clusters for the measures of an ensemble probed on one q grid. */
export function ensembleHarmonicSummary(perCluster: readonly HarmonicMeasures[], seed: string | number, resamples = 2000, level = 0.95): EnsembleHarmonicSummary {
  if (perCluster.length === 0) throw new RangeError('ensemble harmonic summary needs at least one cluster');
  const q = perCluster[0].spectrum.q;
  for (const [i, m] of perCluster.entries())
    if (m.spectrum.q.length !== q.length || m.spectrum.q.some((v, k) => v !== q[k]))
      throw new RangeError(`cluster ${i}: q grid differs from cluster 0's`);
  return {
    clusters: perCluster.length,
    q: [...q],
    tau: q.map((_, k) => ensembleMeanInterval(perCluster.map((m) => m.spectrum.tau[k]), seed, resamples, level)),
    informationDimension: ensembleMeanInterval(perCluster.map((m) => m.spectrum.informationDimension), seed, resamples, level),
    maxConcentrationExponent: ensembleMeanInterval(perCluster.map((m) => m.maxConcentration.exponent), seed, resamples, level),
    logCapacity: ensembleMeanInterval(perCluster.flatMap((m) => (m.capacity ? [m.capacity.logCapacity] : [])), seed, resamples, level),
  };
}
