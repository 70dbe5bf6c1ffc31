/**
 * Aggregation benchmark: analyzeEnsemble on 10^4 synthetic runs x 60 recorded
 * sizes (20 per decade, N = 10^3 .. 8.9e5) plus 30 mass-radius radii, with
 * 2000 bootstrap resamples, local slopes and corrections fits, on one core.
 * Prints one human line, then one JSON line {"bench":"aggregate",...}.
 * Run: node dist/test/bench/aggregate-bench.js   (or via run-benchmarks).
 */

import { pathToFileURL } from 'node:url';
import { analyzeEnsemble } from '../../coordinator/stats/analyze-ensemble.js';
import { logSpacedSizes, syntheticEnsemble } from '../../coordinator/stats/synthetic-ensemble.js';

export interface AggregateBenchResult {
  bench: 'aggregate';
  runs: number;
  sizes: number;
  radii: number;
  resamples: number;
  /** Seconds spent in analyzeEnsemble (synthetic data generation excluded). */
  seconds: number;
  /** Seconds to generate the synthetic runs (not part of the figure). */
  generateSeconds: number;
  /** D from R_g as a sanity check (true D = 1.71). */
  dimensionRadiusOfGyration: number | null;
  node: string;
}

export function runAggregateBenchmark(opts: { runs?: number; resamples?: number } = {}): AggregateBenchResult {
  const runsN = opts.runs ?? 10_000;
  const resamples = opts.resamples ?? 2000;
  const sizes = logSpacedSizes(1000, 20, 60);
  const radii = logSpacedSizes(2, 10, 30);
  const t0 = process.hrtime.bigint();
  const runs = syntheticEnsemble({ clusters: runsN, sizes, radii, dimension: 1.71, seed: 2024, correction: { amplitude: -0.5, omega: 0.7 } });
  const t1 = process.hrtime.bigint();
  const analysis = analyzeEnsemble(runs, { resamples });
  const t2 = process.hrtime.bigint();
  return {
    bench: 'aggregate', runs: runsN, sizes: sizes.length, radii: radii.length, resamples,
    seconds: Number(t2 - t1) / 1e9, generateSeconds: Number(t1 - t0) / 1e9,
    dimensionRadiusOfGyration: analysis.estimators.radiusOfGyration.D, node: process.version,
  };
}

const invokedDirectly = process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
if (invokedDirectly) {
  const r = runAggregateBenchmark();
  console.log(`aggregate: ${r.runs} runs x ${r.sizes} sizes, ${r.resamples} resamples: ${r.seconds.toFixed(2)} s (target < 10 s on one core)`);
  console.log(JSON.stringify(r));
}
