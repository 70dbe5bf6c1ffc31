/**
 * Probe threads share one geometry (worker/runtime/probe-thread-pool.ts,
 * worker/probe/probe-set.ts): a planar disk set is built once, in shared
 * memory, and every other thread probing it is given that geometry instead
 * of a copy of the set. These tests fail if threads get copies again: they
 * count what the pool sends (one set and one build however many threads),
 * check that the shared geometry holds no array outside a SharedArrayBuffer
 * (so posting it copies nothing), and that the results are those of the
 * geometry built in this thread, bit for bit (a job is a function of
 * (set, task) only; common practice, no source). Sets whose geometry is not
 * shared yet (3D balls) are still sent to each thread, with the same results.
 */
import { describe, expect, it } from 'vitest';
import { clusterPrefix } from '../coordinator/harmonic/ensemble-probing.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec } from '../coordinator/spec/index.js';
import { growthTaskOf } from '../proto/convert.js';
import { unsharedArrays } from '../worker/core/shared-arrays.js';
import { createKernel } from '../worker/models/registry.js';
import { planProbeJobs, ProbeGeometry, runProbeJob, type DiskSet } from '../worker/probe/probe-2d.js';
import { ProbeGeometry3d, runBallProbeJob, type BallSet } from '../worker/probe/probe-3d.js';
import { prepareSharedProbe } from '../worker/probe/probe-set.js';
import { ProbeThreadPool } from '../worker/runtime/probe-thread-pool.js';

/** A grown off-lattice DLA cluster of `n` disks of contact radius = diameter (as ensembles probe it). */
function grownSet(n: number, seed: string): DiskSet {
  const spec = validateSpec({ model: 'dla-offlattice-2d', particles: n, clusters: 1, seed });
  const k = createKernel(growthTaskOf(runTaskFor('x', spec, 0)));
  k.growTo(n);
  const p = k.positions();
  return clusterPrefix({ dimension: 2, count: p.count, coords: p.coords.slice(0, 2 * p.count) }, n) as DiskSet;
}

describe('shared probe geometry', () => {
  const set = grownSet(1500, '4242');
  // per-disk radii too (the geometry then keeps scaled radii, shared as well)
  const varied: DiskSet = { count: set.count, x: set.x, y: set.y, r: Float64Array.from({ length: set.count }, (_, i) => 0.8 + 0.2 * ((i * 7) % 5) / 4) };

  it('holds every array in shared memory and answers as the geometry it came from, bit for bit', () => {
    for (const s of [set, varied]) {
      const built = new ProbeGeometry(s);
      const shared = built.shared();
      expect(unsharedArrays(shared)).toEqual([]);
      const again = new ProbeGeometry(shared);
      expect(again.digest).toBe(built.digest);
      for (const t of planProbeJobs(built, '77', 3000, 2, 50)) expect(runProbeJob(again, t)).toEqual(runProbeJob(built, t));
      // a shared index is read only: the threads reading it must never see it change
      expect(() => again.index.insert(0, 0)).toThrow(/read only/);
    }
    const p = prepareSharedProbe(set);
    expect(p).not.toBeNull();
    expect(unsharedArrays(p!.shared)).toEqual([]);
  });

  it('is built by one thread and given to the others: one set sent, the same results as in-process', async () => {
    const g = new ProbeGeometry(set);
    const tasks = planProbeJobs(g, '20261203', 8000, 4, 100);
    const direct = tasks.map((t) => runProbeJob(g, t));
    const pool = new ProbeThreadPool(2);
    try {
      let loads = 0;
      const results = await Promise.all(tasks.map((t) => pool.run('cluster', () => { loads++; return set; }, t)));
      expect(results).toEqual(direct);
      // the first thread built the geometry; the second was given it, not a copy of the set
      expect(pool.sent).toEqual({ sets: 1, builds: 1, sharedGeometries: 1 });
      expect(loads).toBe(1);
      // another set replaces it in the thread that takes it; jobs of the first set still run on the other
      const g2 = new ProbeGeometry(varied);
      const t2 = planProbeJobs(g2, '5', 2000, 1, 10)[0];
      expect(await pool.run('varied', () => varied, t2)).toEqual(runProbeJob(g2, t2));
      expect(pool.sent).toEqual({ sets: 2, builds: 2, sharedGeometries: 1 });
    } finally {
      await pool.close();
    }
  });

  it('leaves ball sets (3D, not shared yet) to each thread, with the in-process results', async () => {
    const n = 60;
    const ball: BallSet = { count: n, x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n), radius: 1 };
    for (let i = 0; i < n; i++) { ball.x[i] = 1.5 * i; ball.y[i] = (i % 3) * 1.5; ball.z[i] = (i % 2) * 1.5; }
    const g = new ProbeGeometry3d(ball);
    const tasks = planProbeJobs(g.digest, '9', 2000, 2, 0);
    const pool = new ProbeThreadPool(2);
    try {
      const results = await Promise.all(tasks.map((t) => pool.run('balls', () => ball, t)));
      expect(results).toEqual(tasks.map((t) => runBallProbeJob(g, t)));
      expect(pool.sent).toEqual({ sets: 2, builds: 0, sharedGeometries: 0 });
    } finally {
      await pool.close();
    }
  });
});
