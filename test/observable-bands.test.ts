import { describe, expect, it } from 'vitest';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { observableSection } from '../coordinator/stats/observable-bands.js';
import { Random } from '../worker/core/random.js';

// Synthetic runs with a known law: w = 0.5 · R^0.3 · exp(noise), R = sqrt(N / π), and a
// constant observable plus independent noise; the fit must find 0.3 and the bands must cover the truth.
function syntheticRuns(k: number, beta: number): GrowthResult[] {
  const sizes = [10, 100, 1000, 2000, 5000, 10_000, 20_000, 50_000, 100_000];
  const rng = Random.forRun('3', 0);
  const runs: GrowthResult[] = [];
  for (let i = 0; i < k; i++) {
    const radius = sizes.map((n) => Math.sqrt(n / Math.PI));
    runs.push({
      engineVersion: 'x', model: { kind: 'eden-square', params: {} }, dimension: 2, particles: 100_000, ensembleSeed: '3', runIndex: i,
      series: {
        sizes, radiusOfGyration: radius, maxRadius: radius, centerOffset: sizes.map(() => 0),
        extra: {
          interface_radius: radius,
          interface_width: radius.map((r) => 0.5 * r ** beta * Math.exp(0.05 * rng.nextSigned())),
          fold_amplitude_4: sizes.map(() => 0.1 + 0.02 * rng.nextSigned()),
        },
      },
      massRadius: { radii: [1], counts: [1] }, counters: {}, stateHash: '0',
    });
  }
  return runs;
}

describe('model observables in the summary: bands against N and the interface growth exponent', () => {
  it('finds a known exponent; bands have the width of the exact standard error', () => {
    const s = observableSection(syntheticRuns(40, 0.3), { seed: '1', resamples: 500, level: 0.95 })!;
    expect(s.schema).toBe('tendril.observables/1');
    expect(s.bands.map((b) => b.name)).toEqual(['fold_amplitude_4', 'interface_radius', 'interface_width']);
    const g = s.interfaceGrowth!;
    expect(g.window.fromSize).toBe(1000);
    expect(g.window.points).toBe(7);
    const iv = g.interval.bca!;
    expect(iv[0]).toBeLessThan(0.3);
    expect(iv[1]).toBeGreaterThan(0.3);
    expect(Math.abs(g.beta - 0.3)).toBeLessThan(0.02);
    // 0.3 is not 1/3 and the interval is narrow enough to tell: the verdict follows the stated rule
    expect(g.verdict).toBe(iv[0] <= 1 / 3 && 1 / 3 <= iv[1] ? 'consistent' : 'differs');
    const a = s.bands[0];
    // band half-width against the exact standard error of a mean of 40 uniform draws on 0.1 ± 0.02:
    // sd 0.02/√3, so the 95% half-width is 1.96 · 0.02/√3/√40 (within 25%: the bootstrap estimates it
    // from the sample); and the mean is within 4 standard errors of 0.1 at every size
    const se = 0.02 / Math.sqrt(3) / Math.sqrt(40);
    for (let i = 0; i < a.sizes.length; i++) {
      expect(Math.abs((a.hi[i] - a.lo[i]) / 2 / (1.96 * se) - 1)).toBeLessThan(0.25);
      expect(Math.abs(a.mean[i] - 0.1)).toBeLessThan(4 * se);
      expect(a.lo[i]).toBeLessThan(a.mean[i]);
      expect(a.mean[i]).toBeLessThan(a.hi[i]);
    }
  });

  it('says "consistent" for β = 1/3 data and "differs" for β = 0.5 data', () => {
    expect(observableSection(syntheticRuns(40, 1 / 3), { seed: '1', resamples: 500, level: 0.95 })!.interfaceGrowth!.verdict).toBe('consistent');
    expect(observableSection(syntheticRuns(40, 0.5), { seed: '1', resamples: 500, level: 0.95 })!.interfaceGrowth!.verdict).toBe('differs');
  });

  it('is null without model observables', () => {
    const runs = syntheticRuns(3, 0.3).map((r) => ({ ...r, series: { ...r.series, extra: {} } }));
    expect(observableSection(runs, { seed: '1', resamples: 100, level: 0.95 })).toBeNull();
  });
});
