/**
 * The Eden model on a planar lattice (square or triangular, spacing 1): the
 * kernel shared by worker/models/eden-square and worker/models/eden-triangular.
 *
 * The model (exact definition; "Eden B", perimeter SITES)
 *  - The cluster starts as the seed site (0, 0).
 *  - The perimeter is the set of empty sites that are nearest neighbours of
 *    at least one cluster site (worker/lattice/planar-lattice.ts lists the
 *    neighbours). At every step ONE PERIMETER SITE IS CHOSEN UNIFORMLY
 *    (each with probability 1/|perimeter|, however many cluster neighbours
 *    it has) and added to the cluster. This is the site-perimeter convention
 *    (Eden's version B); the bond convention, choosing a (cluster site,
 *    empty neighbour) pair uniformly, is a different model not offered here.
 *  - Positions are emitted in the plane (worker/lattice/planar-lattice.ts):
 *    square site (i, j) at (i, j); triangular site (i, j) at (i + j/2, j·√3/2).
 *
 * How it is simulated (exactly; there is no approximation)
 *  - Sparse storage: one int32 per site in 8 × 8 tiles allocated on demand
 *    (worker/index/tiled-grids.ts): 0 = neither in the cluster nor on the
 *    perimeter, −1 = in the cluster, k >= 1 = on the perimeter at slot k − 1
 *    of the perimeter list. Memory grows with the sites touched (cluster and
 *    perimeter), not with the bounding box.
 *  - The perimeter list (two int32 arrays, grown by doubling) gives O(1)
 *    uniform choice (Random.nextBelow) and O(1) removal: the chosen slot is
 *    filled with the last entry, whose site value is updated.
 *  - New perimeter sites are appended in the fixed neighbour order.
 *
 * Determinism and checkpoints: one draw of nextBelow(|perimeter|) per
 * particle from Random.forRun(ensembleSeed, runIndex, STREAM_GROWTH).
 * The perimeter order is a function of the arrival order alone, so a
 * checkpoint holds only positions (and generator, counters, records);
 * resuming replays the arrivals and rebuilds the same list.
 *
 * Observables at each record size: R_g, R_max, the centre offset, the planar
 * anisotropy measures (worker/core/anisotropy.ts) and the radial interface
 * (worker/core/radial-interface.ts: interface_radius, interface_width).
 */
import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { ENGINE_VERSION } from '../../core/engine-version.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { recordRadialInterface } from '../../core/radial-interface.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import { STOP_CHECK_EVERY, stopRaised, type StopSignal } from '../../core/stop-signal.js';
import { TiledInt32Grid } from '../../index/tiled-grids.js';
import { type PlanarLattice, planeOf, siteOf, toPlane, toSite } from '../../lattice/planar-lattice.js';

const OCCUPIED = -1;

export class EdenLatticeKernel implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: Counters;
  private readonly lattice: PlanarLattice;
  private readonly cluster: PlanarCluster;
  private readonly sites: TiledInt32Grid;
  private perimI: Int32Array;
  private perimJ: Int32Array;
  private perimCount = 0;
  private readonly rng: Random;

  constructor(lattice: PlanarLattice, task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    this.lattice = lattice;
    this.sites = new TiledInt32Grid(0, Math.max(16, task.particles >> 5));
    this.perimI = new Int32Array(1024);
    this.perimJ = new Int32Array(1024);
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, count: number, rMax: number): void => {
      recordPlanarAnisotropy(extra, coords, 2, count, rMax);
      recordRadialInterface(extra, coords, 2, count, rMax);
    };
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.occupy(0, 0);
      this.cluster.place(0, 0);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      this.counters = { perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra, checkpoint.series);
      const p = checkpoint.positions;
      for (let k = 0; k < checkpoint.count; k++) {
        toSite(lattice, p[2 * k], p[2 * k + 1]);
        const i = siteOf.i;
        const j = siteOf.j;
        const v = this.sites.get(i, j);
        if (k > 0 && v <= 0) throw new RangeError(`checkpoint position ${k} is not a perimeter site of the cluster before it`);
        if (k > 0) this.removePerimeter(v - 1);
        this.occupy(i, j);
        this.cluster.append(p[2 * k], p[2 * k + 1]);
      }
      this.cluster.resumeRecords();
    }
    this.counters.perimeter_sites = this.perimCount;
  }

  get count(): number {
    return this.cluster.n;
  }

  get done(): boolean {
    return this.cluster.n >= this.task.particles;
  }

  /** Every particle is one draw, so a stop (read every STOP_CHECK_EVERY particles) leaves the state after a whole particle. */
  growTo(target: number, stop?: StopSignal): void {
    const goal = Math.min(target, this.task.particles);
    const rng = this.rng;
    const lattice = this.lattice;
    let untilCheck = STOP_CHECK_EVERY;
    while (this.cluster.n < goal) {
      if (--untilCheck === 0) {
        untilCheck = STOP_CHECK_EVERY;
        if (stopRaised(stop)) break;
      }
      const slot = rng.nextBelow(this.perimCount);
      const i = this.perimI[slot];
      const j = this.perimJ[slot];
      this.removePerimeter(slot);
      this.occupy(i, j);
      toPlane(lattice, i, j);
      this.cluster.place(planeOf.x, planeOf.y);
    }
    this.counters.perimeter_sites = this.perimCount;
  }

  /** Take slot `slot` out of the perimeter list (its site's value is left for the caller to set). */
  private removePerimeter(slot: number): void {
    const last = --this.perimCount;
    if (slot !== last) {
      const li = this.perimI[last];
      const lj = this.perimJ[last];
      this.perimI[slot] = li;
      this.perimJ[slot] = lj;
      this.sites.set(li, lj, slot + 1);
    }
  }

  /** Mark (i, j) as a cluster site and put its empty, unlisted neighbours on the perimeter. */
  private occupy(i: number, j: number): void {
    const sites = this.sites;
    sites.set(i, j, OCCUPIED);
    const di = this.lattice.di;
    const dj = this.lattice.dj;
    for (let k = 0; k < di.length; k++) {
      const ni = i + di[k];
      const nj = j + dj[k];
      if (sites.get(ni, nj) !== 0) continue;
      if (this.perimCount === this.perimI.length) this.growPerimeter();
      this.perimI[this.perimCount] = ni;
      this.perimJ[this.perimCount] = nj;
      this.perimCount++;
      sites.set(ni, nj, this.perimCount);
    }
  }

  private growPerimeter(): void {
    const bi = new Int32Array(2 * this.perimI.length);
    const bj = new Int32Array(2 * this.perimJ.length);
    bi.set(this.perimI);
    bj.set(this.perimJ);
    this.perimI = bi;
    this.perimJ = bj;
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  /** Bytes held by the site grid and the perimeter list (for benchmarks). */
  get storageBytes(): number {
    return this.sites.bytes + this.perimI.byteLength + this.perimJ.byteLength;
  }

  checkpoint(): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(this.task),
      dimension: 2,
      count: this.cluster.n,
      positions: this.cluster.xy.slice(0, 2 * this.cluster.n),
      rngState: this.rng.state(),
      counters: { perimeter_sites: this.perimCount },
      series: structuredClone(this.cluster.series),
      modelState: new Uint8Array(0),
    };
  }

  result(): GrowthResult {
    return this.cluster.result(this.task, { perimeter_sites: this.perimCount }, this.stateHash());
  }

  /** Digest of positions, generator state, count and the perimeter size. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.perimCount);
    return h.digest();
  }
}
