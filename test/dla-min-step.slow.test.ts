import { beforeAll, describe, expect, it } from 'vitest';
import { finalRg, dlaTask, growResult, yieldToRunner } from './support/grow.js';

// Slow statistical check of the kernel's one approximation (straight final
// steps of length minStep, see worker/models/dla-offlattice-2d/kernel.ts): the default
// minStep = 0.02 and a five times finer 0.004 must give the same mean radius
// of gyration within the ensembles' own error (Welch z-test, |z| < 3.3, i.e.
// significance 1e-3; common practice, no source). A coarse minStep = 0.25
// must be detected as biased by the same test (the check has power).
// MIN_STEP_CLUSTERS overrides the ensemble size (for a sharper figure; the README quotes both).
const CLUSTERS = Number(process.env.MIN_STEP_CLUSTERS ?? 300);
const PARTICLES = 1000;

async function rgSample(minStep: number): Promise<number[]> {
  const out: number[] = [];
  for (let i = 0; i < CLUSTERS; i++) {
    out.push(finalRg(growResult(dlaTask(PARTICLES, i, String(1000 + Math.round(minStep * 100)), { min_step: minStep }))));
    if (i % 20 === 19) await yieldToRunner();
  }
  return out;
}

describe('minimum step length', () => {
  const mean = (v: number[]) => v.reduce((s, x) => s + x, 0) / v.length;
  const variance = (v: number[]) => { const m = mean(v); return v.reduce((s, x) => s + (x - m) ** 2, 0) / (v.length - 1); };
  const zScore = (a: number[], b: number[]) => (mean(a) - mean(b)) / Math.sqrt(variance(a) / a.length + variance(b) / b.length);
  let fine: number[] = [];
  beforeAll(async () => {
    fine = await rgSample(0.004);
  });

  it(`minStep 0.02 (default) and 0.004 give the same mean R_g at N = ${PARTICLES} (${CLUSTERS} clusters each)`, async () => {
    const dflt = await rgSample(0.02);
    const se = (v: number[]) => Math.sqrt(variance(v) / v.length);
    console.log(`mean R_g at N = ${PARTICLES}: min_step 0.02: ${mean(dflt).toFixed(3)} +- ${se(dflt).toFixed(3)}; 0.004: ${mean(fine).toFixed(3)} +- ${se(fine).toFixed(3)}; relative difference ${(100 * (mean(dflt) / mean(fine) - 1)).toFixed(2)}% +- ${(100 * Math.hypot(se(dflt), se(fine)) / mean(fine)).toFixed(2)}%`);
    expect(Math.sqrt(variance(dflt) / dflt.length) / mean(dflt)).toBeLessThan(0.005);
    expect(Math.abs(zScore(dflt, fine))).toBeLessThan(3.3);
  });

  it('minStep 0.25 is detected as biased (R_g about 2–3% smaller)', async () => {
    expect(zScore(await rgSample(0.25), fine)).toBeLessThan(-3.3);
  });
});
