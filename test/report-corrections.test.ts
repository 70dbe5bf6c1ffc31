import { describe, expect, it } from 'vitest';
import { correctionsFigure } from '../coordinator/report/plots.js';
import { analyzeEnsemble } from '../coordinator/stats/analyze-ensemble.js';
import { extractEnsembleData } from '../coordinator/stats/ensemble-data.js';
import { logSpacedSizes, syntheticEnsemble } from '../coordinator/stats/synthetic-ensemble.js';

// The corrections figure draws, for each determined fit, the compensated points
// R / (A N^{1/D}) and the fitted 1 + B N^-omega, both named in the legend, with
// the reference 1 (the pure power law); fits that are not determined are named
// with their reason instead of being drawn.

describe('corrections-to-scaling figure', () => {
  it('draws points, fit curve and reference, all in the legend, for a determined fit', () => {
    const runs = syntheticEnsemble({ clusters: 200, sizes: logSpacedSizes(10, 20, 80), dimension: 1.71, seed: 3, correction: { amplitude: -1.5, omega: 0.5 }, walkSigma: 0.03 });
    const a = analyzeEnsemble(runs, { resamples: 200, localSlopes: false, estimators: ['radiusOfGyration'], corrections: true });
    expect(a.corrections.radiusOfGyration!.determined).toBe(true);
    const f = correctionsFigure(a, extractEnsembleData(runs));
    expect(f.svg).toContain('ensemble geometric mean / (A N');
    expect(f.svg).toMatch(/fit 1 \+ B N/);
    expect(f.svg).toContain('reference 1: the pure power law');
    // the unrequested R_max fit is named as not available, not drawn
    expect(f.caption).toMatch(/Not drawn: R_max\(N\)[^:]*: not available/);
    // compensated points follow 1 + B N^-omega: with B = -1.5, omega = 0.5 they run from about 0.53 at N = 10 towards 1
    const c = a.corrections.radiusOfGyration!;
    const d = extractEnsembleData(runs).radiusOfGyration;
    const first = Math.exp(d.mean[0]) / (c.amplitude.value! * Math.pow(d.abscissa[0], 1 / c.D.value!));
    const last = Math.exp(d.mean[d.columns - 1]) / (c.amplitude.value! * Math.pow(d.abscissa[d.columns - 1], 1 / c.D.value!));
    expect(first).toBeGreaterThan(0.4);
    expect(first).toBeLessThan(0.65);
    expect(last).toBeGreaterThan(0.97);
    expect(last).toBeLessThan(1.03);
  });

  it('names every fit that is not determined with its reason instead of drawing it', () => {
    const runs = syntheticEnsemble({ clusters: 30, sizes: logSpacedSizes(10, 20, 80), dimension: 1.71, seed: 5, walkSigma: 0.03 });
    const a = analyzeEnsemble(runs, { resamples: 100, localSlopes: false, corrections: true });
    const f = correctionsFigure(a, extractEnsembleData(runs));
    expect(f.note).toMatch(/no determined corrections fit: R_g\(N\)[^:]*: not determined \(.+\); R_max\(N\)[^:]*: not determined \(/);
  });
});
