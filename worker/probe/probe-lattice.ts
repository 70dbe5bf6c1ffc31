/**
 * Harmonic-measure probing of a lattice cluster (pure: no I/O): the
 * discrete harmonic measure from infinity of its perimeter sites, which is
 * the growth probability of lattice DLA (m = 1) at every perimeter site.
 *
 * The set (exact definition)
 *  - A finite set A of sites of the square or triangular lattice (spacing 1;
 *    worker/lattice/planar-lattice.ts), given by their plane centres (a
 *    grown cluster of dla-square, dla-triangular, eden-square or
 *    eden-triangular, or any prefix of one).
 *  - Its perimeter ∂A: the empty sites with a site of A among their nearest
 *    neighbours, listed in a fixed order (for each site of A in the given
 *    order, its neighbours in the lattice's neighbour order; first listing
 *    wins). Each perimeter site is a "point" of the probed set (id = its
 *    place in that list, plane centre = its position, radius ½ spacing for
 *    the box analyses).
 *  - A probe is a walker of the lattice's simple random walk from infinity,
 *    stopped at the first perimeter site it visits; its hit distribution is
 *    the harmonic measure from infinity H of the set A ∪ ∂A (a walk from
 *    outside enters A ∪ ∂A at a perimeter site), which is carried by ∂A.
 *
 * How it is simulated: exactly the growth walker of lattice DLA
 * (worker/lattice/lattice-walk.ts, the kernel's exact exit-table jumps,
 * launch on the circle of radius R_max + LATTICE_PROBE_LAUNCH_MARGIN about
 * the seed site (0, 0) and return of far walkers; the launch and return are
 * the two stated approximations of worker/models/dla-lattice/dla-lattice-kernel.ts,
 * with their measured effect there), without sticking. test/lattice-probe.test.ts
 * checks the hit frequencies on small fixed clusters against the exact
 * harmonic measure from infinity (equilibrium equations of the potential
 * kernel). The task's minStep and launchMargin are checked but not used:
 * the lattice walk has no final-approach step, and the launch margin is the
 * lattice kernel's default.
 *
 * Jobs and determinism as for disks (worker/probe/probe-2d.ts): job j uses
 * Random.forRun(seed, j, STREAM_PROBE) and is a function of (set, task).
 */
import { Random, STREAM_PROBE } from '../core/random.js';
import { TiledInt32Grid } from '../index/tiled-grids.js';
import { LatticeWalk } from '../lattice/lattice-walk.js';
import { SQUARE, TRIANGULAR, type PlanarLattice, planeOf, siteOf, toPlane, toSite } from '../lattice/planar-lattice.js';
import type { DiskSet } from './disk-set.js';
import { checkProbeTask, diskSetDigest, probeResultOf, type ProbeResult, type ProbeTask } from './probe-2d.js';

/** Launch margin of lattice probes, lattice spacings (the lattice DLA kernel's default). */
export const LATTICE_PROBE_LAUNCH_MARGIN = 8;

/** Radius given to each perimeter site in the box analyses (half a spacing: adjacent sites touch). */
export const PERIMETER_SITE_RADIUS = 0.5;

function latticeOf(name: 'square' | 'triangular'): PlanarLattice {
  return name === 'square' ? SQUARE : TRIANGULAR;
}

/** Digest of a lattice set: the lattice's name and the disk-set digest of its centres. */
export function latticeSetDigest(set: DiskSet): string {
  return `${set.lattice}:${diskSetDigest({ count: set.count, x: set.x, y: set.y, r: 1 })}`;
}

/** The sites of a lattice set, checked: every centre must be a lattice site, no site twice. */
function sitesOf(set: DiskSet, lattice: PlanarLattice): { i: Int32Array; j: Int32Array; grid: TiledInt32Grid } {
  const i = new Int32Array(set.count);
  const j = new Int32Array(set.count);
  const grid = new TiledInt32Grid(-1, Math.max(16, set.count >> 5));
  for (let k = 0; k < set.count; k++) {
    toSite(lattice, set.x[k], set.y[k]);
    toPlane(lattice, siteOf.i, siteOf.j);
    if (Math.abs(planeOf.x - set.x[k]) > 1e-9 || Math.abs(planeOf.y - set.y[k]) > 1e-9)
      throw new RangeError(`point ${k} (${set.x[k]}, ${set.y[k]}) is not a site of the ${lattice.name} lattice with spacing 1`);
    if (grid.get(siteOf.i, siteOf.j) !== -1) throw new RangeError(`point ${k} repeats the site (${siteOf.i}, ${siteOf.j}) of the ${lattice.name} lattice`);
    grid.set(siteOf.i, siteOf.j, -2);
    i[k] = siteOf.i;
    j[k] = siteOf.j;
  }
  return { i, j, grid };
}

/**
 * The perimeter sites of a lattice set in the fixed order of the file
 * header, as the probed points (plane centres, radius PERIMETER_SITE_RADIUS).
 */
export function latticePerimeterOf(set: DiskSet): DiskSet & { ids: TiledInt32Grid } {
  if (!set.lattice) throw new RangeError('latticePerimeterOf needs a lattice set');
  const lattice = latticeOf(set.lattice);
  const { i, j, grid } = sitesOf(set, lattice);
  const px: number[] = [];
  const py: number[] = [];
  for (let k = 0; k < set.count; k++) {
    for (let d = 0; d < lattice.neighbours; d++) {
      const ni = i[k] + lattice.di[d];
      const nj = j[k] + lattice.dj[d];
      if (grid.get(ni, nj) !== -1) continue;
      grid.set(ni, nj, px.length);
      toPlane(lattice, ni, nj);
      px.push(planeOf.x);
      py.push(planeOf.y);
    }
  }
  return { count: px.length, x: Float64Array.from(px), y: Float64Array.from(py), r: PERIMETER_SITE_RADIUS, ids: grid };
}

/** A prepared lattice set: the walker's storage with every site occupied, and the perimeter ids. */
export class LatticeProbeGeometry {
  readonly lattice: 'square' | 'triangular';
  readonly digest: string;
  /** Perimeter sites (the probed points). */
  readonly perimeter: DiskSet & { ids: TiledInt32Grid };
  readonly walker: LatticeWalk;
  /** Largest plane distance of a site from the seed site (0, 0). */
  readonly rMax: number;

  constructor(set: DiskSet) {
    if (!set.lattice) throw new RangeError('LatticeProbeGeometry needs a lattice set');
    if (set.count < 1) throw new RangeError('a lattice set needs at least one site');
    this.lattice = set.lattice;
    this.digest = latticeSetDigest(set);
    this.perimeter = latticePerimeterOf(set);
    const lattice = latticeOf(set.lattice);
    this.walker = new LatticeWalk(lattice, set.count);
    let r2 = 0;
    for (let k = 0; k < set.count; k++) {
      toSite(lattice, set.x[k], set.y[k]);
      this.walker.occupy(siteOf.i, siteOf.j);
      const d2 = set.x[k] * set.x[k] + set.y[k] * set.y[k];
      if (d2 > r2) r2 = d2;
    }
    this.rMax = Math.sqrt(r2);
  }

  /** Number of probed points (perimeter sites). */
  get count(): number {
    return this.perimeter.count;
  }
}

/** Run one probe job on a prepared lattice set. */
export function runLatticeProbeJob(g: LatticeProbeGeometry, task: ProbeTask): ProbeResult {
  checkProbeTask(task);
  if (task.geometryDigest !== g.digest) throw new RangeError(`geometryDigest must match the point set (${g.digest}), got "${task.geometryDigest}"`);
  const counts = new Float64Array(g.count);
  const sample = task.contactSample;
  const cX: number[] = [];
  const cY: number[] = [];
  const cId: number[] = [];
  const rng = Random.forRun(task.seed, task.jobIndex, STREAM_PROBE);
  const counters = { jumps: 0, shortSteps: 0, returns: 0 };
  const w = g.walker;
  const ids = g.perimeter.ids;
  for (let n = 0; n < task.walkers; n++) {
    w.walk(rng, g.rMax, LATTICE_PROBE_LAUNCH_MARGIN);
    const id = ids.get(w.atI, w.atJ);
    if (id < 0) throw new Error(`lattice probe stopped at (${w.atI}, ${w.atJ}), which is not a listed perimeter site`);
    counts[id]++;
    counters.jumps += w.jumps;
    counters.shortSteps += w.steps;
    counters.returns += w.returns;
    if (n < sample) {
      cX.push(g.perimeter.x[id]);
      cY.push(g.perimeter.y[id]);
      cId.push(id);
    }
  }
  return probeResultOf(task, counts, { x: cX, y: cY, id: cId }, counters);
}
