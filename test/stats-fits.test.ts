import { describe, expect, it } from 'vitest';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import { StatsInputError } from '../coordinator/stats/ensemble-data.js';
import { fitLine } from '../coordinator/stats/log-log-fit.js';
import { localWindows } from '../coordinator/stats/local-slopes.js';
import { fitScalingCorrections } from '../coordinator/stats/scaling-corrections-fit.js';
import { logSpacedSizes, syntheticEnsemble } from '../coordinator/stats/synthetic-ensemble.js';
import type { GrowthResult } from '../worker/core/growth-kernel.js';

// Exact power laws must be recovered to rounding: a least-squares line through
// points on a line is that line (common practice, no source). The corrections
// model R = A N^{1/D} (1 + B N^-omega) with known (D, omega, A, B) must be
// recovered by the nonlinear fit when the data are exactly of that form.

function exactRuns(opts: { clusters: number; D: number; sizes: number[]; radii: number[]; amplitudeSpread?: number; correction?: { B: number; omega: number } }): GrowthResult[] {
  const out: GrowthResult[] = [];
  for (let c = 0; c < opts.clusters; c++) {
    // per-cluster amplitudes differ (multiplicative), exponents are exact
    const f = 1 + (opts.amplitudeSpread ?? 0.1) * Math.sin(1.7 * c + 0.3);
    const corr = (n: number) => (opts.correction ? 1 + opts.correction.B * Math.pow(n, -opts.correction.omega) : 1);
    out.push({
      engineVersion: 'test', model: { kind: 'dla-offlattice-2d', params: { min_step: 0.5, launch_margin: 2 } }, dimension: 2, particles: opts.sizes[opts.sizes.length - 1],
      ensembleSeed: '5', runIndex: c,
      series: {
        sizes: opts.sizes.slice(),
        radiusOfGyration: opts.sizes.map((n) => 0.6 * f * Math.pow(n, 1 / opts.D) * corr(n)),
        maxRadius: opts.sizes.map((n) => 1.7 * f * Math.pow(n, 1 / opts.D) * corr(n)),
        centerOffset: opts.sizes.map(() => 0),
        extra: {},
      },
      massRadius: { radii: opts.radii.slice(), counts: opts.radii.map((r) => 1.3 * f * Math.pow(r, opts.D)) },
      counters: { jumps: 0, shortSteps: 0, returns: 0 }, stateHash: `h${c}`,
    });
  }
  return out;
}

// 1 .. 10^5 at 20 per decade, rounded to integers, duplicates of small integers removed
const sizes = [...new Set(Array.from({ length: 101 }, (_, i) => Math.round(Math.pow(10, i / 20))))];
const radii = Array.from({ length: 30 }, (_, i) => Math.pow(10, i / 10));

describe('log-log fits on exact power laws', () => {
  it('fitLine recovers slope and intercept exactly', () => {
    const x = Float64Array.from({ length: 20 }, (_, i) => i * 0.3);
    const y = x.map((v) => 0.25 + 0.5848 * v);
    const f = fitLine(x, y, 0, 20);
    expect(f.slope).toBeCloseTo(0.5848, 12);
    expect(f.intercept).toBeCloseTo(0.25, 12);
    expect(f.residualRms).toBeLessThan(1e-12);
  });

  it('all three estimators give D exactly, local slopes are flat, the default windows follow their rules', () => {
    const D = 1.71;
    const a = analyzeEnsemble(exactRuns({ clusters: 12, D, sizes, radii }), { resamples: 200, corrections: false });
    for (const n of ['radiusOfGyration', 'maxRadius', 'massRadius'] as const) {
      const e = a.estimators[n];
      expect(e.available).toBe(true);
      expect(e.D!).toBeCloseTo(D, 10);
      // slopes are exact for every cluster, so every replicate is equal
      expect(e.interval.status).toBe('degenerate');
      expect(e.interval.percentile![0]).toBeCloseTo(D, 10);
      for (const p of e.localSlopes!.points) expect(p.D!).toBeCloseTo(D, 9);
    }
    const w = a.estimators.radiusOfGyration.fitWindow!;
    expect(w.source).toBe('default');
    expect(w.from).toBeCloseTo(Math.max(100, 1e5 * Math.pow(10, -1.5)), 6); // 3162.3
    expect(w.to).toBe(1e5);
    // the recorded size 3162 = round(10^3.5) lies just below 10^3.5 = 3162.28, so the window starts at round(10^3.55) = 3548
    expect(w.firstUsed).toBe(3548);
    expect(w.points).toBe(30);
    const m = a.estimators.massRadius.fitWindow!;
    // M(r) starts at the ensemble's R_g at the lower end of the size window (316.23): for an exact
    // power law, the geometric mean over clusters of R_g(n0) (316.23/n0)^(1/D), n0 the first recorded size
    const exact = exactRuns({ clusters: 12, D, sizes, radii });
    const n0 = exact[0].series.sizes[0];
    const stage = Math.exp(exact.reduce((s, r) => s + Math.log(r.series.radiusOfGyration[0] * Math.pow(w.from / n0, 1 / D)), 0) / exact.length);
    expect(m.from).toBeCloseTo(Math.max(5, stage), 9);
    expect(m.from).toBeGreaterThan(5);
    const rgFinalMin = Math.min(...exact.map((r) => r.series.radiusOfGyration.at(-1)!));
    expect(m.to).toBeCloseTo(0.5 * rgFinalMin, 9);
    // M(r) amplitude and R_g amplitude are recovered as geometric means of the per-cluster amplitudes
    expect(a.estimators.radiusOfGyration.slope!).toBeCloseTo(1 / D, 12);
  });

  it('mass-radius counts on different radius grids are interpolated onto a common grid without bias for a power law', () => {
    const runs = exactRuns({ clusters: 6, D: 1.65, sizes, radii });
    runs.forEach((r, c) => {
      const rr = Array.from({ length: 25 + c }, (_, i) => (1 + 0.1 * c) * Math.pow(10, i / 10));
      r.massRadius = { radii: rr, counts: rr.map((v) => 1.3 * Math.pow(v, 1.65)) };
    });
    const a = analyzeEnsemble(runs, { resamples: 50, localSlopes: false, corrections: false });
    expect(a.notes.join(' ')).toMatch(/interpolated/);
    expect(a.estimators.massRadius.D!).toBeCloseTo(1.65, 10);
  });

  it('a user window is honoured and one holding < 2 points is refused naming the field', () => {
    const runs = exactRuns({ clusters: 8, D: 1.6, sizes, radii });
    const a = analyzeEnsemble(runs, { resamples: 100, fitWindow: { minSize: 1000, maxSize: 10000 }, localSlopes: false, corrections: false });
    const w = a.estimators.maxRadius.fitWindow!;
    expect(w.source).toBe('user');
    expect(w.firstUsed).toBe(1000);
    expect(w.lastUsed).toBe(10000);
    expect(w.points).toBe(21);
    expect(a.estimators.maxRadius.D!).toBeCloseTo(1.6, 10);
    expect(() => analyzeEnsemble(runs, { fitWindow: { minSize: 1000, maxSize: 1050 } })).toThrow(/fitWindow: \[1000, 1050\] holds 1 usable point/);
    expect(() => analyzeEnsemble(runs, { resamples: 3 })).toThrow('resamples: 3 is out of range; allowed: an integer from 10 to 1000000');
    expect(() => analyzeEnsemble(runs, { level: 1.5 })).toThrow(StatsInputError);
  });

  it('local slopes use a half-decade sliding window', () => {
    const x = Float64Array.from({ length: 61 }, (_, i) => (i / 20) * Math.LN10);
    const w = localWindows(x, 0.5);
    expect(w.length).toBe(51); // centres from 10^0.25 to 10^2.75
    for (const win of w) expect(win.to - win.from).toBe(11);
    expect(w[0].center).toBe(5);
  });
});

describe('corrections-to-scaling fit', () => {
  it('recovers D, omega, A and B from an exact corrected power law', () => {
    const x: number[] = [], y: number[] = [];
    for (let i = 0; i <= 80; i++) {
      const n = 10 * Math.pow(10, i / 20);
      x.push(Math.log(n));
      y.push(Math.log(0.7 * Math.pow(n, 1 / 1.71) * (1 - 0.8 * Math.pow(n, -0.6))));
    }
    const f = fitScalingCorrections(x, y);
    expect(f.dimension).toBeCloseTo(1.71, 6);
    expect(f.omega).toBeCloseTo(0.6, 5);
    expect(f.amplitude).toBeCloseTo(0.7, 5);
    expect(f.correctionAmplitude).toBeCloseTo(-0.8, 4);
    expect(f.correctionNegligible).toBe(false);
    expect(f.omegaAtBound).toBe(false);
  });

  it('through analyzeEnsemble: recovers D and omega, and marks omega undetermined (no crash) for a pure power law', () => {
    const corrected = analyzeEnsemble(exactRuns({ clusters: 10, D: 1.71, sizes, radii, correction: { B: 0.9, omega: 0.8 } }), { resamples: 100, localSlopes: false });
    const c = corrected.corrections.radiusOfGyration!;
    expect(c.available).toBe(true);
    expect(c.D.value!).toBeCloseTo(1.71, 5);
    expect(c.omegaStatus).toBe('resolved');
    expect(c.omega.value!).toBeCloseTo(0.8, 4);
    expect(c.correctionAmplitude.value!).toBeCloseTo(0.9, 3);
    const pure = analyzeEnsemble(exactRuns({ clusters: 10, D: 1.71, sizes, radii }), { resamples: 100, localSlopes: false });
    const p = pure.corrections.maxRadius!;
    expect(p.D.value!).toBeCloseTo(1.71, 8);
    expect(p.omegaStatus).toBe('undetermined');
    expect(p.omega.value).toBeNull();
    expect(p.omegaReason).toMatch(/not determined/);
    expect(JSON.stringify(pure)).not.toMatch(/NaN|Infinity/);
  });

  it('on noisy synthetic data with a correction term, the bootstrap interval of D covers the truth', () => {
    const runs = syntheticEnsemble({ clusters: 200, sizes: logSpacedSizes(10, 20, 80), dimension: 1.71, seed: 3, correction: { amplitude: -1.5, omega: 0.5 }, walkSigma: 0.03 });
    const a = analyzeEnsemble(runs, { resamples: 400, localSlopes: false, estimators: ['radiusOfGyration'] });
    const c = a.corrections.radiusOfGyration!;
    expect(c.omegaStatus).toBe('resolved');
    const iv = c.D.interval.bca!;
    // a single 95% interval: fails by chance in 1 of 20 seeds; seed fixed, so the outcome is fixed
    expect(iv[0]).toBeLessThanOrEqual(1.71);
    expect(iv[1]).toBeGreaterThanOrEqual(1.71);
    const ivo = c.omega.interval.bca!;
    expect(ivo[0]).toBeLessThanOrEqual(0.5);
    expect(ivo[1]).toBeGreaterThanOrEqual(0.5);
  });
});

describe('degenerate and awkward input', () => {
  it('too few clusters: point estimates, no intervals, and the reason stated', () => {
    const a = analyzeEnsemble(exactRuns({ clusters: 3, D: 1.71, sizes, radii }), { resamples: 100 });
    const iv = a.estimators.radiusOfGyration.interval;
    expect(iv.status).toBe('too-few-clusters');
    expect(iv.percentile).toBeNull();
    expect(iv.notes[0]).toMatch(/3 cluster\(s\): intervals need at least 5/);
    expect(a.estimators.radiusOfGyration.D!).toBeCloseTo(1.71, 10);
    expect(JSON.stringify(a)).not.toMatch(/NaN|Infinity/);
    const one = analyzeEnsemble(exactRuns({ clusters: 1, D: 1.71, sizes, radii }), { resamples: 100 });
    expect(one.estimators.maxRadius.D!).toBeCloseTo(1.71, 10);
  });

  it('duplicates of a run index count once; conflicting duplicates are refused', () => {
    const runs = exactRuns({ clusters: 6, D: 1.71, sizes, radii });
    const a = analyzeEnsemble([...runs, runs[2]], { resamples: 50, localSlopes: false, corrections: false });
    expect(a.clusters).toBe(6);
    expect(a.duplicatesDropped).toBe(1);
    const bad = { ...runs[2], stateHash: 'other' };
    expect(() => analyzeEnsemble([...runs, bad])).toThrow(/run index 2 appears twice with different state hashes/);
    const foreign = { ...runs[0], runIndex: 99, ensembleSeed: '6' };
    expect(() => analyzeEnsemble([...runs, foreign])).toThrow(/runs\[\]\.ensembleSeed: 2 different ensemble seeds/);
  });

  it('mismatched size grids are refused naming the run and the entry', () => {
    const runs = exactRuns({ clusters: 4, D: 1.71, sizes, radii });
    runs[1].series.sizes[3] += 1;
    expect(() => analyzeEnsemble(runs)).toThrow(/run 1 series.sizes\[3\]/);
  });
});

describe('fitLine, the one least-squares fit', () => {
  it('gives slope, intercept, standard error and R² of a small worked example (exact, by hand)', () => {
    // x = 0..3, y = 1, 3, 2, 5: Sxx = 5, Sxy = 5.5, Syy = 8.75, RSS = 2.7
    const f = fitLine([0, 1, 2, 3], [1, 3, 2, 5]);
    expect(f.slope).toBeCloseTo(1.1, 14);
    expect(f.intercept).toBeCloseTo(1.1, 14);
    expect(f.standardError).toBeCloseTo(Math.sqrt(0.27), 14);
    expect(f.rSquared).toBeCloseTo(30.25 / 43.75, 14);
    expect(f.points).toBe(4);
    expect(Number.isNaN(fitLine([0, 1], [0, 1]).standardError)).toBe(true);
  });
});
