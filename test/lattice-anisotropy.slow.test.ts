import { describe, expect, it } from 'vitest';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { yieldToRunner } from './support/grow.js';

// Lattice anisotropy against the off-lattice isotropic baseline (worker/core/anisotropy.ts):
// square-lattice DLA grows arms along the lattice axes (Loh 2014, arXiv 1407.2586; Grebenkov &
// Beliaev 2017, Phys. Rev. E 96, 042159), and noise reduction brings this out at small sizes
// (Tang 1985, Phys. Rev. A 31, 1977; Kertész & Vicsek 1986, J. Phys. A 19, L257; from memory).
// Sizes CI can afford: 24 clusters of 3·10^4 per model for m = 1 (measured: Q_4 = 1.116 ± 0.024 on
// the lattice vs 0.998 ± 0.015 off-lattice with 12 clusters; the 4-fold amplitude A_4 does not
// separate yet at this size: 0.32 ± 0.03 vs 0.24 ± 0.04, since a DLA cluster's few main arms give
// large A_k even when isotropic), and 8 clusters of 10^4 for m = 4.
// Rule: "clearly above" = the difference of ensemble means exceeds 3 standard errors of the
// difference (Welch; common practice, no source).
async function finalValues(kind: string, particles: number, clusters: number, params: Record<string, number>, name: string): Promise<number[]> {
  const out: number[] = [];
  for (let r = 0; r < clusters; r++) {
    const k = createKernel({ model: modelParams(kind, params), particles, ensembleSeed: '17', runIndex: r, recordsPerDecade: 10 });
    k.growTo(particles);
    out.push(k.result().series.extra[name].at(-1)!);
    await yieldToRunner();
  }
  return out;
}

function meanSe(x: number[]): [number, number] {
  const m = x.reduce((a, b) => a + b, 0) / x.length;
  return [m, Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1) / x.length)];
}

function clearlyAbove(lattice: number[], baseline: number[]): { diff: number; se: number } {
  const [a, sa] = meanSe(lattice);
  const [b, sb] = meanSe(baseline);
  return { diff: a - b, se: Math.hypot(sa, sb) };
}

describe('square-lattice anisotropy above the off-lattice baseline', () => {
  it('m = 1, N = 3·10^4: the axis/diagonal extent ratio Q_4 is clearly above the off-lattice one', async () => {
    const lattice = await finalValues('dla-square', 30_000, 24, {}, 'axis_ratio_4');
    const baseline = await finalValues('dla-offlattice-2d', 30_000, 24, {}, 'axis_ratio_4');
    const { diff, se } = clearlyAbove(lattice, baseline);
    expect(diff).toBeGreaterThan(3 * se);
  });

  it('m = 4, N = 10^4: both the 4-fold amplitude A_4 and Q_4 are clearly above the off-lattice ones', async () => {
    for (const name of ['fold_amplitude_4', 'axis_ratio_4']) {
      const lattice = await finalValues('dla-square', 10_000, 8, { noise_reduction: 4 }, name);
      const baseline = await finalValues('dla-offlattice-2d', 10_000, 8, {}, name);
      const { diff, se } = clearlyAbove(lattice, baseline);
      expect(diff).toBeGreaterThan(3 * se);
    }
  });
});
