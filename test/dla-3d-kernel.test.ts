import { describe, expect, it } from 'vitest';
import type { GrowthCheckpoint, GrowthTask } from '../worker/core/growth-kernel.js';
import { createKernel, modelDescriptor, modelParams } from '../worker/models/registry.js';
import { OccupancyIndex3d } from '../worker/index/occupancy-index-3d.js';
import { Random } from '../worker/core/random.js';
import { yieldToRunner } from './support/grow.js';

const KIND = 'dla-offlattice-3d';

function task3d(particles: number, runIndex = 0, seed = '1', params: Record<string, number> = {}): GrowthTask {
  return { model: modelParams(KIND, params), particles, ensembleSeed: seed, runIndex, recordsPerDecade: 20 };
}

function grown(task: GrowthTask) {
  const k = createKernel(task);
  k.growTo(task.particles);
  return k;
}

// Geometry tolerance: contacts are computed exactly (ray–sphere), so distances
// are 1 up to a few ulps of the coordinates (common practice, no source).
const TOL = 1e-9;

describe('off-lattice 3D DLA kernel: geometry', () => {
  for (const runIndex of [0, 1]) {
    it(`no overlaps and every ball touches an earlier one (run ${runIndex}, 3000 particles; exact model definition)`, async () => {
      const k = grown(task3d(3000, runIndex, '42'));
      const p = k.positions();
      expect(p.dimension).toBe(3);
      const c = p.coords;
      let minAll = Infinity;
      let worstTouch = 0;
      for (let i = 1; i < p.count; i++) {
        if (i % 500 === 0) await yieldToRunner(); // let the runner report on a busy machine
        let nearestEarlier = Infinity;
        for (let j = 0; j < i; j++) {
          const dx = c[3 * i] - c[3 * j], dy = c[3 * i + 1] - c[3 * j + 1], dz = c[3 * i + 2] - c[3 * j + 2];
          const d = Math.sqrt(dx * dx + dy * dy + dz * dz);
          if (d < nearestEarlier) nearestEarlier = d;
        }
        if (nearestEarlier < minAll) minAll = nearestEarlier;
        worstTouch = Math.max(worstTouch, Math.abs(nearestEarlier - 1));
      }
      // the nearest earlier ball of every ball is at exactly distance 1: it touches, and nothing overlaps
      expect(minAll).toBeGreaterThan(1 - TOL);
      expect(worstTouch).toBeLessThan(TOL);
      expect(c[0]).toBe(0);
      expect(c[1]).toBe(0);
      expect(c[2]).toBe(0);
    });
  }

  it('counters and records: walkers did work, records are log-spaced and R_g, R_max grow', () => {
    const k = grown(task3d(2000, 0, '7'));
    const r = k.result();
    expect(r.dimension).toBe(3);
    expect(Object.keys(r.counters).sort()).toEqual(modelDescriptor(KIND).counters.map((q) => q.name).sort());
    expect(r.counters.jumps).toBeGreaterThan(2000);
    expect(r.counters.short_steps).toBeGreaterThanOrEqual(1999); // every particle after the seed ends with a short step
    const s = r.series;
    expect(s.sizes[s.sizes.length - 1]).toBe(2000);
    for (let i = 1; i < s.sizes.length; i++) {
      expect(s.sizes[i]).toBeGreaterThan(s.sizes[i - 1]);
      expect(s.maxRadius[i]).toBeGreaterThanOrEqual(s.maxRadius[i - 1]);
    }
    // M(r) is the count of centres within r of the seed: it ends at the whole cluster
    expect(r.massRadius.counts[r.massRadius.counts.length - 1]).toBe(2000);
    // a 3D DLA cluster of 2000 balls is much more compact than a planar one and far from a line:
    // R_g between the close-packed ball (~ (N/0.74)^(1/3)·0.5·sqrt(3/5)) and N/2 (exact bounds of the geometry)
    const rg = s.radiusOfGyration[s.radiusOfGyration.length - 1];
    expect(rg).toBeGreaterThan(0.5 * Math.sqrt(3 / 5) * Math.cbrt(2000 / 0.7405));
    expect(rg).toBeLessThan(1000);
  });
});

describe('off-lattice 3D DLA kernel: determinism and checkpoints', () => {
  it('the same task gives the same bits; another run index another cluster', () => {
    const a = grown(task3d(1500, 0, '9')).result();
    const b = grown(task3d(1500, 0, '9')).result();
    const c = grown(task3d(1500, 1, '9')).result();
    expect(a.stateHash).toBe(b.stateHash);
    expect(a.counters).toEqual(b.counters);
    expect(c.stateHash).not.toBe(a.stateHash);
  });

  it('growing in chunks and resuming from checkpoints (through a structured copy) give the uninterrupted final state', () => {
    const task = task3d(1500, 2, '9');
    const whole = grown(task).result().stateHash;
    const chunked = createKernel(task);
    for (let n = 1; !chunked.done; n += 97) chunked.growTo(n);
    expect(chunked.result().stateHash).toBe(whole);
    for (const at of [1, 2, 333, 1499]) {
      const first = createKernel(task);
      first.growTo(at);
      const cp: GrowthCheckpoint = structuredClone(first.checkpoint());
      expect(cp.dimension).toBe(3);
      expect(cp.positions.length).toBe(3 * at);
      const resumed = createKernel(task, cp);
      resumed.growTo(task.particles);
      expect(resumed.result().stateHash).toBe(whole);
    }
  });

  it('pinned: the state hash and counters of a 2000-ball cluster (engine tendril-engine/3); a change here changes every 3D result', () => {
    // engine 2 (marks only) gave 82ac29ae97fc30fb with 240985 jumps; the near-distance field of engine 3 halves them
    const r = grown(task3d(2000, 0, '7')).result();
    expect(r.engineVersion).toBe('tendril-engine/3');
    expect(r.stateHash).toBe('5716b92a25ebd05b');
    expect(r.counters).toEqual({ jumps: 116500, short_steps: 8169, returns: 14491, escapes: 1585 });
  });

  it('refuses a 2D checkpoint and bad parameters with one line naming the field', () => {
    const k2 = createKernel({ ...task3d(50), model: modelParams('dla-offlattice-2d') });
    k2.growTo(20);
    const cp2 = k2.checkpoint();
    expect(() => createKernel(task3d(50), { ...cp2, task: task3d(50) })).toThrow(/checkpoint dimension must be 3 for dla-offlattice-3d, got 2/);
    expect(() => createKernel(task3d(50, 0, '1', { min_step: 0 }))).toThrow(/^params\.min_step: .*dla-offlattice-3d/);
    expect(() => createKernel(task3d(50, 0, '1', { launch_margin: 2000 }))).toThrow(/^params\.launch_margin: /);
  });
});

describe('3D occupancy index', () => {
  it('free is a lower bound on (nearest distance − 1), tight next to the cluster, and the near list holds every centre within 2 (exact geometry)', async () => {
    const k = grown(task3d(2000, 0, '3'));
    const p = k.positions();
    const index = new OccupancyIndex3d(p.count);
    for (let i = 0; i < p.count; i++) index.insert(p.coords[3 * i], p.coords[3 * i + 1], p.coords[3 * i + 2]);
    const rng = Random.forRun(5, 0);
    let exactScans = 0;
    for (let q = 0; q < 4000; q++) {
      if (q % 500 === 0) await yieldToRunner();
      // query points near random particles and far away
      const j = rng.nextBelow(p.count);
      const spread = q % 4 === 0 ? 60 : 3;
      const x = p.coords[3 * j] + spread * rng.nextSigned();
      const y = p.coords[3 * j + 1] + spread * rng.nextSigned();
      const z = p.coords[3 * j + 2] + spread * rng.nextSigned();
      let nearest = Infinity;
      let within2 = 0;
      for (let i = 0; i < p.count; i++) {
        const d = Math.hypot(p.coords[3 * i] - x, p.coords[3 * i + 1] - y, p.coords[3 * i + 2] - z);
        if (d < nearest) nearest = d;
        if (d <= 2) within2++;
      }
      index.query(x, y, z);
      expect(index.free).toBeLessThanOrEqual(nearest - 1 + 1e-12);
      if (index.nearCount >= 0) {
        exactScans++;
        if (nearest <= 2) expect(index.free).toBeCloseTo(nearest - 1, 12);
        let found = 0;
        for (let m = 0; m < index.nearCount; m++) {
          const d = Math.hypot(index.nearX[m] - x, index.nearY[m] - y, index.nearZ[m] - z);
          if (d <= 2) found++;
        }
        expect(found).toBe(within2);
      } else {
        expect(nearest).toBeGreaterThan(2); // not scanned only when no centre is within 2
      }
    }
    expect(exactScans).toBeGreaterThan(1000);
  });

  it('answers do not depend on the order of queries (the level search starts where the last one ended)', () => {
    const k = grown(task3d(800, 0, '4'));
    const p = k.positions();
    const a = new OccupancyIndex3d(p.count);
    const b = new OccupancyIndex3d(p.count);
    for (let i = 0; i < p.count; i++) {
      a.insert(p.coords[3 * i], p.coords[3 * i + 1], p.coords[3 * i + 2]);
      b.insert(p.coords[3 * i], p.coords[3 * i + 1], p.coords[3 * i + 2]);
    }
    const rng = Random.forRun(6, 0);
    const pts: number[][] = [];
    for (let q = 0; q < 500; q++) pts.push([80 * rng.nextSigned(), 80 * rng.nextSigned(), 80 * rng.nextSigned()]);
    const fa = pts.map(([x, y, z]) => (a.query(x, y, z), a.free));
    const fb = [...pts].reverse().map(([x, y, z]) => (b.query(x, y, z), b.free)).reverse();
    expect(fb).toEqual(fa);
  });

  it('a kept exact scan gives the very list and bound of a fresh index (walkers stepping back into cells they left)', () => {
    const k = grown(task3d(300, 0, '8'));
    const p = k.positions();
    const build = (): OccupancyIndex3d => {
      const ix = new OccupancyIndex3d(p.count);
      for (let i = 0; i < p.count; i++) ix.insert(p.coords[3 * i], p.coords[3 * i + 1], p.coords[3 * i + 2]);
      return ix;
    };
    // nine points next to the cluster (1.2 diameters from a centre), in turn eight times: more cells than
    // the index keeps, so scans are kept, reused and replaced
    const rng = Random.forRun(9, 0);
    const pts: number[][] = [];
    for (let q = 0; q < 9; q++) {
      const i = Math.floor(rng.nextDouble() * p.count);
      const u = [rng.nextSigned(), rng.nextSigned(), rng.nextSigned()];
      const l = Math.hypot(u[0], u[1], u[2]) || 1;
      pts.push([0, 1, 2].map((a) => p.coords[3 * i + a] + (1.2 * u[a]) / l));
    }
    const fresh = pts.map(([x, y, z]) => {
      const ix = build();
      ix.query(x, y, z);
      return { free: ix.free, count: ix.nearCount, x: Array.from(ix.nearX.subarray(0, Math.max(0, ix.nearCount))), id: Array.from(ix.nearId.subarray(0, Math.max(0, ix.nearCount))) };
    });
    expect(fresh.filter((f) => f.count > 0).length).toBeGreaterThan(5); // most of them take the exact scan
    const kept = build();
    for (let round = 0; round < 8; round++) {
      const order = round % 2 === 0 ? [...pts.keys()] : [...pts.keys()].reverse().filter((_, j) => j % 3 !== 1);
      for (const q of order) {
        const [x, y, z] = pts[q];
        kept.query(x, y, z);
        expect({ free: kept.free, count: kept.nearCount, x: Array.from(kept.nearX.subarray(0, Math.max(0, kept.nearCount))), id: Array.from(kept.nearId.subarray(0, Math.max(0, kept.nearCount))) }).toEqual(fresh[q]);
      }
    }
  });
});
