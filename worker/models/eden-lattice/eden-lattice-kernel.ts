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
 *  - The perimeter list (three int32 arrays: i, j and the site's index in
 *    the tile pool, so removal needs no directory lookup; grown by doubling) gives O(1)
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
 * (worker/core/radial-interface.ts: interface_radius, interface_width), the
 * last two kept up to date per particle (worker/core/incremental-planar-records.ts,
 * which states the one reassociation this brings to fold_amplitude_k).
 */
import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { ENGINE_VERSION } from '../../core/engine-version.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { IncrementalPlanarRecords } from '../../core/incremental-planar-records.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
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
  /** Pool index of each perimeter site in `sites` (stable while the pool grows). */
  private perimCell: Int32Array;
  private perimCount = 0;
  private readonly rng: Random;
  private readonly records: IncrementalPlanarRecords;

  constructor(lattice: PlanarLattice, task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    this.lattice = lattice;
    this.sites = new TiledInt32Grid(0, Math.max(16, task.particles >> 5));
    this.perimI = new Int32Array(1024);
    this.perimJ = new Int32Array(1024);
    this.perimCell = new Int32Array(1024);
    this.records = new IncrementalPlanarRecords(task.particles);
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, _count: number, rMax: number): void => this.records.record(extra, coords, rMax);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.occupy(0, 0);
      this.records.add(0, 0);
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
        this.records.add(p[2 * k], p[2 * k + 1]);
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

  growTo(target: number): void {
    const goal = Math.min(target, this.task.particles);
    const rng = this.rng;
    const lattice = this.lattice;
    while (this.cluster.n < goal) {
      const slot = rng.nextBelow(this.perimCount);
      const i = this.perimI[slot];
      const j = this.perimJ[slot];
      const cell = this.perimCell[slot];
      this.removePerimeter(slot);
      this.occupyCell(i, j, cell);
      toPlane(lattice, i, j);
      this.records.add(planeOf.x, planeOf.y);
      this.cluster.place(planeOf.x, planeOf.y);
    }
    this.counters.perimeter_sites = this.perimCount;
  }

  /** Take slot `slot` out of the perimeter list (its site's value is left for the caller to set). */
  private removePerimeter(slot: number): void {
    const last = --this.perimCount;
    if (slot !== last) {
      const cell = this.perimCell[last];
      this.perimI[slot] = this.perimI[last];
      this.perimJ[slot] = this.perimJ[last];
      this.perimCell[slot] = cell;
      this.sites.pool[cell] = slot + 1;
    }
  }

  /** Mark (i, j) as a cluster site and put its empty, unlisted neighbours on the perimeter. */
  private occupy(i: number, j: number): void {
    this.occupyCell(i, j, this.sites.cellIndex(i, j));
  }

  /**
   * occupy() for a site whose pool index is known: its neighbours are
   * addressed from it (TiledInt32Grid.cellIndexNear), without hashing.
   */
  private occupyCell(i: number, j: number, cell: number): void {
    const sites = this.sites;
    sites.pool[cell] = OCCUPIED;
    const di = this.lattice.di;
    const dj = this.lattice.dj;
    for (let k = 0; k < di.length; k++) {
      const ni = i + di[k];
      const nj = j + dj[k];
      const nc = sites.cellIndexNear(cell, i, j, ni, nj);
      if (sites.pool[nc] !== 0) continue;
      if (this.perimCount === this.perimI.length) this.growPerimeter();
      this.perimI[this.perimCount] = ni;
      this.perimJ[this.perimCount] = nj;
      this.perimCell[this.perimCount] = nc;
      this.perimCount++;
      sites.pool[nc] = this.perimCount;
    }
  }

  private growPerimeter(): void {
    const grow = (a: Int32Array): Int32Array => {
      const b = new Int32Array(2 * a.length);
      b.set(a);
      return b;
    };
    this.perimI = grow(this.perimI);
    this.perimJ = grow(this.perimJ);
    this.perimCell = grow(this.perimCell);
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  /** Bytes held by the site grid and the perimeter list (for benchmarks). */
  get storageBytes(): number {
    return this.sites.bytes + 3 * this.perimI.byteLength + this.records.bytes;
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
