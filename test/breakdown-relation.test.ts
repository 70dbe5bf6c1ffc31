/**
 * The dielectric breakdown relations of the harmonic section
 * (coordinator/harmonic/harmonic-section.ts, breakdownRelationOf), on
 * synthetic per-cluster records with a known truth, and the particle-scale
 * moments behind them (coordinator/harmonic/cluster-harmonic.ts).
 * Truths put in: Z(η+2)/Z(η) ∝ R^−Δ, N ∝ R^D, log cap increments ∝ the ratio.
 */
import { describe, expect, it } from 'vitest';
import { particleMoment, type ClusterHarmonic } from '../coordinator/harmonic/cluster-harmonic.js';
import { harmonicSection } from '../coordinator/harmonic/harmonic-section.js';
import { Random } from '../worker/core/random.js';

const SIZES = [250, 500, 1000, 2000];

function record(runIndex: number, size: number, radius: number, ratio: number, logCapacity: number, eta: number): ClusterHarmonic {
  const q = [1, 3];
  return {
    runIndex, size, walkers: 10000, q, tau: [0, 1.7], tauFitError: [0.01, 0.01], dq: [null, 0.85], alpha: [1, 1], f: [0, 0], converged: [true, true],
    informationDimension: 1, tauSystematic: null, informationDimensionSystematic: null, maxConcentrationExponent: 0.6,
    window: { relativeMin: 1 / 32, relativeMax: 0.5 }, radius, logCapacity, logCapacityError: 0.001, z3: 1 / size, z2Plugin: 0, z3Plugin: 0,
    breakdown: { eta, zEta: 0.5, zEtaPlus2: 0.5 * ratio },
  };
}

/** K clusters: R = N^(1/D)·e^(noise), Z ratio = c R^(−Δ)·e^(noise), log cap with increments proportional to the ratio. */
function ensemble(k: number, d: number, delta: number, eta: number, seed: number): ClusterHarmonic[] {
  const rng = Random.forRun(seed, 0);
  const noise = (): number => 0.02 * (rng.nextDouble() - 0.5);
  const out: ClusterHarmonic[] = [];
  for (let c = 0; c < k; c++) {
    let logCap = Math.log(5);
    let prev = SIZES[0];
    for (const n of SIZES) {
      const radius = n ** (1 / d) * Math.exp(noise());
      const ratio = 0.3 * radius ** -delta * Math.exp(noise());
      logCap += 4 * ratio * (n - prev);
      prev = n;
      out.push(record(c, n, radius, ratio, logCap, eta));
    }
  }
  return out;
}

const options = { probe: { walkers: 10000, jobs: 2, q: [1, 3], sizes: SIZES, contactSample: 1000, minStep: 0.02 }, massDimension: null, seed: '5', resamples: 1000 };

describe('breakdownRelation', () => {
  it('recovers τ(η+2) − τ(η) and D put in, and calls them consistent when equal', () => {
    const h = harmonicSection(ensemble(30, 1.6, 1.6, 2, 1), options);
    const b = h.breakdownRelation!;
    expect(b.eta).toBe(2);
    expect(b.clusters).toBe(30);
    expect(b.tauDifference.estimate!).toBeCloseTo(1.6, 1);
    expect(b.massDimension.estimate!).toBeCloseTo(1.6, 1);
    expect(b.tauDifference.low!).toBeLessThanOrEqual(b.tauDifference.high!);
    expect(b.verdict).toBe('consistent');
    expect(b.rule).toMatch(/overlap/);
    // increments were built proportional to the ratio: slope 1
    expect(b.capacityIncrement.verdict).toBe('proportional');
    expect(b.capacityIncrement.slope.estimate!).toBeCloseTo(1, 1);
  });

  it('calls them inconsistent when the truth differs (the check can fail)', () => {
    const b = harmonicSection(ensemble(30, 1.6, 1.2, 0.5, 2), options).breakdownRelation!;
    expect(b.tauDifference.estimate!).toBeCloseTo(1.2, 1);
    expect(b.verdict).toBe('inconsistent');
  });

  it('is undetermined, with a reason, on too few clusters; absent for records without η', () => {
    const b = harmonicSection(ensemble(2, 1.6, 1.6, 1, 3), options).breakdownRelation!;
    expect(b.verdict).toBe('undetermined');
    expect(b.reason).toMatch(/at least 3/);
    const plain = ensemble(5, 1.6, 1.6, 1, 3).map(({ breakdown: _drop, ...r }) => r);
    expect(harmonicSection(plain, options).breakdownRelation).toBeUndefined();
  });
});

describe('particle-scale moments', () => {
  it('integer orders are the unbiased factorial moments; Z(1) = 1, Z(0) counts hit particles for the plug-in at q = 0.5', () => {
    const counts = [5, 3, 2, 0];
    expect(particleMoment(counts, 10, 1)).toBe(1);
    expect(particleMoment(counts, 10, 2)).toBeCloseTo((5 * 4 + 3 * 2 + 2 * 1) / (10 * 9), 12);
    expect(particleMoment(counts, 10, 3)).toBeCloseTo((5 * 4 * 3 + 3 * 2 * 1) / (10 * 9 * 8), 12);
    expect(particleMoment(counts, 10, 0.5)).toBeCloseTo(Math.sqrt(0.5) + Math.sqrt(0.3) + Math.sqrt(0.2), 12);
    expect(particleMoment(counts, 2, 3)).toBeNull();
  });

  it('the factorial moment is unbiased: mean over many multinomial samples matches Σ p^q (exact identity E[c(c−1)] = W(W−1)p²; common practice, no source)', () => {
    const p = [0.5, 0.3, 0.2];
    const rng = Random.forRun(9, 0);
    const w = 20;
    let sum = 0;
    const reps = 20000;
    for (let r = 0; r < reps; r++) {
      const c = [0, 0, 0];
      for (let j = 0; j < w; j++) {
        const u = rng.nextDouble();
        c[u < 0.5 ? 0 : u < 0.8 ? 1 : 2]++;
      }
      sum += particleMoment(c, w, 2)!;
    }
    const truth = 0.25 + 0.09 + 0.04;
    // standard error of the mean is below 0.001 here; 5 of them
    expect(Math.abs(sum / reps - truth)).toBeLessThan(0.005);
  });
});
