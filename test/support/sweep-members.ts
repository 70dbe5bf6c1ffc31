/** Synthetic member summaries for the sweep tests: only what the sweep table reads. */
import type { EnsembleSummaryData } from '../../proto/convert.js';
import type { SweepMemberInput } from '../../coordinator/summary/sweep-summary.js';

export type Iv = [number, number] | null;

/** A member summary holding only what the sweep reads: the analysis' estimators (with local slopes) and, optionally, a harmonic section. */
export function syntheticMember(value: number, est: Record<string, { D: number | null; iv: Iv }>, relation?: { estimate: number; low: number; high: number; verdict: string }): SweepMemberInput {
  const estimators: Record<string, unknown> = {};
  for (const [name, e] of Object.entries(est)) {
    estimators[name] = {
      name, quantity: name, method: '', available: e.D !== null, reason: e.D === null ? 'too few sizes' : null, D: e.D, slope: null, amplitude: null, residualRms: null,
      interval: { level: 0.95, percentile: e.iv, bca: e.iv, status: e.iv ? 'ok' : 'too-few-clusters', notes: [], biasCorrection: null, acceleration: null, standardError: null, replicatesUsed: 0 },
      fitWindow: null,
      localSlopes: e.D === null ? null : { method: '', widthDecades: 0.5, points: [100, 300, 1000, 3000].map((at, i) => ({ at, D: e.D! + 0.01 * (3 - i), percentile: null, bca: [e.D! - 0.05, e.D! + 0.05], status: 'ok' })) },
    };
  }
  const statistics: Record<string, unknown> = {
    schema: 'tendril.ensemble-statistics/1', modelKind: null, clusters: 8, duplicatesDropped: 0, finalSize: 3000, averaging: '', estimators,
    corrections: { radiusOfGyration: null, maxRadius: null },
  };
  if (relation) {
    statistics.harmonic = {
      schema: 'tendril-harmonic/1',
      breakdownRelation: { eta: value, tauDifference: { estimate: relation.estimate, low: relation.low, high: relation.high }, massDimension: { estimate: 1.7, low: 1.6, high: 1.8 }, verdict: relation.verdict, rule: 'test rule' },
    };
  }
  const summary = { name: `m ${value}`, clustersDone: 8, clustersPlanned: 8, partial: false, statisticsJson: JSON.stringify(statistics) } as unknown as EnsembleSummaryData;
  return { value, ensembleId: `s-${value}`, summary };
}

