import { describe, expect, it } from 'vitest';
import { ProbeGeometry3d, capacityFromProbes, runProbe3d, runProbe3dJob, type Probe3dResult } from '../worker/probe/probe-3d.js';
import { yieldToRunner } from './support/grow.js';
import { boxSpectrum3d } from '../worker/probe/box-spectrum-3d.js';
import { createKernel, modelParams } from '../worker/models/registry.js';
import { axisOf } from '../worker/core/positions.js';

/** |z-score| limit of the binomial checks: 4.5 sigma (common practice, no source). */
const Z_LIMIT = 4.5;

/** Capacity of an oblate spheroid with semi-axes A, A, C (C < A): sqrt(A² − C²)/arccos(C/A) (Landau & Lifshitz, Electrodynamics of Continuous Media, §4; from memory). */
function oblateCapacity(A: number, C: number): number {
  return Math.sqrt(A * A - C * C) / Math.acos(C / A);
}

describe('3D probing: Newtonian capacity (a ball of radius a has capacity a)', () => {
  it('a ball of radius a has capacity a (exact), with walkers launched well outside it', () => {
    const a = 2.5;
    const g = new ProbeGeometry3d({ count: 1, x: Float64Array.of(1), y: Float64Array.of(2), z: Float64Array.of(3), radius: a });
    const r = runProbe3d(g, { seed: '15', walkers: 20000, jobs: 4, launchMargin: 3 });
    const { capacity, error } = capacityFromProbes(r.hitTotal, r.walkers, r.launchRadius);
    expect(r.launchRadius).toBeCloseTo(4 * a, 12);
    expect(Math.abs(capacity - a)).toBeLessThan(Z_LIMIT * error);
    expect(r.hits[0]).toBe(r.hitTotal);
  });

  it('a thin disk of radius a made of small overlapping balls: capacity between 2a/π (exact, the disk it contains) and that of an enclosing oblate spheroid', async () => {
    // hexagonal grid of spacing ρ√3 in the plane z = 0: balls of radius ρ cover every point of the plane (covering radius of the grid)
    const a = 1, rho = 0.02, s = rho * Math.sqrt(3);
    const xs: number[] = [], ys: number[] = [];
    for (let j = -Math.ceil(a / s) - 2; j <= Math.ceil(a / s) + 2; j++)
      for (let i = -Math.ceil(a / s) - 2; i <= Math.ceil(a / s) + 2; i++) {
        const x = (i + (j % 2 === 0 ? 0 : 0.5)) * s;
        const y = j * s * (Math.sqrt(3) / 2);
        if (Math.hypot(x, y) <= a + rho) {
          xs.push(x);
          ys.push(y);
        }
      }
    const n = xs.length;
    const g = new ProbeGeometry3d({ count: n, x: Float64Array.from(xs), y: Float64Array.from(ys), z: new Float64Array(n), radius: rho });
    // four jobs of 5000, with a pause between them so that the runner can report on a busy machine
    let hitTotal = 0;
    let last: Probe3dResult | null = null;
    for (let j = 0; j < 4; j++) {
      last = runProbe3dJob(g, { seed: '16', jobIndex: j, walkers: 5000, minStep: 0.02, launchMargin: 0 });
      hitTotal += last.hitTotal;
      await yieldToRunner();
    }
    const r = { hitTotal, walkers: 20000, launchRadius: last!.launchRadius };
    const { capacity, error } = capacityFromProbes(r.hitTotal, r.walkers, r.launchRadius);
    // capacity is monotone under inclusion (exact): the set contains the disk of radius a (capacity 2a/π, exact) and lies in the
    // cylinder of radius a + 2ρ and half-height ρ, inside the oblate spheroid through its rim corners with semi-axes ((a + 2ρ)/cos t, ρ/sin t), sin t = 0.2
    const lower = (2 * a) / Math.PI;
    const upper = oblateCapacity((a + 2 * rho) / Math.sqrt(1 - 0.04), rho / 0.2);
    console.log(`thin disk of ${n} balls: capacity ${capacity.toFixed(4)} ± ${error.toFixed(4)}; bounds [${lower.toFixed(4)}, ${upper.toFixed(4)}]`);
    expect(capacity).toBeGreaterThan(lower - Z_LIMIT * error);
    expect(capacity).toBeLessThan(upper + Z_LIMIT * error);
  });
});

describe('3D probing: harmonic measure per ball', () => {
  it('two equal balls placed symmetrically get equal shares (symmetry; exact)', () => {
    const g = new ProbeGeometry3d({ count: 2, x: Float64Array.of(-3, 3), y: Float64Array.of(0, 0), z: Float64Array.of(0, 0), radius: 1 });
    const r = runProbe3d(g, { seed: '17', walkers: 20000, jobs: 2 });
    const n = r.hitTotal;
    expect(r.hits[0] + r.hits[1]).toBe(n);
    expect(Math.abs(r.hits[0] - n / 2) / Math.sqrt(n / 4)).toBeLessThan(Z_LIMIT);
  });

  it('on a grown 3D DLA cluster the measure sits on late arrivals (growth happens where the measure is: the model definition), and jobs add up deterministically', () => {
    const N = 2000;
    const k = createKernel({ model: modelParams('dla-offlattice-3d'), particles: N, ensembleSeed: '3', runIndex: 0, recordsPerDecade: 10 });
    k.growTo(N);
    const p = k.positions();
    const set = { count: N, x: axisOf(p, 0), y: axisOf(p, 1), z: axisOf(p, 2), radius: 1 };
    const g = new ProbeGeometry3d(set);
    const r = runProbe3d(g, { seed: '18', walkers: 5000, jobs: 2 });
    let mean = 0;
    for (let i = 0; i < N; i++) mean += (i * r.hits[i]) / r.hitTotal;
    // the measure-weighted mean arrival index is far above the unweighted (N − 1)/2
    expect(mean).toBeGreaterThan(0.7 * (N - 1));
    const again = runProbe3d(new ProbeGeometry3d(set), { seed: '18', walkers: 5000, jobs: 2 });
    expect(Array.from(again.hits)).toEqual(Array.from(r.hits));
  });
});

describe('τ(q) from boxes in 3D', () => {
  it('a uniform measure on a cubic lattice of 16³ points has τ(q) = 3(q − 1) (exact)', () => {
    const L = 16;
    const x: number[] = [], y: number[] = [], z: number[] = [];
    for (let i = 0; i < L; i++) for (let j = 0; j < L; j++) for (let k = 0; k < L; k++) {
      x.push(i);
      y.push(j);
      z.push(k);
    }
    const q = [-1, 0, 0.5, 1, 2, 3];
    const { tau } = boxSpectrum3d(x, y, z, new Float64Array(L ** 3).fill(1), q, [1, 2, 4, 8]);
    q.forEach((qq, i) => expect(tau[i]).toBeCloseTo(3 * (qq - 1), 10));
  });

  it('τ(1) = 0 for any measure, and τ(0) = −(box-counting dimension) of a segment of points is −1 (exact)', () => {
    const n = 256;
    const x = Array.from({ length: n }, (_, i) => i);
    const zero = new Array(n).fill(0);
    const m = Array.from({ length: n }, (_, i) => 1 + (i % 7));
    const { tau } = boxSpectrum3d(x, zero, zero, m, [0, 1], [1, 2, 4, 8, 16]);
    expect(tau[0]).toBeCloseTo(-1, 10);
    expect(tau[1]).toBeCloseTo(0, 12);
  });
});
