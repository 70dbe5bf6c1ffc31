/**
 * The Eden kernels' incremental records (worker/core/incremental-planar-records.ts)
 * against the full passes they replace (worker/core/anisotropy.ts,
 * worker/core/radial-interface.ts), and the exact rewrites that made Eden
 * faster: countCentresWithin by binary search, Random.nextBelow without a floating
 * modulo, TiledInt32Grid.cellIndexNear.
 */
import { describe, expect, it } from 'vitest';
import { IncrementalPlanarRecords } from '../worker/core/incremental-planar-records.js';
import { recordPlanarAnisotropy } from '../worker/core/anisotropy.js';
import { recordRadialInterface } from '../worker/core/radial-interface.js';
import { countCentresWithin } from '../worker/core/record-sizes.js';
import { Random } from '../worker/core/random.js';
import { TiledInt32Grid } from '../worker/index/tiled-grids.js';
import { createKernel, modelParams } from '../worker/models/registry.js';

/** Records of the first n points of `coords` at the given sizes, both ways. */
function bothWays(coords: Float64Array, sizes: number[]): { full: Record<string, number[]>; incremental: Record<string, number[]> } {
  const full: Record<string, number[]> = {};
  const incremental: Record<string, number[]> = {};
  const rec = new IncrementalPlanarRecords(coords.length / 2);
  let rMax = 0;
  let n = 0;
  for (const size of sizes) {
    for (; n < size; n++) {
      const x = coords[2 * n];
      const y = coords[2 * n + 1];
      rec.add(x, y);
      const r2 = x * x + y * y;
      if (r2 > rMax * rMax) rMax = Math.sqrt(r2);
    }
    recordPlanarAnisotropy(full, coords, 2, n, rMax);
    recordRadialInterface(full, coords, 2, n, rMax);
    rec.record(incremental, coords, rMax);
  }
  return { full, incremental };
}

function expectSameRecords(coords: Float64Array, sizes: number[]): void {
  const { full, incremental } = bothWays(coords, sizes);
  // bit for bit: extents and interface (same maxima, same final sums)
  for (const name of ['axis_ratio_4', 'axis_ratio_6', 'interface_radius', 'interface_width']) expect(incremental[name]).toEqual(full[name]);
  // fold amplitudes: the same terms summed in another order. |A| = |S|/n with |S| <= n, and each of the n
  // additions rounds by at most 2^-53 of a partial sum of size <= n, so the two sums differ by at most
  // 2 n² 2^-53 per component (standard floating-point summation bound, e.g. Higham 2002, Accuracy and
  // Stability of Numerical Algorithms, §4.2; from memory) and |ΔA| <= 2·2 n 2^-53.
  for (const name of ['fold_amplitude_4', 'fold_amplitude_6']) {
    full[name].forEach((v, i) => expect(Math.abs(incremental[name][i] - v)).toBeLessThanOrEqual(4 * sizes[i] * 2 ** -53));
  }
  // the signed phases sc_k / n: the same sums, |ΔP| = |Δsc| / n <= 2 n 2^-53, within the same bound
  expect(incremental.shell_count).toEqual(full.shell_count);
  for (const name of ['fold_phase_4', 'fold_phase_6']) {
    expect(incremental[name]).toHaveLength(sizes.length);
    full[name].forEach((v, i) => expect(Math.abs(incremental[name][i] - v)).toBeLessThanOrEqual(4 * sizes[i] * 2 ** -53));
  }
}

describe('incremental planar records equal the full passes', () => {
  for (const kind of ['eden-square', 'eden-triangular', 'dla-offlattice-2d']) {
    it(`${kind}: every record of a grown cluster`, () => {
      const n = kind === 'dla-offlattice-2d' ? 3000 : 60_000;
      const k = createKernel({ model: modelParams(kind), particles: n, ensembleSeed: '4', runIndex: 1, recordsPerDecade: 10 });
      k.growTo(n);
      const sizes = k.result().series.sizes;
      expectSameRecords(k.positions().coords.slice(0, 2 * n), sizes);
    });
  }

  it('points on integer radii (lattice ties at bin edges), in random order, at every size from 1 to 400', () => {
    const pts: number[] = [0, 0];
    for (let x = -12; x <= 12; x++) for (let y = -12; y <= 12; y++) if (x !== 0 || y !== 0) pts.push(x, y);
    const rng = Random.forRun('5', 0, 3);
    const c = Float64Array.from(pts);
    for (let i = c.length / 2 - 1; i > 1; i--) {
      const j = 1 + rng.nextBelow(i);
      for (const o of [0, 1]) [c[2 * i + o], c[2 * j + o]] = [c[2 * j + o], c[2 * i + o]];
    }
    expectSameRecords(c.slice(0, 800), Array.from({ length: 400 }, (_, i) => i + 1));
  });

  it('the Eden kernels record the incremental values, identically after a checkpoint resume', () => {
    for (const kind of ['eden-square', 'eden-triangular']) {
      const task = { model: modelParams(kind), particles: 20_000, ensembleSeed: '8', runIndex: 0, recordsPerDecade: 10 };
      const a = createKernel(task);
      a.growTo(task.particles);
      const whole = a.result();
      const b = createKernel(task);
      b.growTo(7_000);
      const c = createKernel(task, b.checkpoint());
      c.growTo(task.particles);
      expect(c.result().series).toEqual(whole.series);
      expectSameRecords(a.positions().coords.slice(0, 2 * task.particles), whole.series.sizes);
      const { incremental } = bothWays(a.positions().coords.slice(0, 2 * task.particles), whole.series.sizes);
      expect(whole.series.extra.fold_amplitude_4).toEqual(incremental.fold_amplitude_4);
    }
  });
});

describe('exact rewrites behind the Eden speed-up', () => {
  it('countCentresWithin equals counting over the sorted distances (ties, radii equal to distances, NaN; 1, 2 and 3 axes)', () => {
    const rng = Random.forRun('6', 0, 2);
    const d = new Float64Array(5000);
    for (let i = 0; i < d.length; i++) d[i] = i % 7 === 0 ? 10 ** ((i % 40) / 10) : i % 97 === 0 ? NaN : 60 * rng.nextDouble();
    const radii = Array.from({ length: 20 }, (_, j) => 10 ** (j / 10));
    const countSorted = (dist: Float64Array): number[] => {
      const sorted = Float64Array.from(dist).sort();
      return radii.map((r) => sorted.filter((v) => v <= r).length);
    };
    // one axis: the distance of centre x is |x|, so the distances themselves are counted
    expect(countCentresWithin(d, 1, d.length, radii)).toEqual(countSorted(d));
    for (const dimension of [2, 3]) {
      const coords = new Float64Array(dimension * d.length);
      const dist = new Float64Array(d.length);
      for (let i = 0; i < d.length; i++) {
        let s = 0;
        for (let k = 0; k < dimension; k++) {
          const v = k === 0 && i % 97 === 0 ? NaN : i % 7 === 0 && k > 0 ? 0 : 40 * rng.nextDouble() - 20;
          coords[dimension * i + k] = v;
          s += v * v;
        }
        dist[i] = Math.sqrt(s);
      }
      expect(countCentresWithin(coords, dimension, d.length, radii)).toEqual(countSorted(dist));
      // only the first count centres are counted
      expect(countCentresWithin(coords, dimension, 100, radii)).toEqual(countSorted(dist.subarray(0, 100)));
    }
  });

  it('Random.nextBelow gives the values of the textbook r % n rejection rule', () => {
    const a = Random.forRun('13', 2, 5);
    const b = Random.fromState(a.state());
    const ns = [1, 2, 3, 5, 6, 7, 1000, 65537, 2 ** 31 - 1, 2 ** 31, 2 ** 31 + 1, 3 * 2 ** 30 + 7, 2 ** 32 - 1, 2 ** 32];
    for (let t = 0; t < 20_000; t++) {
      const n = ns[t % ns.length];
      const limit = 4294967296 - (4294967296 % n);
      let r: number;
      do r = b.nextUint32();
      while (r >= limit);
      expect(a.nextBelow(n)).toBe(r % n);
    }
  });

  it('TiledInt32Grid.cellIndexNear gives cellIndex for every neighbour, across tile edges', () => {
    const g = new TiledInt32Grid(0, 4);
    for (let i = -20; i <= 20; i++) {
      for (let j = -20; j <= 20; j++) {
        const cell = g.cellIndex(i, j);
        for (const [di, dj] of [[1, 0], [-1, 0], [0, 1], [0, -1], [1, -1], [-1, 1], [1, 1], [-1, -1]]) {
          expect(g.cellIndexNear(cell, i, j, i + di, j + dj)).toBe(g.cellIndex(i + di, j + dj));
        }
      }
    }
  });
});
