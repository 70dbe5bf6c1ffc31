import { describe, expect, it } from 'vitest';
import { chi2Critical999, chiSquare } from './support/chi-square.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import type { GrowthCheckpoint, GrowthKernel, GrowthTask } from '../worker/core/growth-kernel.js';
import { Random } from '../worker/core/random.js';
import { yieldToRunner } from './support/grow.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { HALF_WIDTHS, MAX_HALF_WIDTH, exit, halfWidthAtMost, sampleExitOf, sideExitLaw } from '../worker/lattice/square-exit-tables.js';
import { harmonicMeasureFromInfinity, potentialKernel } from './support/lattice-potential.js';
import type { DlaSquare } from '../worker/models/dla-square/kernel.js';
import { LatticeWalk } from '../worker/lattice/lattice-walk.js';
import { SQUARE } from '../worker/lattice/planar-lattice.js';

function squareTask(particles: number, runIndex = 0, seed = '21', params: Record<string, number> = {}): GrowthTask {
  return { model: modelParams('dla-square', params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 10 };
}

function grown(task: GrowthTask): GrowthKernel {
  const k = createKernel(task);
  k.growTo(task.particles);
  return k;
}


/** The 4(2L − 1) exit sites of the square of half-width L, in a fixed order, with their exact probabilities. */
function exitSites(L: number): { key: string[]; p: number[] } {
  const side = sideExitLaw(L);
  const key: string[] = [];
  const p: number[] = [];
  for (let k = -(L - 1); k <= L - 1; k++) {
    for (const [dx, dy] of [[L, k], [-L, k], [k, L], [k, -L]]) {
      key.push(`${dx},${dy}`);
      p.push(side[k + L - 1]);
    }
  }
  return { key, p };
}

describe('square-lattice exit tables (exact first passage from the centre of a square)', () => {
  it('sampleExitOf picks the same site as a binary search of the folded cumulative law for the same draws (guide-table search)', async () => {
    for (const L of [2, 16, 37, 1024, 5000]) {
      await yieldToRunner();
      const p = sideExitLaw(L);
      // folded law of |k|: p(0), then 2 p(m)
      const c = new Float64Array(L);
      let s = 0;
      for (let m = 0; m < L; m++) c[m] = s += (m === 0 ? 1 : 2) * Math.max(0, p[L - 1 + m]);
      c.forEach((v, i) => (c[i] = v / s));
      c[L - 1] = 1;
      const a = Random.forRun('5', L, 3);
      const b = Random.fromState(a.state());
      for (let t = 0; t < 20_000; t++) {
        sampleExitOf(L, a);
        const w = b.nextInt32();
        const side = w & 3;
        const u = b.nextDouble();
        let lo = 0;
        let hi = c.length - 1;
        while (lo < hi) {
          const mid = (lo + hi) >> 1;
          if (c[mid] > u) hi = mid;
          else lo = mid + 1;
        }
        const k = (w & 4) !== 0 ? -lo : lo;
        expect([exit.dx, exit.dy]).toEqual([[L, k], [-L, k], [k, L], [k, -L]][side]);
      }
    }
  });

  it('the truncated series (weights below 1e-40 dropped) equals the full sum to rounding', () => {
    for (const L of [2, 7, 64, 300, 1024]) {
      const full = sideExitLaw(L, false);
      const cut = sideExitLaw(L);
      let worst = 0;
      for (let i = 0; i < full.length; i++) worst = Math.max(worst, Math.abs(full[i] - cut[i]) / full[i]);
      expect(worst).toBeLessThan(1e-9);
    }
  });

  it('the ladder of half-widths: 1 … 32 then steps of at most 1/16, up to MAX_HALF_WIDTH; halfWidthAtMost is the largest entry <= d', () => {
    for (let L = 1; L <= 32; L++) expect(HALF_WIDTHS[L - 1]).toBe(L);
    for (let i = 32; i < HALF_WIDTHS.length; i++) {
      expect(HALF_WIDTHS[i]).toBeGreaterThan(HALF_WIDTHS[i - 1]);
      expect(HALF_WIDTHS[i]).toBeLessThanOrEqual(Math.ceil((HALF_WIDTHS[i - 1] * 17) / 16));
    }
    expect(HALF_WIDTHS[HALF_WIDTHS.length - 1]).toBe(MAX_HALF_WIDTH);
    for (const d of [1, 5, 32, 33, 34, 35, 100, 999, 4097, MAX_HALF_WIDTH, MAX_HALF_WIDTH + 5]) {
      const L = halfWidthAtMost(d);
      expect(L).toBeLessThanOrEqual(d);
      expect(HALF_WIDTHS.includes(L)).toBe(true);
      const next = HALF_WIDTHS.find((h) => h > L);
      if (next !== undefined) expect(next).toBeGreaterThan(Math.min(d, MAX_HALF_WIDTH));
    }
  });

  it('sum to 1 and match hand-computed values (exact: L = 1 and L = 2 by first-step analysis)', () => {
    for (let e = 0; e <= 15; e++) {
      const p = sideExitLaw(2 ** e);
      const s = p.reduce((a, b) => a + b, 0);
      expect(Math.abs(4 * s - 1)).toBeLessThan(1e-13);
      for (const v of p) expect(v).toBeGreaterThan(0);
    }
    expect(sideExitLaw(1)[0]).toBeCloseTo(0.25, 15);
    // L = 2: from (1, 0) the exit (2, 0) is next; solving the 3 × 3 interior gives 1/8 at (2, 0), 1/16 at (2, ±1)
    const p2 = sideExitLaw(2);
    expect(p2[1]).toBeCloseTo(1 / 8, 14);
    expect(p2[0]).toBeCloseTo(1 / 16, 14);
  });

  for (const L of [3, 4, 5, 8]) {
    it(`L = ${L}: plain step-by-step walks and tabulated jumps both follow the exact law (chi-square, significance 0.001)`, () => {
      const { key, p } = exitSites(L);
      const index = new Map(key.map((k, i) => [k, i]));
      const walks = 30_000;
      const plain = new Array(key.length).fill(0);
      const jumped = new Array(key.length).fill(0);
      const rng = Random.forRun('77', L);
      for (let w = 0; w < walks; w++) {
        let x = 0;
        let y = 0;
        while (Math.max(Math.abs(x), Math.abs(y)) < L) {
          const s = rng.nextInt32() & 3;
          if (s === 0) x++;
          else if (s === 1) x--;
          else if (s === 2) y++;
          else y--;
        }
        plain[index.get(`${x},${y}`)!]++;
        sampleExitOf(L, rng);
        jumped[index.get(`${exit.dx},${exit.dy}`)!]++;
      }
      const crit = chi2Critical999(key.length - 1);
      expect(chiSquare(plain, p, walks)).toBeLessThan(crit);
      expect(chiSquare(jumped, p, walks)).toBeLessThan(crit);
    });
  }
});

describe('dla-square: the distance bound that sizes the jumps', () => {
  // A jump of half-width L is exact only when no perimeter site lies strictly inside the square,
  // i.e. when the L∞ distance to the cluster is at least L + 1 (worker/lattice/lattice-walk.ts).
  it('never exceeds the true L∞ distance to the cluster (brute force, 3000-site cluster, 30000 points)', async () => {
    const k = grown(squareTask(3000, 5));
    const c = k.positions().coords;
    const walk = new LatticeWalk(SQUARE, 3000);
    for (let n = 0; n < k.count; n++) walk.occupy(c[2 * n], c[2 * n + 1]);
    const bound = (x: number, y: number): number => (walk as unknown as { distanceBound(x: number, y: number): number }).distanceBound(x, y);
    const rng = Random.forRun('31', 0);
    let tight = 0;
    for (let t = 0; t < 30_000; t++) {
      if (t % 1000 === 0) await yieldToRunner();
      const span = t < 15_000 ? 80 : 600;
      const x = Math.floor((rng.nextDouble() - 0.5) * 2 * span);
      const y = Math.floor((rng.nextDouble() - 0.5) * 2 * span);
      let d = Infinity;
      for (let n = 0; n < k.count; n++) d = Math.min(d, Math.max(Math.abs(c[2 * n] - x), Math.abs(c[2 * n + 1] - y)));
      const b = bound(x, y);
      expect(b).toBeLessThanOrEqual(Math.max(d, 1));
      if (d >= 8 && b >= 0.5 * d) tight++;
    }
    // and it is useful: at distance 8 or more it is mostly at least half the distance
    expect(tight).toBeGreaterThan(10_000);
  }, 600_000);
});

describe('dla-square: growth probabilities on a small fixed cluster equal the discrete harmonic measure', () => {
  it('the potential kernel has its exact values (a(1,0) = 1, a(1,1) = 4/π, a(2,0) = 4 − 8/π: Lawler & Limic 2010, from memory)', () => {
    expect(potentialKernel(1, 0)).toBeCloseTo(1, 13);
    expect(potentialKernel(0, 1)).toBeCloseTo(1, 13);
    expect(potentialKernel(1, 1)).toBeCloseTo(4 / Math.PI, 13);
    expect(potentialKernel(2, 0)).toBeCloseTo(4 - 8 / Math.PI, 13);
    // three sites in a row: the middle one is hit first with probability 1 − π/4 (exact, from the equations)
    expect(harmonicMeasureFromInfinity([[0, 0], [1, 0], [2, 0]])[1]).toBeCloseTo(1 - Math.PI / 4, 12);
  });

  // The L-tetromino (0,0), (1,0), (2,0), (0,1): its perimeter sites P and their harmonic measure
  // from infinity H_P (the law of the first perimeter site a walk from infinity visits) are exact;
  // the kernel with m = 1 adds exactly that site. 40000 one-particle growths from the same
  // cluster, each with its own generator state; chi-square at significance 0.001. This also
  // measures launch approximation A (uniform launch on a circle of radius R_max + margin):
  // at margin 2 (the smallest allowed) and 8 (the default) no difference is detectable at this count.
  const cluster: [number, number][] = [[0, 0], [1, 0], [2, 0], [0, 1]];
  const occupied = new Set(cluster.map(([x, y]) => `${x},${y}`));
  const perimeter: [number, number][] = [];
  const seen = new Set<string>();
  for (const [x, y] of cluster) {
    for (const [dx, dy] of [[1, 0], [-1, 0], [0, 1], [0, -1]]) {
      const k = `${x + dx},${y + dy}`;
      if (!occupied.has(k) && !seen.has(k)) {
        seen.add(k);
        perimeter.push([x + dx, y + dy]);
      }
    }
  }
  const exact = harmonicMeasureFromInfinity(perimeter);

  for (const margin of [2, 8]) {
    it(`launch margin ${margin}: hit frequencies of the ${perimeter.length} perimeter sites agree with H_P`, async () => {
      const trials = 40_000;
      const counts = new Array(perimeter.length).fill(0);
      const index = new Map(perimeter.map(([x, y], i) => [`${x},${y}`, i]));
      const task = squareTask(5, 0, '3', { launch_margin: margin });
      for (let t = 0; t < trials; t++) {
        if (t % 2000 === 0) await yieldToRunner();
        const cp: GrowthCheckpoint = {
          engineVersion: ENGINE_VERSION,
          task,
          dimension: 2,
          count: 4,
          positions: Float64Array.from(cluster.flat()),
          rngState: Random.forRun('909', t).state(),
          counters: {},
          series: { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} },
          modelState: new Uint8Array(0),
        };
        const k = createKernel(task, cp);
        k.growTo(5);
        const c = k.positions().coords;
        counts[index.get(`${c[8]},${c[9]}`)!]++;
      }
      expect(chiSquare(counts, exact, trials)).toBeLessThan(chi2Critical999(perimeter.length - 1));
    }, 600_000);
  }
});

describe('dla-square: geometry, noise reduction, determinism, checkpoints', () => {
  it('distinct sites, each a nearest neighbour of an earlier one; storage sparse', () => {
    const k = grown(squareTask(5000, 1)) as DlaSquare;
    const c = k.positions().coords;
    const seen = new Set<string>();
    for (let n = 0; n < k.count; n++) {
      const x = c[2 * n];
      const y = c[2 * n + 1];
      expect(Number.isInteger(x) && Number.isInteger(y)).toBe(true);
      const key = `${x},${y}`;
      expect(seen.has(key)).toBe(false);
      if (n > 0) expect([[1, 0], [-1, 0], [0, 1], [0, -1]].some(([dx, dy]) => seen.has(`${x + dx},${y + dy}`))).toBe(true);
      seen.add(key);
    }
    // sparse: bytes per particle bounded (a dense box of the cluster's span would be ~ (2 R_max)² bytes)
    expect(k.storageBytes / k.count).toBeLessThan(400);
  });

  it('noise reduction m = 3: walkers = 3 (N − 1) + pending hits (exact bookkeeping)', () => {
    const k = grown(squareTask(3000, 2, '5', { noise_reduction: 3 }));
    const state = k.checkpoint().modelState;
    const v = new DataView(state.buffer, state.byteOffset, state.byteLength);
    let pending = 0;
    for (let o = 0; o < state.length; o += 12) {
      const h = v.getInt32(o + 8, true);
      expect(h === 1 || h === 2).toBe(true);
      pending += h;
    }
    expect(k.counters.walkers).toBe(3 * (3000 - 1) + pending);
  });

  for (const m of [1, 4]) {
    it(`m = ${m}: same task, same bits; checkpoint resume gives the same state hash`, () => {
      const n = m > 1 ? 2500 : 4000;
      const whole = grown(squareTask(n, 3, '8', { noise_reduction: m })).result();
      expect(grown(squareTask(n, 3, '8', { noise_reduction: m })).result()).toEqual(whole);
      expect(grown(squareTask(n, 4, '8', { noise_reduction: m })).result().stateHash).not.toBe(whole.stateHash);
      const first = createKernel(squareTask(n, 3, '8', { noise_reduction: m }));
      first.growTo(1500);
      const cp = structuredClone(first.checkpoint());
      if (m > 1) expect(cp.modelState.length).toBeGreaterThan(0);
      const resumed = createKernel(squareTask(n, 3, '8', { noise_reduction: m }), cp);
      resumed.growTo(n);
      expect(resumed.result()).toEqual(whole);
    });
  }

  it('refuses a bad noise_reduction with one line naming the field and range', () => {
    expect(() => createKernel(squareTask(10, 0, '1', { noise_reduction: 0 }))).toThrow(/^params\.noise_reduction: .*allowed/);
    expect(() => createKernel(squareTask(10, 0, '1', { noise_reduction: 1.5 }))).toThrow(/^params\.noise_reduction: /);
  });
});
