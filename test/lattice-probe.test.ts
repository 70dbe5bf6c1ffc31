/**
 * Probing lattice clusters (worker/probe/probe-lattice.ts): lattice walkers
 * from infinity onto the perimeter sites, the lattice capacity
 * (coordinator/harmonic/log-capacity.ts, latticePairValue) and the potential
 * kernel behind it (worker/lattice/potential-kernel.ts), and the lattice
 * models' [probe] tables in embedded ensembles. The farm runs the same
 * clusterPrefix → probe job → analyseProbedCluster path (coordinator/farm/probe-jobs.ts),
 * checked for disks in test/probe-ensemble.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { chi2Critical999, chiSquare } from './support/chi-square.js';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runProbes } from '../coordinator/harmonic/probe-run.js';
import { analyseProbedCluster, clusterPrefix, prefixDigest, probeTasksOf } from '../coordinator/harmonic/ensemble-probing.js';
import { runEmbedded } from '../coordinator/embedded/index.js';
import { runTaskFor } from '../coordinator/plan.js';
import { validateSpec, probeSizesOf } from '../coordinator/spec/index.js';
import { growthTaskOf } from '../proto/convert.js';
import { LatticePotential, squarePotential, triangularPotential } from '../worker/lattice/potential-kernel.js';
import { SQUARE, TRIANGULAR, planeOf, toPlane, type PlanarLattice } from '../worker/lattice/planar-lattice.js';
import { createKernel, modelDescriptor } from '../worker/models/registry.js';
import { prepareProbe, probedPointsOf } from '../worker/probe/probe-set.js';
import type { DiskSet } from '../worker/probe/disk-set.js';
import { harmonicMeasureFromInfinity } from './support/lattice-potential.js';


/** A set of lattice sites (axial coordinates) as plane centres. */
function latticeSet(lattice: PlanarLattice, sites: [number, number][]): DiskSet {
  const x: number[] = [];
  const y: number[] = [];
  for (const [i, j] of sites) {
    toPlane(lattice, i, j);
    x.push(planeOf.x);
    y.push(planeOf.y);
  }
  return { count: sites.length, x: Float64Array.from(x), y: Float64Array.from(y), r: 1, lattice: lattice.name };
}

/** The perimeter of a set of sites in the probe's order, in axial coordinates. */
function perimeterOf(lattice: PlanarLattice, sites: [number, number][]): [number, number][] {
  const taken = new Set(sites.map(([i, j]) => `${i},${j}`));
  const out: [number, number][] = [];
  for (const [i, j] of sites) {
    for (let d = 0; d < lattice.neighbours; d++) {
      const k = `${i + lattice.di[d]},${j + lattice.dj[d]}`;
      if (taken.has(k)) continue;
      taken.add(k);
      out.push([i + lattice.di[d], j + lattice.dj[d]]);
    }
  }
  return out;
}

/** The exact equilibrium constant Σ_z a(x − z) H(z) (x any site of the set) = the lattice capacity cap_L. */
function exactCapacity(sites: [number, number][], kernel: (i: number, j: number) => number): number {
  const h = harmonicMeasureFromInfinity(sites, kernel);
  return h.reduce((s, hz, z) => s + kernel(sites[0][0] - sites[z][0], sites[0][1] - sites[z][1]) * hz, 0);
}

// Small fixed clusters without holes: a walk from infinity first visits the perimeter P at a site whose law is
// the equilibrium measure of P (Lawler & Limic 2010, Random Walk: A Modern Introduction, §6.6; from memory),
// solved exactly from the potential kernel (test/support/lattice-potential.ts).
const CASES: Array<{ lattice: PlanarLattice; sites: [number, number][]; kernel: (i: number, j: number) => number }> = [
  { lattice: SQUARE, sites: [[0, 0], [1, 0], [2, 0], [0, 1]], kernel: squarePotential },
  { lattice: TRIANGULAR, sites: [[0, 0], [1, 0], [0, 1], [-1, 2]], kernel: triangularPotential },
];

describe('lattice probes: hit frequencies equal the exact discrete harmonic measure from infinity', () => {
  for (const c of CASES) {
    it(`${c.lattice.name}: ${c.sites.length}-site cluster, 40000 walkers in 4 jobs (chi-square at significance 0.001); capacity within 4 standard errors of the exact one`, async () => {
      const set = latticeSet(c.lattice, c.sites);
      const perimeter = perimeterOf(c.lattice, c.sites);
      const exact = harmonicMeasureFromInfinity(perimeter, c.kernel);
      const walkers = 40_000;
      const run = await runProbes(set, { walkers, seed: '77', jobs: 4, threads: 1, q: [0, 1, 2], contactSample: 2000 });
      const pts = probedPointsOf(set);
      expect(pts.count).toBe(perimeter.length);
      perimeter.forEach(([i, j], k) => {
        toPlane(c.lattice, i, j);
        expect([pts.x[k], pts.y[k]]).toEqual([planeOf.x, planeOf.y]);
      });
      expect(run.counts.reduce((a, b) => a + b, 0)).toBe(walkers);
      expect(chiSquare(run.counts, exact, walkers)).toBeLessThan(chi2Critical999(perimeter.length - 1));
      // capacity: (cap_L − κ)/C of the perimeter set (= that of sites ∪ perimeter), exact from the equations
      const pot = LatticePotential.of(c.lattice.name);
      const exactLog = (exactCapacity(perimeter, c.kernel) - pot.constant) / pot.slope;
      const cap = run.measures.capacity!;
      expect(cap.samples).toBe(2000);
      expect(Math.abs(cap.logCapacity - exactLog)).toBeLessThan(4 * cap.logCapacityError);
      expect(cap.set).toContain('lattice');
    });
  }

  it('refuses points that are not lattice sites, and repeated sites, in one line', () => {
    const bad: DiskSet = { count: 2, x: [0, 0.5], y: [0, 0], r: 1, lattice: 'square' };
    expect(() => prepareProbe(bad)).toThrow(/point 1 \(0\.5, 0\) is not a site of the square lattice/);
    const twice: DiskSet = { count: 2, x: [1, 1], y: [0, 0], r: 1, lattice: 'triangular' };
    expect(() => prepareProbe(twice)).toThrow(/point 1 repeats the site/);
  });
});

describe('lattice capacity (definition in coordinator/harmonic/log-capacity.ts)', () => {
  it('exact values: cap_L of one site is 0 and of two neighbours 1/2 (a = 1 at a neighbour); a row of n sites tends to the continuum segment of length n, capacity n/4', () => {
    const pot = LatticePotential.of('square');
    const row = (n: number): [number, number][] => Array.from({ length: n }, (_, i) => [i, 0]);
    expect(exactCapacity(row(1), (i, j) => pot.at(i, j))).toBe(0);
    expect(exactCapacity(row(2), (i, j) => pot.at(i, j))).toBeCloseTo(0.5, 12);
    // continuum: a segment of length L has logarithmic capacity L/4 (Ransford 1995, Potential Theory in the
    // Complex Plane, Table 5.1; from memory). Measured here: (cap_L − κ)/C − ln(n/4) ≈ −0.29/n; require < 0.5/n.
    for (const n of [50, 100, 200]) {
      const logEquivalent = (exactCapacity(row(n), (i, j) => pot.at(i, j)) - pot.constant) / pot.slope;
      expect(Math.abs(logEquivalent - Math.log(n / 4))).toBeLessThan(0.5 / n);
    }
  });

  it('the potential kernel: a = 1 at every neighbour, a(1,1) = 4/π (Lawler & Limic 2010, from memory), and C ln|x| + κ beyond the table within 1e-4 of the quadrature', () => {
    const sq = LatticePotential.of('square');
    const tri = LatticePotential.of('triangular');
    expect(sq.at(1, 1)).toBeCloseTo(4 / Math.PI, 12);
    for (let d = 0; d < 4; d++) expect(sq.at(SQUARE.di[d], SQUARE.dj[d])).toBeCloseTo(1, 12);
    for (let d = 0; d < 6; d++) expect(tri.at(TRIANGULAR.di[d], TRIANGULAR.dj[d])).toBeCloseTo(1, 12);
    // square κ = (2γ + ln 8)/π from memory: the quadrature at |x| = 64 agrees to its next term, cos 4φ/(6π|x|²) < 1.3e-5
    expect(Math.abs(squarePotential(64, 0) - sq.slope * Math.log(64) - sq.constant)).toBeLessThan(2e-5);
    for (const [i, j] of [[80, 0], [100, 37], [70, -70], [-90, 10]]) {
      expect(Math.abs(sq.at(i, j) - squarePotential(i, j))).toBeLessThan(1e-4);
      expect(Math.abs(tri.at(i, j) - triangularPotential(i, j))).toBeLessThan(1e-4);
    }
    // slope of the triangular kernel: √3/π (doubling the distance adds C ln 2)
    expect(triangularPotential(96, 0) - triangularPotential(48, 0)).toBeCloseTo(tri.slope * Math.log(2), 4);
  });
});

describe('lattice models in ensembles with a [probe] table', () => {
  it('the four lattice models declare the lattice probe', () => {
    for (const kind of ['dla-square', 'dla-triangular', 'eden-square', 'eden-triangular']) expect(modelDescriptor(kind).probe).toBe('lattice-sites');
  });

  for (const model of ['dla-square', 'eden-triangular']) {
    it(`${model}: embedded probing gives the records of a direct probe of the same clusters`, async () => {
      const spec = validateSpec({ model, particles: 400, clusters: 2, seed: '9', probe: { walkers: 2000, jobs: 2, at_sizes: [200], q: [0, 1, 2, 3], contact_sample: 400 } });
      const out = await runEmbedded(spec, { ensembleId: `lp-${model}`, threads: 1 });
      const direct = [0, 1].flatMap((runIndex) => {
        const k = createKernel(growthTaskOf(runTaskFor('x', spec, runIndex)));
        k.growTo(spec.particles);
        const p = k.positions();
        const final = { dimension: 2, count: p.count, coords: p.coords.slice(0, 2 * p.count) };
        return probeSizesOf(spec).map((size) => {
          const set = clusterPrefix(final, size, model) as DiskSet;
          expect(set.lattice).toBe(modelDescriptor(model).lattice);
          const g = prepareProbe(set);
          const results = probeTasksOf(spec.probe!, spec.seed, runIndex, size, prefixDigest(final, size, model)).map((t) => g.run(t));
          return analyseProbedCluster(set, results, spec.probe!, runIndex, size).record;
        });
      });
      expect(out.harmonic).toEqual(direct);
      // the picture carries the measure on the perimeter sites of run 0
      expect(out.picture!.counts.reduce((a, b) => a + b, 0)).toBe(2000);
      expect(out.picture!.x.length).toBe(out.picture!.counts.length);
    });
  }
});

describe('tendril probe --lattice', () => {
  const CLI = join(process.cwd(), 'dist/coordinator/cli.js');
  const tendril = (args: string[]) => spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8' });
  it('probes a lattice snapshot on its perimeter sites, and refuses a bad lattice name or a CSV in one line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tendril-lattice-probe-'));
    try {
      const g = tendril(['grow', '--model', 'eden-square', '--particles', '300', '--seed', '2', '--out', join(dir, 'g'), '--quiet']);
      expect(g.status, g.stderr).toBe(0);
      const snap = join(dir, 'g', 'cluster.snapshot');
      const p = tendril(['probe', snap, '--lattice', 'square', '--walkers', '3000', '--seed', '1', '--out', join(dir, 'p'), '--q-grid', '0:3:1']);
      expect(p.status, p.stderr).toBe(0);
      const m = JSON.parse(readFileSync(join(dir, 'p', 'probe-measures.json'), 'utf8'));
      expect(m.input).toMatchObject({ kind: 'snapshot', disks: 300, lattice: 'square' });
      const hits = readFileSync(join(dir, 'p', 'probe-hits.csv'), 'utf8').trim().split('\n').slice(1);
      expect(hits.length).toBe(m.input.perimeterSites);
      expect(hits.reduce((s, line) => s + Number(line.split(',')[4]), 0)).toBe(3000);
      expect(m.capacity.set).toContain('lattice');
      const bad = tendril(['probe', snap, '--lattice', 'hexagonal', '--walkers', '1000', '--seed', '1', '--out', join(dir, 'q')]);
      expect(bad.status).toBe(2);
      expect(bad.stderr.trim()).toBe('tendril: --lattice: "hexagonal" is not allowed; allowed: square, triangular');
      const csv = join(dir, 'set.csv');
      writeFileSync(csv, 'x,y,r\n0,0,1\n1,0,1\n');
      const onCsv = tendril(['probe', csv, '--lattice', 'square', '--walkers', '1000', '--seed', '1', '--out', join(dir, 'r')]);
      expect(onCsv.status).toBe(2);
      expect(onCsv.stderr.trim().split('\n')).toHaveLength(1);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
