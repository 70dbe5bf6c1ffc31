import { describe, expect, it } from 'vitest';
import { decideStopping, EnsembleStoppingMonitor } from '../coordinator/stats/adaptive-stopping.js';
import { syntheticEnsemble } from '../coordinator/stats/synthetic-ensemble.js';
import type { GrowthResult } from '../worker/core/growth-kernel.js';

// The batch projection uses the 1/sqrt(K) shrinking of a bootstrap interval of
// a mean (common practice, no source).

describe('decideStopping (pure rule)', () => {
  it('reports target reached, cap reached, or the next batch from the 1/sqrt(K) projection', () => {
    expect(decideStopping({ halfWidth: 0.009, targetHalfWidth: 0.01, clustersDone: 50, cap: 1000 }).action).toBe('target-reached');
    expect(decideStopping({ halfWidth: 0.02, targetHalfWidth: 0.01, clustersDone: 1000, cap: 1000 }).action).toBe('cap-reached');
    // half-width twice the target at K = 100: about 4 x 1.1 x 100 = 440 clusters needed, at most doubling per step
    const d = decideStopping({ halfWidth: 0.02, targetHalfWidth: 0.01, clustersDone: 100, cap: 1000 });
    expect(d).toMatchObject({ action: 'continue', projectedClusters: 440, nextBatch: 100 });
    const e = decideStopping({ halfWidth: 0.0105, targetHalfWidth: 0.01, clustersDone: 200, cap: 1000 });
    expect(e).toMatchObject({ action: 'continue', nextBatch: 43 }); // ceil(200 * 1.1025 * 1.1) - 200
    const f = decideStopping({ halfWidth: 0.05, targetHalfWidth: 0.01, clustersDone: 900, cap: 1000 });
    expect(f).toMatchObject({ action: 'continue', nextBatch: 100 });
    // too few clusters for an interval: bring the ensemble up to minClusters
    expect(decideStopping({ halfWidth: null, targetHalfWidth: 0.01, clustersDone: 0, cap: 1000, minClusters: 20 })).toMatchObject({ nextBatch: 20 });
    // a narrow interval from very few clusters is not trusted
    expect(decideStopping({ halfWidth: 0.001, targetHalfWidth: 0.01, clustersDone: 5, cap: 1000, minClusters: 20 }).action).toBe('continue');
    expect(() => decideStopping({ halfWidth: 0.1, targetHalfWidth: 0, clustersDone: 5, cap: 10 })).toThrow(/targetHalfWidth: 0 is out of range; allowed: a number from/);
    expect(() => decideStopping({ halfWidth: 0.1, targetHalfWidth: 0.1, clustersDone: 5, cap: 2.5 })).toThrow(/cap: 2.5 is out of range; allowed: an integer from/);
  });
});

describe('EnsembleStoppingMonitor on a synthetic source', () => {
  const sizes = Array.from({ length: 30 }, (_, i) => Math.round(1000 * Math.pow(10, i / 20)));
  const source = (first: number, count: number): GrowthResult[] =>
    syntheticEnsemble({ clusters: count, firstRunIndex: first, sizes, dimension: 1.71, seed: 77, walkSigma: 0.1 });

  function drive(monitor: EnsembleStoppingMonitor) {
    let runs: GrowthResult[] = [];
    let batch = monitor.firstBatch();
    for (let step = 0; step < 100; step++) {
      runs = runs.concat(source(runs.length, batch));
      const r = monitor.afterBatch(runs);
      if (r.decision.action !== 'continue') return { runs, report: r };
      batch = r.decision.nextBatch;
    }
    throw new Error('monitor did not stop in 100 batches');
  }

  it('stops once the interval half-width reaches the target', () => {
    const target = 0.01;
    const monitor = new EnsembleStoppingMonitor({ targetHalfWidth: target, cap: 5000, analysis: { resamples: 400 } });
    const { runs, report } = drive(monitor);
    expect(report.decision.action).toBe('target-reached');
    expect(report.halfWidth!).toBeLessThanOrEqual(target);
    expect(report.clustersDone).toBe(runs.length);
    expect(runs.length).toBeLessThan(5000);
    // every earlier report was above the target (no late stop), and the D interval covers the truth
    for (const h of monitor.history.slice(0, -1)) expect(h.halfWidth === null || h.halfWidth > target || h.clustersDone < 20).toBe(true);
    expect(report.interval![0]).toBeLessThanOrEqual(1.71);
    expect(report.interval![1]).toBeGreaterThanOrEqual(1.71);
    // the projection should not overshoot wildly: the last batch at most doubled the ensemble
    const prev = monitor.history.at(-2)!;
    console.log(monitor.history.map((h) => `${h.clustersDone}: ${h.halfWidth?.toPrecision(3)}`).join(", "));
    expect(runs.length).toBeLessThanOrEqual(2 * prev.clustersDone);
  });

  it('stops at the cap when the target is unreachable', () => {
    const monitor = new EnsembleStoppingMonitor({ targetHalfWidth: 1e-6, cap: 150, minBatch: 10, analysis: { resamples: 200 } });
    const { runs, report } = drive(monitor);
    expect(report.decision.action).toBe('cap-reached');
    expect(runs.length).toBe(150);
    expect(report.halfWidth!).toBeGreaterThan(1e-6);
  });
});
