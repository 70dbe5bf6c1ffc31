import { describe, expect, it } from 'vitest';
import { chi2Critical999, chiSquare } from './support/chi-square.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import type { GrowthCheckpoint, GrowthKernel, GrowthTask } from '../worker/core/growth-kernel.js';
import { Random } from '../worker/core/random.js';
import { yieldToRunner } from './support/grow.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { hexExit, hexagonExitLaw, sampleHexExit } from '../worker/lattice/hexagon-exit-tables.js';
import { TRIANGULAR, siteOf, toSite } from '../worker/lattice/planar-lattice.js';
import { harmonicMeasureFromInfinity, triangularPotentialKernel } from './support/lattice-potential.js';

function triTask(particles: number, runIndex = 0, seed = '21', params: Record<string, number> = {}): GrowthTask {
  return { model: modelParams('dla-triangular', params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 };
}

function grown(task: GrowthTask): GrowthKernel {
  const k = createKernel(task);
  k.growTo(task.particles);
  return k;
}


const hexDistance = (i: number, j: number) => Math.max(Math.abs(i), Math.abs(j), Math.abs(i + j));

describe('triangular-lattice exit tables (exact first passage from the centre of a hexagon)', () => {
  it('the ring of radius L has 6L sites, probabilities sum to 1, are 6-fold symmetric; L = 1 is the plain step', () => {
    for (let e = 0; e <= 5; e++) {
      const L = 2 ** e;
      const t = hexagonExitLaw(L);
      expect(t.p.length).toBe(6 * L);
      expect(Math.abs(t.p.reduce((a, b) => a + b, 0) - 1)).toBeLessThan(1e-12);
      const at = new Map<string, number>();
      for (let k = 0; k < t.p.length; k++) {
        expect(hexDistance(t.di[k], t.dj[k])).toBe(L);
        at.set(`${t.di[k]},${t.dj[k]}`, t.p[k]);
      }
      // rotation by 60° in axial coordinates: (i, j) -> (−j, i + j) (exact symmetry of the lattice)
      for (let k = 0; k < t.p.length; k++) expect(at.get(`${-t.dj[k]},${t.di[k] + t.dj[k]}`)!).toBeCloseTo(t.p[k], 12);
    }
    for (const v of hexagonExitLaw(1).p) expect(v).toBeCloseTo(1 / 6, 15);
  });

  for (const e of [1, 2, 3]) {
    const L = 2 ** e;
    it(`L = ${L}: plain step-by-step walks and tabulated jumps both follow the computed law (chi-square, significance 0.001)`, () => {
      const t = hexagonExitLaw(L);
      const index = new Map<string, number>();
      for (let k = 0; k < t.p.length; k++) index.set(`${t.di[k]},${t.dj[k]}`, k);
      const walks = 30_000;
      const plain = new Array(t.p.length).fill(0);
      const jumped = new Array(t.p.length).fill(0);
      const rng = Random.forRun('78', e);
      for (let w = 0; w < walks; w++) {
        let i = 0;
        let j = 0;
        while (hexDistance(i, j) < L) {
          const s = rng.nextBelow(6);
          i += TRIANGULAR.di[s];
          j += TRIANGULAR.dj[s];
        }
        plain[index.get(`${i},${j}`)!]++;
        sampleHexExit(e, rng);
        jumped[index.get(`${hexExit.di},${hexExit.dj}`)!]++;
      }
      const crit = chi2Critical999(t.p.length - 1);
      expect(chiSquare(plain, Array.from(t.p), walks)).toBeLessThan(crit);
      expect(chiSquare(jumped, Array.from(t.p), walks)).toBeLessThan(crit);
    });
  }
});

describe('dla-triangular: growth probabilities on a fixed domino equal the discrete harmonic measure', () => {
  it('the triangular potential kernel is 1 at the six neighbours and has the lattice symmetry (exact: Δa = δ_0)', () => {
    for (let t = 0; t < 6; t++) expect(triangularPotentialKernel(TRIANGULAR.di[t], TRIANGULAR.dj[t])).toBeCloseTo(1, 13);
    // (1, 1) and (2, −1) are both at plane distance √3, related by a lattice reflection
    expect(triangularPotentialKernel(1, 1)).toBeCloseTo(triangularPotentialKernel(2, -1), 13);
    expect(triangularPotentialKernel(2, 0)).toBeCloseTo(triangularPotentialKernel(0, 2), 13);
  });

  // Seed (0, 0) and (1, 0): its 8 perimeter sites and their exact harmonic measure from infinity
  // (equilibrium measure from the potential kernel, test/support/lattice-potential.ts); 30000
  // one-particle growths, chi-square at significance 0.001. This measures the launch approximation
  // on this lattice too (default margin).
  it('hit frequencies of the 8 perimeter sites agree with H_P', async () => {
    const perimeter: [number, number][] = [[2, 0], [-1, 0], [0, 1], [1, -1], [-1, 1], [1, 1], [0, -1], [2, -1]];
    const exact = harmonicMeasureFromInfinity(perimeter, triangularPotentialKernel);
    const task = triTask(3, 0, '3');
    const counts = new Array(perimeter.length).fill(0);
    const index = new Map(perimeter.map(([i, j], k) => [`${i},${j}`, k]));
    const trials = 30_000;
    for (let t = 0; t < trials; t++) {
      if (t % 2000 === 0) await yieldToRunner();
      const cp: GrowthCheckpoint = {
        engineVersion: ENGINE_VERSION, task, dimension: 2, count: 2, positions: Float64Array.of(0, 0, 1, 0),
        rngState: Random.forRun('919', t).state(), counters: {},
        series: { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} }, modelState: new Uint8Array(0),
      };
      const k = createKernel(task, cp);
      k.growTo(3);
      const c = k.positions().coords;
      toSite(TRIANGULAR, c[4], c[5]);
      counts[index.get(`${siteOf.i},${siteOf.j}`)!]++;
    }
    expect(chiSquare(counts, exact, trials)).toBeLessThan(chi2Critical999(perimeter.length - 1));
  });
});

describe('dla-triangular: geometry, determinism, checkpoints', () => {
  it('distinct lattice sites, each a nearest neighbour of an earlier one', () => {
    const k = grown(triTask(4000, 1));
    const c = k.positions().coords;
    const seen = new Set<string>();
    for (let n = 0; n < k.count; n++) {
      toSite(TRIANGULAR, c[2 * n], c[2 * n + 1]);
      const { i, j } = siteOf;
      expect([c[2 * n], c[2 * n + 1]]).toEqual([i + 0.5 * j, (j * Math.sqrt(3)) / 2]);
      const key = `${i},${j}`;
      expect(seen.has(key)).toBe(false);
      if (n > 0) {
        let adjacent = false;
        for (let t = 0; t < 6; t++) if (seen.has(`${i + TRIANGULAR.di[t]},${j + TRIANGULAR.dj[t]}`)) adjacent = true;
        expect(adjacent).toBe(true);
      }
      seen.add(key);
    }
  });

  for (const m of [1, 3]) {
    it(`m = ${m}: same task, same bits; checkpoint resume gives the same state hash`, () => {
      const n = 3000;
      const whole = grown(triTask(n, 3, '8', { noise_reduction: m })).result();
      expect(grown(triTask(n, 3, '8', { noise_reduction: m })).result()).toEqual(whole);
      const first = createKernel(triTask(n, 3, '8', { noise_reduction: m }));
      first.growTo(1000);
      const resumed = createKernel(triTask(n, 3, '8', { noise_reduction: m }), structuredClone(first.checkpoint()));
      resumed.growTo(n);
      expect(resumed.result()).toEqual(whole);
    });
  }
});
