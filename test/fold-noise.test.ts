/**
 * The isotropic noise level of the k-fold amplitude (coordinator/stats/fold-noise.ts)
 * and its verdict in the summary (coordinator/stats/observable-bands.ts, foldNoise).
 *
 * Source of the law checked: for n independent uniform angles, |Σ e^{ikθ}| is
 * asymptotically Rayleigh with σ² = n/2 (the Rayleigh test of uniformity: 2n R̄²
 * is asymptotically χ²₂; Mardia & Jupp 2000, Directional Statistics, Wiley,
 * §6.3.1, from memory), so A_k = |Σ e^{ikθ}|/n has mean √(π/(4n)), P(A_k > a) =
 * exp(−n a²), and E[A_k²] = 1/n exactly.
 */
import { describe, expect, it } from 'vitest';
import type { GrowthResult } from '../worker/core/growth-kernel.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { decodeRunResult, encodeRunResult } from '../proto/convert.js';
import { Random } from '../worker/core/random.js';
import { aboveNoise, isotropicFoldMean, isotropicFoldQuantile } from '../coordinator/stats/fold-noise.js';
import { observableSection } from '../coordinator/stats/observable-bands.js';
import { compareWithBaseline } from '../coordinator/stats/anisotropy-comparison.js';
import { syntheticShellRuns } from './support/synthetic-shell-runs.js';

/** A_k of n independent uniform angles (trigonometry here, independent of the kernels' de Moivre powers). */
function amplitude(rng: Random, n: number, k: number): number {
  let c = 0;
  let s = 0;
  for (let j = 0; j < n; j++) {
    const a = 2 * Math.PI * rng.nextDouble();
    c += Math.cos(k * a);
    s += Math.sin(k * a);
  }
  return Math.hypot(c, s) / n;
}

describe('isotropic noise of the k-fold amplitude', () => {
  it('formulas: √(π/(4n)) and the Rayleigh quantile √(−ln(1−p)/n)', () => {
    expect(isotropicFoldMean(100)).toBeCloseTo(Math.sqrt(Math.PI) / 20, 15);
    expect(isotropicFoldQuantile(100, 0.95)).toBeCloseTo(Math.sqrt(Math.log(20)) / 10, 15);
    expect(isotropicFoldQuantile(1, 1 - Math.exp(-1))).toBeCloseTo(1, 14);
    expect(Number.isNaN(isotropicFoldMean(0))).toBe(true);
    expect(() => isotropicFoldQuantile(10, 1)).toThrow(/strictly between 0 and 1/);
  });

  // Monte Carlo, fixed seed. Tolerances: the mean within 4 standard errors of the sample
  // (plus 0.2% for the O(1/n) finite-n correction of the asymptotic mean, which is below 0.1% at n ≥ 100
  // by a separate Monte Carlo), E[A²] = 1/n within 4 standard errors, and the fraction of
  // trials above the 95% quantile within 4 binomial standard errors of 0.05.
  for (const [n, k] of [[100, 4], [1000, 6], [5000, 4]] as const) {
    it(`n = ${n}, k = ${k}: mean amplitude √(π/(4n)), E[A²] = 1/n, 5% above the 95% quantile`, () => {
      const rng = Random.forRun('20261203', n);
      const trials = Math.round(4e6 / n);
      let sum = 0;
      let sum2 = 0;
      let sum4 = 0;
      let over = 0;
      const q = isotropicFoldQuantile(n, 0.95);
      for (let t = 0; t < trials; t++) {
        const a = amplitude(rng, n, k);
        sum += a;
        sum2 += a * a;
        sum4 += a ** 4;
        if (a > q) over++;
      }
      const mean = sum / trials;
      const se = Math.sqrt((sum2 / trials - mean * mean) / trials);
      expect(Math.abs(mean - isotropicFoldMean(n))).toBeLessThan(4 * se + 0.002 * isotropicFoldMean(n));
      const m2 = sum2 / trials;
      const se2 = Math.sqrt((sum4 / trials - m2 * m2) / trials);
      expect(Math.abs(m2 - 1 / n)).toBeLessThan(4 * se2);
      expect(Math.abs(over / trials - 0.05)).toBeLessThan(4 * Math.sqrt((0.05 * 0.95) / trials));
    });
  }
});

/** K synthetic clusters (test/support/synthetic-shell-runs.ts), uniform or 4-fold (θ = mπ/2 + uniform(±spread)), recorded at three sizes. */
function syntheticRuns(k: number, n: number, spread: number | null, seed: string): GrowthResult[] {
  return syntheticShellRuns(k, n, spread === null ? null : { offset: 0, spread }, seed, [4, 2, 1]);
}

describe('foldNoise in the summary: the noise level from the recorded shell counts and the verdict', () => {
  it('isotropic angles are within noise, a clearly 4-fold set is above it; n is the recorded shell count', () => {
    const iso = observableSection(syntheticRuns(8, 2000, null, '5'), { seed: '1', resamples: 400, level: 0.95 })!;
    const noise = iso.foldNoise!;
    expect(noise.sizes).toEqual([500, 1000, 2001]);
    // every synthetic point lies in the shell except the one at r = 1 exactly (r ≤ R_max counts: all n + 1)
    expect(noise.shellCount).toEqual([500, 1000, 2001]);
    expect(noise.mean[2]).toBeCloseTo(isotropicFoldMean(2001), 12);
    expect(noise.threshold[2]).toBeCloseTo(isotropicFoldQuantile(2001), 12);
    expect(noise.verdicts.map((v) => [v.name, v.verdict])).toEqual([
      ['fold_amplitude_4', 'within noise'],
      ['fold_amplitude_6', 'within noise'],
    ]);
    // the ensemble mean of isotropic A_4 sits near the noise mean (K = 8 clusters: sd of the mean ≈ 0.18 of it)
    const b4 = iso.bands.find((b) => b.name === 'fold_amplitude_4')!;
    expect(b4.mean[2] / noise.mean[2]).toBeGreaterThan(0.5);
    expect(b4.mean[2] / noise.mean[2]).toBeLessThan(1.5);

    const four = observableSection(syntheticRuns(8, 2000, 0.6, '6'), { seed: '1', resamples: 400, level: 0.95 })!;
    const v4 = four.foldNoise!.verdicts.find((v) => v.name === 'fold_amplitude_4')!;
    expect(v4.verdict).toBe('above noise');
    expect(v4.bandLow).toBeGreaterThan(v4.threshold);
    // against the isotropic set as baseline: above it
    expect(compareWithBaseline(four, iso, 4).verdict).toBe('above the baseline');
    expect(compareWithBaseline(iso, four, 4).verdict).toBe('below the baseline');
    expect(compareWithBaseline(iso, iso, 4).verdict).toBe('not distinguishable');
  });

  it('runs without shell_count (summaries of older runs) give no noise level, and the verdict needs finite numbers', () => {
    const runs = syntheticRuns(3, 200, null, '7').map((r) => {
      const { shell_count: _drop, ...extra } = r.series.extra;
      return { ...r, series: { ...r.series, extra } };
    });
    const s = observableSection(runs, { seed: '1', resamples: 100, level: 0.9 })!;
    expect(s.foldNoise).toBeNull();
    expect(s.bands.map((b) => b.name)).toContain('fold_amplitude_4');
    expect(aboveNoise(NaN, 0.1)).toBe('unknown');
    expect(aboveNoise(0.2, 0.1)).toBe('above noise');
    expect(aboveNoise(0.05, 0.1)).toBe('within noise');
  });
});

describe('shell_count in the kernels\' records and across checkpoints', () => {
  for (const kind of ['dla-square', 'dla-offlattice-2d', 'eden-triangular']) {
    it(`${kind}: one shell count per record, equal after a resume; a checkpoint from before shell_count resumes without it`, () => {
      const task = { model: modelParams(kind), particles: 3000, ensembleSeed: '14', runIndex: 0, recordsPerDecade: 10 };
      const whole = createKernel(task);
      whole.growTo(3000);
      const w = whole.result();
      expect(w.series.extra.shell_count).toHaveLength(w.series.sizes.length);
      // n counts the particles with R_max/2 < r <= R_max: at least the outermost one, at most N
      w.series.extra.shell_count.forEach((n, i) => {
        expect(Number.isInteger(n)).toBe(true);
        expect(n).toBeGreaterThanOrEqual(1);
        expect(n).toBeLessThanOrEqual(w.series.sizes[i]);
      });
      const first = createKernel(task);
      first.growTo(1000);
      const cp = structuredClone(first.checkpoint());
      const resumed = createKernel(task, cp);
      resumed.growTo(3000);
      expect(resumed.result().series.extra).toEqual(w.series.extra);
      expect(resumed.result().stateHash).toBe(w.stateHash);
      // a checkpoint written before shell_count existed: the series goes on without it, and the result stays valid
      const old = structuredClone(first.checkpoint());
      delete old.series.extra.shell_count;
      const legacy = createKernel(task, old);
      legacy.growTo(3000);
      const r = legacy.result();
      expect(r.stateHash).toBe(w.stateHash);
      expect(r.series.extra.shell_count).toBeUndefined();
      expect(r.series.extra.fold_amplitude_4).toEqual(w.series.extra.fold_amplitude_4);
      const wire = { ...r, ensembleId: 'e', timings: { growSeconds: 0, startedAtMs: 0, finishedAtMs: 0, resumes: 1, finishedBy: 'test' } };
      expect(decodeRunResult(encodeRunResult(wire)).series.extra.fold_amplitude_4).toHaveLength(r.series.sizes.length);
    });
  }
});
