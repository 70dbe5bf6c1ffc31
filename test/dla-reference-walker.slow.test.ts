import { describe, expect, it } from 'vitest';
import { finalRg, dlaTask, growResult, yieldToRunner } from './support/grow.js';
import { growReference } from './support/reference-walker.js';
import { ksTwoSample } from './support/ks.js';

// Slow statistical check. The accelerated kernel (exact launch, Poisson-kernel
// return, walk-on-spheres over the occupancy index) must grow statistically
// the same clusters as the plain fixed-step walker of test/support/
// reference-walker.ts. Both approximate Brownian motion by short straight
// steps near contact (the kernel's default 0.02 diameters; the reference's
// 0.1 everywhere); at this size their difference is below the ensemble
// error (test/dla-min-step.slow.test.ts measures the kernel's dependence).
// Two-sample Kolmogorov–Smirnov test and a Welch z-test on the mean, each at
// significance 1e-3 (common practice, no source).
const CLUSTERS = 100;
const PARTICLES = 200;

describe('accelerated kernel against the plain reference walker', () => {
  it(`radius-of-gyration distributions agree (${CLUSTERS} clusters of ${PARTICLES} each)`, async () => {
    const fast: number[] = [];
    const plain: number[] = [];
    for (let i = 0; i < CLUSTERS; i++) {
      fast.push(finalRg(growResult(dlaTask(PARTICLES, i, '8080'))));
      plain.push(growReference(PARTICLES, '8080', i, 0.1).rg);
      await yieldToRunner();
    }
    const { p } = ksTwoSample(fast, plain);
    expect(p).toBeGreaterThan(1e-3);
    const mean = (a: number[]) => a.reduce((s, v) => s + v, 0) / a.length;
    const variance = (a: number[]) => { const m = mean(a); return a.reduce((s, v) => s + (v - m) ** 2, 0) / (a.length - 1); };
    const z = (mean(fast) - mean(plain)) / Math.sqrt(variance(fast) / fast.length + variance(plain) / plain.length);
    expect(Math.abs(z)).toBeLessThan(3.3);
  });
});
