/**
 * Ensemble probing of 3D clusters (dla-offlattice-3d with a [probe] table):
 * the dimension-general probe set (worker/probe/probe-set.ts), the embedded
 * mode and the farm on real Redis, the 3D summary fields, and the refusals.
 * Exact checks named beside each.
 */
import { describe, expect, it } from 'vitest';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { launchEnsemble } from '../coordinator/farm/queue.js';
import { farmSummary } from '../coordinator/farm/summary.js';
import { analyseProbedCluster, clusterPrefix, probeTasksOfSet } from '../coordinator/harmonic/ensemble-probing.js';
import { analyseResults } from '../coordinator/harmonic/probe-run.js';
import { boxStatistics, logSpaced } from '../coordinator/harmonic/partition-function.js';
import { spectrumFrom } from '../coordinator/harmonic/spectrum.js';
import { harmonicSection } from '../coordinator/harmonic/harmonic-section.js';
import { runTaskFor } from '../coordinator/plan.js';
import { SpecError, probeSizesOf, specToDocument, validateSpec } from '../coordinator/spec/index.js';
import { harmonicOfSummary } from '../coordinator/summary/index.js';
import { buildEnsembleReport } from '../coordinator/report/index.js';
import { growthTaskOf } from '../proto/convert.js';
import { createKernel } from '../worker/models/registry.js';
import { planProbeJobs } from '../worker/probe/probe-2d.js';
import { ProbeGeometry3d, runBallProbeJob, runProbe3dJob, type BallSet } from '../worker/probe/probe-3d.js';
import { prepareProbe, probeSetDigest } from '../worker/probe/probe-set.js';
import { ProbeJobFailed, ProbeThreadPool } from '../worker/runtime/probe-thread-pool.js';
import { farmFixture } from './support/farm-fixture.js';

const doc = {
  name: 'probe 3d ensemble test', model: 'dla-offlattice-3d', particles: 400, clusters: 4, seed: '2718',
  probe: { walkers: 4000, jobs: 2, at_sizes: [100, 200], q: [0, 1, 2, 3] },
};
const spec = validateSpec(doc);

function directRecords(runIndex: number) {
  const k = createKernel(growthTaskOf(runTaskFor('x', spec, runIndex)));
  k.growTo(spec.particles);
  const p = k.positions();
  const final = { dimension: 3, count: p.count, coords: p.coords.slice(0, 3 * p.count) };
  return probeSizesOf(spec).map((size) => {
    const set = clusterPrefix(final, size);
    const g = prepareProbe(set);
    const tasks = probeTasksOfSet(spec.probe!, spec.seed, runIndex, size, set);
    const results = [...tasks].reverse().map((t) => g.run(t));
    return analyseProbedCluster(set, results, spec.probe!, runIndex, size).record;
  });
}

describe('3D probe jobs', () => {
  const set: BallSet = { count: 3, x: Float64Array.of(0, 1, 2), y: Float64Array.of(0, 0.5, 0), z: Float64Array.of(0, 0, 0.7), radius: 1 };

  it('run the same walk as the snapshot probe: the same hits, sparse, with the launch radius', () => {
    const g = new ProbeGeometry3d(set);
    const [task] = planProbeJobs(g.digest, '77', 3000, 1, 0);
    const queued = runBallProbeJob(g, task);
    const dense = runProbe3dJob(g, { seed: '77', jobIndex: 0, walkers: 3000, minStep: task.minStep, launchMargin: task.launchMargin });
    const back = new Float64Array(3);
    queued.hitIds.forEach((id, k) => { back[id] = queued.hitCounts[k]; });
    expect(back).toEqual(dense.hits);
    expect(queued.launchRadius).toBe(dense.launchRadius);
    expect(queued.contactX).toEqual([]);
    expect(probeSetDigest(set)).toBe(g.digest);
    expect(g.digest).toMatch(/^3-b[0-9a-f]{8}$/);
  });

  it('refuse a task planned for another set and a contact sample, as refused on a probe thread', async () => {
    const g = new ProbeGeometry3d(set);
    expect(() => runBallProbeJob(g, planProbeJobs(g.digest, '1', 100, 1, 10)[0])).toThrow(/^contactSample must be 0 for a ball set/);
    const pool = new ProbeThreadPool(1);
    try {
      const err = await pool.run('k', () => set, planProbeJobs('3-b00000000', '1', 100, 1, 0)[0]).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ProbeJobFailed);
      expect((err as ProbeJobFailed).refused).toBe(true);
      expect((err as Error).message).toMatch(/^geometryDigest must match the ball set/);
      // and a good job on the thread gives the in-process result
      const t = planProbeJobs(g.digest, '5', 500, 1, 0)[0];
      expect(await pool.run('k2', () => set, t)).toEqual(runBallProbeJob(g, t));
    } finally {
      await pool.close();
    }
  });

  it('give a ball of radius a the Newtonian capacity a (exact: Newton\'s theorem, Kellogg 1929 ch. VI)', () => {
    const a = 2.5;
    const ball: BallSet = { count: 1, x: Float64Array.of(3), y: Float64Array.of(-1), z: Float64Array.of(2), radius: a };
    const g = prepareProbe(ball);
    const results = planProbeJobs(g.digest, '91', 40_000, 4, 0, 0.02, 1).map((t) => g.run(t));
    const cap = analyseResults(ball, results, [0, 1, 2]).measures.newtonianCapacity!;
    expect(cap.walkers).toBe(40_000);
    // launched at R_L = a + a (margin 1 in units of a): hit share a/R_L = 1/2
    expect(cap.launchRadius).toBeCloseTo(2 * a, 12);
    expect(Math.abs(cap.capacity - a)).toBeLessThan(4 * cap.error);
  });
});

describe('3D box statistics', () => {
  it('equal the planar statistics for a planar set inside one layer of cubes (same grids in x and y; exact identity)', () => {
    const n = 500;
    const x = Float64Array.from({ length: n }, (_, i) => Math.cos(i * 2.1) * (i % 37));
    const y = Float64Array.from({ length: n }, (_, i) => Math.sin(i * 1.3) * (i % 23));
    const w = Float64Array.from({ length: n }, (_, i) => 1 + (i % 5));
    const eps = [1, 2, 4, 8, 16];
    const q = [-1, 0, 1, 2, 3];
    const planar = boxStatistics({ count: n, x, y, w }, eps, q, -40, -40);
    // z = 0 with the z origin just below: every grid's z offset (at most 3ε/4) keeps all points in one layer
    const spatial = boxStatistics({ count: n, x, y, z: new Float64Array(n), w }, eps, q, -40, -40, -1e-9);
    expect(spatial).toEqual(planar);
  });

  it('uniform measure on a sphere: tau(q) = 2(q - 1), so tau(3) = 4 = D + 1 for a compact ball (smooth surface; exact)', () => {
    // Fibonacci points on the unit sphere with equal weights: an equal-area quadrature of the uniform
    // surface measure, which is the harmonic measure of a ball from infinity (exact, by symmetry).
    const K = 400_000;
    const x = new Float64Array(K);
    const y = new Float64Array(K);
    const z = new Float64Array(K);
    const golden = Math.PI * (3 - Math.sqrt(5));
    for (let k = 0; k < K; k++) {
      const zz = 1 - (2 * (k + 0.5)) / K;
      const r = Math.sqrt(1 - zz * zz);
      x[k] = r * Math.cos(golden * k);
      y[k] = r * Math.sin(golden * k);
      z[k] = zz;
    }
    const q = [0, 1, 2, 3];
    const s = spectrumFrom(boxStatistics({ count: K, x, y, z, w: null }, logSpaced(0.02, 0.2, 8), q, -1, -1, -1), 1);
    // tolerance as in the planar circle test (test/harmonic-measures.test.ts), scaled by the surface dimension 2
    console.log(`uniform sphere: tau(0, 1, 2, 3) = ${s.tau.map((t) => t.toFixed(4)).join(", ")}`);
    q.forEach((qq, k) => expect(Math.abs(s.tau[k] - 2 * (qq - 1)), `q = ${qq}: ${s.tau[k]}`).toBeLessThan(0.06));
  });

  it('refuse a box side that needs more than 2^17 boxes across an axis, in one line', () => {
    expect(() => boxStatistics({ count: 2, x: Float64Array.of(0, 1), y: Float64Array.of(0, 0), z: Float64Array.of(0, 0), w: null }, [1e-6], [2], 0, 0, 0))
      .toThrow(/^box side 0.00000100 is too small for this set: at most 131072 boxes across each axis in 3D$/);
  });
});

describe('[probe] for dla-offlattice-3d in a spec', () => {
  it('is accepted; contact_sample is refused there in one line, and other models stay refused', () => {
    expect(spec.probe).toMatchObject({ walkers: 4000, jobs: 2, atSizes: [100, 200], contactSample: 0 });
    // the canonical document has no contact_sample and re-validates to the same spec
    expect(validateSpec(specToDocument(spec))).toEqual(spec);
    expect(runTaskFor('x', spec, 0).keepPositions).toBe(true);
    const problems = (d: unknown): string[] => {
      try {
        validateSpec(d);
      } catch (e) {
        expect(e).toBeInstanceOf(SpecError);
        return (e as SpecError).problems;
      }
      throw new Error('accepted');
    };
    expect(problems({ ...doc, probe: { ...doc.probe, contact_sample: 500 } })).toEqual([
      'probe.contact_sample: 500 is not used by dla-offlattice-3d; allowed: no contact_sample (3D probes keep no contact points: the Newtonian capacity comes from the share of probes that hit)',
    ]);
    expect(problems({ ...doc, model: 'eden-offlattice-2d' })[0]).toMatch(/^probe: eden-offlattice-2d has no harmonic-measure probe; allowed: a spec without \[probe\] for this model \(probes apply to [a-z0-9-, ]*dla-offlattice-3d[a-z0-9-, ]*\)$/);
  });
});

describe('embedded probing of a 3D ensemble', () => {
  it('gives the direct records bit for bit with one thread or two, and a 3D harmonic section', async () => {
    const direct = [0, 1, 2, 3].flatMap((i) => directRecords(i));
    const one = await runEmbedded(spec, { ensembleId: 'p3d1', threads: 1 });
    expect(one.harmonic).toEqual(direct);
    const two = await runEmbedded(spec, { ensembleId: 'p3d2', threads: 2 });
    expect(two.harmonic).toEqual(direct);
    expect(two.picture).toBeNull(); // the measure picture is planar
    for (const r of direct) {
      expect(r.dimension).toBe(3);
      expect(r.capacity).toBeGreaterThan(0);
      expect(r.logCapacity).toBeCloseTo(Math.log(r.capacity!), 12);
      expect(r.tauResolutionSystematic).toBeUndefined();
      // walkers: the probes that hit; at most the 4000 launched
      expect(r.walkers).toBeGreaterThan(0);
      expect(r.walkers).toBeLessThanOrEqual(4000);
    }
    const h = harmonicOfSummary(two.summary)!;
    expect(h.dimension).toBe(3);
    expect(h.bySize.map((b) => b.size)).toEqual([100, 200, 400]);
    for (const b of h.bySize) {
      expect(b.capacity!.clusters).toBe(4);
      expect(b.capacity!.mean).toBeGreaterThan(0);
      expect(b.tau.length).toBe(4);
      expect(b.tau[1].interval).toBeTruthy(); // τ(q) with its cluster-bootstrap interval
    }
    // capacity grows with N: cap ~ N^(1/D_cap), D_cap > 1
    expect(h.capacityGrowth.exponent).toBeGreaterThan(0);
    // tau(3) = D + 1 in 3D: D from tau(3) is tau(3) - 1, its interval shifted by 1
    const e = h.electrostatic;
    expect(e.relation).toBe('tau(3) = D + 1');
    expect(e.dimension).toBe(3);
    expect(e.dimensionFromTau3!.value).toBeCloseTo(e.tau3!.mean - 1, 12);
    const iv = e.tau3!.interval.bca ?? e.tau3!.interval.percentile;
    if (iv) expect(e.dimensionFromTau3!.interval).toEqual([iv[0] - 1, iv[1] - 1]);
    expect(e.source).toMatch(/^tau\(3\) = D \+ 1 in 3D: derived/);
    // the HTML report shows the 3D form: Newtonian capacity, tau(3) = D + 1 with D from tau(3), planar theorems not judged
    const built = buildEnsembleReport({ analysis: JSON.parse(two.summary.statisticsJson), runs: two.results, spec, png: false, embedFont: false });
    const part = built.html.slice(built.html.indexOf('id="section-harmonic"'), built.html.indexOf('id="section-options"'));
    expect(part).toContain('Newtonian capacity C</th>');
    expect(built.notes).toContain('no harmonic measure picture: it is drawn for planar clusters only');
    expect(part).toContain('Electrostatic scaling law τ(3) = D + 1 at N = 400');
    expect(part).toContain('D from τ(3) = τ(3) − 1 = ');
    const beurling = /<li data-check="beurling"[^>]*>.*?<\/li>/.exec(part)?.[0] ?? '';
    expect(beurling, beurling).toContain('class="na"');
    expect(beurling).toContain('estimate is planar: not judged in 3D');
    expect(part).toMatch(/<li data-check="makarov" class="na">/);
    expect(built.figures.find((f) => f.name === 'harmonic-capacity')!.title).toBe('Newtonian capacity against cluster size');
    expect(built.figures.find((f) => f.name === 'harmonic-electrostatic')!.caption).toContain('τ(3) − 1 (τ(3) of the harmonic measure minus d − 2)');
    // 3D records refuse a planar section
    expect(() => harmonicSection(direct, { probe: h.probe, massDimension: null, seed: 1 })).toThrow(/^harmonic record of run 0 at size 100: dimension 3 differs from the section's 2$/);
  }, 120_000);
});

describe('farm probing of a 3D ensemble (real Redis, two worker processes)', () => {
  const { store, queue, startWorker, waitDone } = farmFixture('probe3d');

  it('stores the embedded records once per (run, size) and the same 3D section', async () => {
    await startWorker();
    await startWorker();
    const id = await launchEnsemble(store, queue, spec);
    const status = await waitDone(id, 'probed 3D ensemble done', 120_000);
    expect(status.probes).toEqual({ planned: 12, done: 12, failed: 0, failures: [] });
    const local = await runEmbedded(spec, { ensembleId: 'local3d', threads: 2 });
    expect(await store.harmonicRecords(id)).toEqual(local.harmonic);
    const fs = await farmSummary(store, id);
    const h = harmonicOfSummary(fs!.summary)!;
    expect(h.perCluster).toEqual(local.harmonic);
    expect(h.dimension).toBe(3);
    expect(h.electrostatic.relation).toBe('tau(3) = D + 1');
  }, 240_000);
});
