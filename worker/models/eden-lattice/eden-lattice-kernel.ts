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
 *  - Sparse storage of the cluster and its perimeter list
 *    (worker/lattice/perimeter-sites.ts: one int32 per site in 8 × 8 tiles
 *    allocated on demand; memory grows with the sites touched, not with the
 *    bounding box). The list gives O(1) uniform choice (Random.nextBelow)
 *    and O(1) removal; new perimeter sites are appended in the fixed
 *    neighbour order.
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
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { IncrementalPlanarRecords } from '../../core/incremental-planar-records.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import { PerimeterSites } from '../../lattice/perimeter-sites.js';
import { STOP_CHECK_EVERY, stopRaised, type StopSignal } from '../../core/stop-signal.js';
import { type PlanarLattice, planeOf, toPlane } from '../../lattice/planar-lattice.js';
import { replayCheckpointSites } from '../../lattice/checkpoint-site-replay.js';

export class EdenLatticeKernel implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: Counters;
  private readonly lattice: PlanarLattice;
  private readonly cluster: PlanarCluster;
  private readonly perimeter: PerimeterSites;
  private readonly rng: Random;
  private readonly records: IncrementalPlanarRecords;

  constructor(lattice: PlanarLattice, task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    this.lattice = lattice;
    this.perimeter = new PerimeterSites(lattice, Math.max(16, task.particles >> 5));
    this.records = new IncrementalPlanarRecords(task.particles);
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, _count: number, rMax: number): void => this.records.record(extra, coords, rMax);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.perimeter.occupy(0, 0);
      this.records.add(0, 0);
      this.cluster.place(0, 0);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      this.counters = { perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra, checkpoint.series);
      const p = checkpoint.positions;
      replayCheckpointSites(lattice, p, checkpoint.count, this.perimeter, (i, j, k) => {
        const v = this.perimeter.valueAt(i, j);
        if (k > 0) this.perimeter.removeSlot(v - 1);
        this.perimeter.occupy(i, j);
        this.records.add(p[2 * k], p[2 * k + 1]);
        this.cluster.append(p[2 * k], p[2 * k + 1]);
      });
      this.cluster.resumeRecords();
    }
    this.counters.perimeter_sites = this.perimeter.count;
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
    const perimeter = this.perimeter;
    let untilCheck = STOP_CHECK_EVERY;
    while (this.cluster.n < goal) {
      if (--untilCheck === 0) {
        untilCheck = STOP_CHECK_EVERY;
        if (stopRaised(stop)) break;
      }
      const slot = rng.nextBelow(perimeter.count);
      const i = perimeter.perimI[slot];
      const j = perimeter.perimJ[slot];
      const cell = perimeter.perimCell[slot];
      perimeter.removeSlot(slot);
      perimeter.occupyCell(i, j, cell);
      toPlane(lattice, i, j);
      this.records.add(planeOf.x, planeOf.y);
      this.cluster.place(planeOf.x, planeOf.y);
    }
    this.counters.perimeter_sites = perimeter.count;
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  /** Bytes held by the site grid and the perimeter list (for benchmarks). */
  get storageBytes(): number {
    return this.perimeter.bytes + this.records.bytes;
  }

  checkpoint(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { perimeter_sites: this.perimeter.count }, new Uint8Array(0));
  }

  checkpointView(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { perimeter_sites: this.perimeter.count }, new Uint8Array(0), true);
  }

  result(): GrowthResult {
    return this.cluster.result(this.task, { perimeter_sites: this.perimeter.count }, this.stateHash());
  }

  /** Digest of positions, generator state, count and the perimeter size. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.perimeter.count);
    return h.digest();
  }
}
