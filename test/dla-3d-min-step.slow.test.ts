import { beforeAll, describe, expect, it } from 'vitest';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { yieldToRunner } from './support/grow.js';

// Slow statistical check of the 3D kernel's one approximation (straight final
// steps of length min_step, see worker/models/dla-offlattice-3d/kernel.ts): the
// default min_step = 0.02 and a four times finer 0.005 must give the same
// mean radius of gyration within the ensembles' own error (Welch z-test,
// |z| < 3.3, i.e. significance 1e-3; common practice, no source). A coarse
// min_step = 0.5 must be detected as biased by the same test (the check has
// power: a straight step acts like a larger capture radius).
const CLUSTERS = 300;
const PARTICLES = 1000;

function rg(minStep: number, runIndex: number): number {
  const k = createKernel({ model: modelParams('dla-offlattice-3d', { min_step: minStep }), particles: PARTICLES, ensembleSeed: String(3000 + Math.round(minStep * 1000)), runIndex, recordsPerDecade: 10 });
  k.growTo(PARTICLES);
  const s = k.result().series.radiusOfGyration;
  return s[s.length - 1];
}

async function rgSample(minStep: number): Promise<number[]> {
  const out: number[] = [];
  for (let i = 0; i < CLUSTERS; i++) {
    out.push(rg(minStep, i));
    if (i % 20 === 19) await yieldToRunner();
  }
  return out;
}

describe('minimum step length in 3D', () => {
  const mean = (v: number[]) => v.reduce((s, x) => s + x, 0) / v.length;
  const variance = (v: number[]) => { const m = mean(v); return v.reduce((s, x) => s + (x - m) ** 2, 0) / (v.length - 1); };
  const zScore = (a: number[], b: number[]) => (mean(a) - mean(b)) / Math.sqrt(variance(a) / a.length + variance(b) / b.length);
  let fine: number[] = [];
  beforeAll(async () => {
    fine = await rgSample(0.005);
  });

  it(`min_step 0.02 (default) and 0.005 give the same mean R_g at N = ${PARTICLES} (${CLUSTERS} clusters each)`, async () => {
    const dflt = await rgSample(0.02);
    console.log(`3D min_step: mean R_g ${mean(dflt).toFixed(3)} (0.02) vs ${mean(fine).toFixed(3)} (0.005), z = ${zScore(dflt, fine).toFixed(2)}`);
    expect(Math.sqrt(variance(dflt) / dflt.length) / mean(dflt)).toBeLessThan(0.005);
    expect(Math.abs(zScore(dflt, fine))).toBeLessThan(3.3);
  });

  it('min_step 0.5 is detected as biased (R_g smaller)', async () => {
    const coarse = await rgSample(0.5);
    console.log(`3D min_step: mean R_g ${mean(coarse).toFixed(3)} (0.5) vs ${mean(fine).toFixed(3)} (0.005), z = ${zScore(coarse, fine).toFixed(2)}`);
    expect(zScore(coarse, fine)).toBeLessThan(-3.3);
  });
});
