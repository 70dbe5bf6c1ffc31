import { axisOf } from '../worker/core/positions.js';
import { describe, expect, it } from 'vitest';
import { ProbeGeometry, addProbeCounts, planProbeJobs, runProbeJob } from '../worker/probe/probe-2d.js';
import { logCapacity } from '../coordinator/harmonic/log-capacity.js';
import { createKernel, defaultModelParams } from '../worker/models/registry.js';
import { Random } from '../worker/core/random.js';

function probe(set: ConstructorParameters<typeof ProbeGeometry>[0], walkers: number, jobs: number, sample: number, seed = '11', minStep = 0.02) {
  const g = new ProbeGeometry(set);
  const tasks = planProbeJobs(g, seed, walkers, jobs, sample, minStep);
  const results = tasks.map((t) => runProbeJob(g, t));
  return { g, tasks, results, counts: addProbeCounts(set.count, results) };
}

describe('probe kernel', () => {
  it('is deterministic per job, and job counts add up to the walkers', () => {
    const set = { count: 3, x: [0, 1, 3], y: [0, 0.2, -0.5], r: [0.6, 0.5, 1.0] };
    const a = probe(set, 3000, 3, 30);
    const b = probe(set, 3000, 3, 30);
    expect(JSON.stringify(a.results)).toBe(JSON.stringify(b.results));
    expect(a.counts.reduce((s, v) => s + v, 0)).toBe(3000);
    expect(a.results[0].hitCounts).not.toEqual(a.results[1].hitCounts);
    // a job rerun alone gives the same result as within the plan
    expect(runProbeJob(a.g, a.tasks[2])).toEqual(a.results[2]);
    // every contact point lies on the boundary of the disk it names
    for (const r of a.results)
      r.contactId.forEach((id, k) => {
        expect(Math.hypot(r.contactX[k] - set.x[id], r.contactY[k] - set.y[id])).toBeCloseTo(set.r[id], 9);
      });
    expect(() => runProbeJob(a.g, { ...a.tasks[0], geometryDigest: 'x' })).toThrow(/geometryDigest/);
  });

  it('single disk: uniform harmonic measure and capacity = radius (Ransford 1995, Table 5.1)', () => {
    const R = 3;
    const { results } = probe({ count: 1, x: [5], y: [-2], r: R }, 16000, 4, 4000);
    const bins = new Array(16).fill(0);
    let n = 0;
    for (const r of results)
      for (let k = 0; k < r.contactX.length; k++) {
        const th = Math.atan2(r.contactY[k] + 2, r.contactX[k] - 5);
        bins[Math.min(15, Math.floor(((th + Math.PI) / (2 * Math.PI)) * 16))]++;
        n++;
      }
    const e = n / 16;
    const chi2 = bins.reduce((s, b) => s + (b - e) ** 2 / e, 0);
    expect(chi2).toBeLessThan(37.7); // chi-square, 15 degrees of freedom, p = 0.001
    const cx = results.flatMap((r) => r.contactX);
    const cy = results.flatMap((r) => r.contactY);
    const cap = logCapacity(cx, cy, cx.length);
    expect(Math.abs(cap.capacity - R)).toBeLessThan(4 * cap.capacityError + 1e-3);
  });

  it('two tangent disks: capacity pi r / 2 and equal shares', () => {
    // Exact by inversion about the touching point: the exterior maps onto the strip
    // |Re w| < 1/(2r), whose Green function with pole at w = 0 is -log|tan(pi w r / 2)|,
    // so g(z) = log|z| - log(pi r / 2) + o(1) (our derivation; standard conformal mapping).
    const r = 1;
    const { counts, results } = probe({ count: 2, x: [-r, r], y: [0, 0], r }, 20000, 4, 4000);
    const cx = results.flatMap((q) => q.contactX);
    const cy = results.flatMap((q) => q.contactY);
    const cap = logCapacity(cx, cy, cx.length);
    expect(Math.abs(cap.capacity - (Math.PI * r) / 2)).toBeLessThan(4 * cap.capacityError + 2e-3);
    expect(Math.abs(counts[0] / 20000 - 0.5)).toBeLessThan(4 * Math.sqrt(0.25 / 20000));
  });

  it('row of touching disks: capacity within the exact segment and ellipse bounds; arcsine share of the middle', () => {
    // Finite-contact-radius correction: the union of n touching disks of radius rho contains the
    // segment of length L = 2 n rho (capacity L/4) and lies inside the rectangle [-n rho, n rho] x
    // [-rho, rho], hence inside every ellipse A = n rho sqrt(1+t), B = rho sqrt(1+1/t) (capacity
    // (A+B)/2). Capacity is monotone under inclusion (Ransford 1995); segment and ellipse values
    // from the same source.
    const n = 120;
    const rho = 0.5;
    const xs = Array.from({ length: n }, (_, i) => (i - (n - 1) / 2) * 2 * rho);
    const { counts, results } = probe({ count: n, x: xs, y: new Array(n).fill(0), r: rho }, 40000, 4, 4000);
    const cx = results.flatMap((q) => q.contactX);
    const cy = results.flatMap((q) => q.contactY);
    const cap = logCapacity(cx, cy, cx.length);
    const L = 2 * n * rho;
    let upper = Infinity;
    for (let t = 1e-4; t < 1; t *= 1.05) upper = Math.min(upper, (n * rho * Math.sqrt(1 + t) + rho * Math.sqrt(1 + 1 / t)) / 2);
    expect(cap.capacity).toBeGreaterThan(L / 4 - 4 * cap.capacityError);
    expect(cap.capacity).toBeLessThan(upper + 4 * cap.capacityError);
    // share of the middle half of the row: arcsine law (2/pi) asin(1/2) = 1/3 for the segment
    let mid = 0;
    xs.forEach((x, i) => { if (Math.abs(x) < L / 4) mid += counts[i]; });
    expect(Math.abs(mid / 40000 - 1 / 3)).toBeLessThan(0.01 + 4 * Math.sqrt((1 / 3) * (2 / 3) / 40000));
  });

  it('final step length: minStep 0.02 and 0.004 give the same per-particle measure (chi-square)', () => {
    const k = createKernel({ model: defaultModelParams('dla-offlattice-2d'), particles: 300, ensembleSeed: '4', runIndex: 0, recordsPerDecade: 10 });
    k.growTo(300);
    const p = k.positions();
    const set = { count: 300, x: axisOf(p, 0, 300), y: axisOf(p, 1, 300), r: 1 };
    const w = 30000;
    const a = probe(set, w, 2, 0, '21', 0.02).counts;
    const b = probe(set, w, 2, 0, '22', 0.004).counts;
    const groups = 20;
    const ga = new Array(groups).fill(0);
    const gb = new Array(groups).fill(0);
    for (let i = 0; i < 300; i++) { ga[Math.floor((i * groups) / 300)] += a[i]; gb[Math.floor((i * groups) / 300)] += b[i]; }
    let chi2 = 0;
    for (let g = 0; g < groups; g++) {
      const t = ga[g] + gb[g];
      if (t === 0) continue;
      chi2 += (ga[g] - t / 2) ** 2 / (t / 2) + (gb[g] - t / 2) ** 2 / (t / 2);
    }
    expect(chi2).toBeLessThan(43.8); // 19 degrees of freedom, p = 0.001
  });

  it('the far-field grid never overstates the free distance (brute force)', () => {
    const k = createKernel({ model: defaultModelParams('dla-offlattice-2d'), particles: 500, ensembleSeed: '9', runIndex: 0, recordsPerDecade: 10 });
    k.growTo(500);
    const p = k.positions();
    const g = new ProbeGeometry({ count: 500, x: axisOf(p, 0, 500), y: axisOf(p, 1, 500), r: 1 });
    const rng = Random.forRun('3', 0, 1);
    let checked = 0;
    for (let t = 0; t < 20000; t++) {
      const wx = g.gridMin + g.gridCells * g.gridSide * rng.nextDouble();
      const wy = g.gridMin + g.gridCells * g.gridSide * rng.nextDouble();
      let best = Infinity;
      for (let i = 0; i < 500; i++) best = Math.min(best, Math.hypot(wx - (p.coords[2 * i] - g.centreX), wy - (p.coords[2 * i + 1] - g.centreY)));
      const cell = Math.floor((wy - g.gridMin) / g.gridSide) * g.gridCells + Math.floor((wx - g.gridMin) / g.gridSide);
      expect(g.gridFree[cell]).toBeLessThanOrEqual(best - 1);
      if (g.gridFree[cell] > 0.5 * (best - 1)) checked++;
    }
    expect(checked).toBeGreaterThan(5000); // and it is not uselessly small (9815 of 20000 when written)
  });

  it('refuses sets too dense for the index', () => {
    expect(() => new ProbeGeometry({ count: 300, x: new Array(300).fill(0), y: new Array(300).fill(0), r: 1 })).toThrow(/at most 256/);
  });
});
