import { describe, expect, it } from 'vitest';
import { createKernel } from '../worker/models/registry.js';
import type { GrowthCheckpoint } from '../worker/core/growth-kernel.js';
import { dlaTask } from './support/grow.js';
import { axisOf } from '../worker/core/positions.js';

describe('off-lattice 2D DLA kernel: geometry invariants', () => {
  // Definition of the model (worker/models/dla-offlattice-2d/kernel.ts): disks of diameter 1
  // never overlap and each new disk touches the cluster where it stops.
  for (const runIndex of [0, 1, 2]) {
    it(`no overlaps and every disk touches an earlier one (run ${runIndex}, 4000 particles)`, () => {
      const task = dlaTask(4000, runIndex, '424242');
      const k = createKernel(task);
      k.growTo(task.particles);
      const pos = k.positions();
      const count = pos.count;
      const x = axisOf(pos, 0);
      const y = axisOf(pos, 1);
      expect(count).toBe(4000);
      expect(x[0]).toBe(0);
      expect(y[0]).toBe(0);
      // bucket the disks on a unit grid; compare each disk with its 3×3 neighbourhood
      const cells = new Map<string, number[]>();
      const key = (i: number, j: number) => `${i},${j}`;
      for (let i = 0; i < count; i++) {
        const kk = key(Math.floor(x[i]), Math.floor(y[i]));
        const list = cells.get(kk);
        if (list) list.push(i);
        else cells.set(kk, [i]);
      }
      let worstOverlap = 0;
      for (let i = 1; i < count; i++) {
        let touchesEarlier = false;
        const ci = Math.floor(x[i]);
        const cj = Math.floor(y[i]);
        for (let di = -1; di <= 1; di++)
          for (let dj = -1; dj <= 1; dj++)
            for (const j of cells.get(key(ci + di, cj + dj)) ?? []) {
              if (j === i) continue;
              const d = Math.hypot(x[i] - x[j], y[i] - y[j]);
              worstOverlap = Math.max(worstOverlap, 1 - d);
              if (j < i && Math.abs(d - 1) < 1e-9) touchesEarlier = true;
            }
        if (!touchesEarlier) throw new Error(`disk ${i} touches no earlier disk`);
      }
      expect(worstOverlap).toBeLessThan(1e-9);
    });
  }
});

describe('off-lattice 2D DLA kernel: determinism and checkpoints', () => {
  it('the same task gives the same bits; another run index gives another cluster', () => {
    const a = createKernel(dlaTask(3000, 5, '77'));
    const b = createKernel(dlaTask(3000, 5, '77'));
    const c = createKernel(dlaTask(3000, 6, '77'));
    a.growTo(3000);
    b.growTo(3000);
    c.growTo(3000);
    expect(a.result()).toEqual(b.result());
    expect(c.result().stateHash).not.toBe(a.result().stateHash);
  });

  it('growing in chunks gives the same result as growing at once', () => {
    const whole = createKernel(dlaTask(2500, 1, '9'));
    whole.growTo(2500);
    const chunked = createKernel(dlaTask(2500, 1, '9'));
    for (let n = 1; !chunked.done; n += 137) chunked.growTo(n);
    expect(chunked.result()).toEqual(whole.result());
  });

  it('resuming from a checkpoint taken at any point gives the uninterrupted final state', async () => {
    const task = dlaTask(5000, 3, '31337');
    const straight = createKernel(task);
    straight.growTo(task.particles);
    const expected = straight.result();
    for (const stop of [1, 2, 10, 11, 777, 2048, 4999]) {
      // one resume at a time, then let the runner's event loop turn (a loaded machine made the whole loop hold it for 10 s)
      await new Promise((r) => setImmediate(r));
      const first = createKernel(task);
      first.growTo(stop);
      // the checkpoint survives a structured copy (as through a worker thread or a file)
      const cp: GrowthCheckpoint = structuredClone(first.checkpoint());
      const resumed = createKernel(task, cp);
      expect(resumed.count).toBe(stop);
      resumed.growTo(task.particles);
      expect(resumed.result()).toEqual(expected);
    }
  });

  it('a checkpoint resumed twice in a row (interrupted again) still ends in the same state', () => {
    const task = dlaTask(3000, 0, '5');
    const straight = createKernel(task);
    straight.growTo(task.particles);
    let k = createKernel(task);
    for (const stop of [500, 1200, 2999]) {
      k.growTo(stop);
      k = createKernel(task, k.checkpoint());
    }
    k.growTo(task.particles);
    expect(k.result().stateHash).toBe(straight.result().stateHash);
  });

  it('refuses a checkpoint of another task with a message naming it', () => {
    const k = createKernel(dlaTask(100, 0, '5'));
    k.growTo(50);
    expect(() => createKernel(dlaTask(100, 1, '5'), k.checkpoint())).toThrow(/checkpoint task does not match/);
    const cp = k.checkpoint();
    cp.count = 500;
    expect(() => createKernel(dlaTask(100, 0, '5'), cp)).toThrow(/checkpoint count must be an integer in \[1, 100\], got 500/);
  });

  it('refuses bad parameters with the field, value and range', () => {
    expect(() => createKernel(dlaTask(100, 0, '1', { min_step: 0 }))).toThrow('params.min_step: 0 is out of range; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)');
    expect(() => createKernel(dlaTask(100, 0, '1', { min_step: 1.5 }))).toThrow('params.min_step: 1.5 is out of range; allowed: a number above 0 and at most 1 (particle diameters, for dla-offlattice-2d)');
    expect(() => createKernel(dlaTask(100, 0, '1', { launch_margin: -1 }))).toThrow('params.launch_margin: -1 is out of range; allowed: a number above 0 and at most 1000 (particle diameters, for dla-offlattice-2d)');
    expect(() => createKernel(dlaTask(100, 0, '1', { eta: 2 }))).toThrow('params.eta: not a parameter of dla-offlattice-2d; allowed: min_step, launch_margin');
    expect(() => createKernel({ ...dlaTask(100), particles: 0 })).toThrow('particles: 0 is out of range; allowed: an integer from 1 to 100000000');
    expect(() => createKernel({ ...dlaTask(100), recordsPerDecade: 5 })).toThrow('records_per_decade: 5 is out of range; allowed: an integer from 10 to 100');
    expect(() => createKernel({ ...dlaTask(100), model: { kind: 'nope', params: {} } })).toThrow(/model: "nope" is not a model; allowed: one of dla-offlattice-2d/);
  });
});

describe('off-lattice 2D DLA kernel: observables', () => {
  it('records at least 10 log-spaced sizes per decade, ending at the final size', () => {
    const task = dlaTask(20000, 0, '2');
    const k = createKernel(task);
    k.growTo(task.particles);
    const r = k.result();
    const s = r.series.sizes;
    expect(s[0]).toBe(10);
    expect(s[s.length - 1]).toBe(20000);
    for (const [lo, hi] of [[10, 100], [100, 1000], [1000, 10000]]) expect(s.filter((n) => n >= lo && n < hi).length).toBeGreaterThanOrEqual(10);
    for (let i = 1; i < s.length; i++) {
      expect(s[i]).toBeGreaterThan(s[i - 1]);
      expect(r.series.maxRadius[i]).toBeGreaterThanOrEqual(r.series.maxRadius[i - 1]);
    }
    // observables recomputed from the positions at the final size (R_max with the kernel's sqrt(x² + y²): Math.hypot may differ by an ulp)
    const pos = k.positions();
    const count = pos.count;
    const x = axisOf(pos, 0);
    const y = axisOf(pos, 1);
    let sx = 0, sy = 0, s2 = 0, rmax = 0;
    for (let i = 0; i < count; i++) { sx += x[i]; sy += y[i]; s2 += x[i] ** 2 + y[i] ** 2; rmax = Math.max(rmax, Math.sqrt(x[i] * x[i] + y[i] * y[i])); }
    const mx = sx / count, my = sy / count;
    const last = s.length - 1;
    expect(r.series.radiusOfGyration[last]).toBeCloseTo(Math.sqrt(s2 / count - mx * mx - my * my), 9);
    expect(r.series.maxRadius[last]).toBe(rmax);
    expect(r.series.centerOffset[last]).toBeCloseTo(Math.hypot(mx, my), 9);
    // mass–radius counts: M(r) is non-decreasing and reaches N beyond R_max
    const { radii, counts } = r.massRadius;
    expect(radii[0]).toBe(1);
    expect(counts[counts.length - 1]).toBe(count);
    for (let i = 1; i < counts.length; i++) expect(counts[i]).toBeGreaterThanOrEqual(counts[i - 1]);
    expect(r.stateHash).toMatch(/^[0-9a-f]{16}$/);
    expect(r.counters.jumps).toBeGreaterThan(0);
  });
});
