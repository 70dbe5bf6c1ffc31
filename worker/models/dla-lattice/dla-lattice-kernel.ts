/**
 * Diffusion-limited aggregation on a planar lattice (square or triangular,
 * spacing 1), with noise reduction: the kernel shared by
 * worker/models/dla-square and worker/models/dla-triangular.
 *
 * The model (exact definition)
 *  - Sites of the lattice (worker/lattice/planar-lattice.ts: 4 neighbours on
 *    the square lattice, 6 on the triangular one). The cluster starts as the
 *    seed site (0, 0). The perimeter is the set of empty sites with a
 *    cluster site among their nearest neighbours.
 *  - A walker performs the lattice's simple random walk (each step to one of
 *    the nearest neighbours with equal probability) started "from
 *    infinity", i.e. its first perimeter site has the discrete harmonic
 *    measure from infinity of the perimeter. The walker stops at the first
 *    perimeter site it visits (the site where it first becomes a nearest
 *    neighbour of the cluster): that site gets one hit.
 *  - Noise reduction (parameter m >= 1; Tang 1985, Phys. Rev. A 31, 1977;
 *    Kertész & Vicsek 1986, J. Phys. A 19, L257; both from memory): a
 *    perimeter site joins the cluster on its m-th hit; the hits of the
 *    other perimeter sites are kept. m = 1 is plain lattice DLA (every
 *    walker adds the site it stops at).
 *  - Positions are emitted in the plane: square site (i, j) at (i, j),
 *    triangular site (i, j) at (i + j/2, j·√3/2).
 *
 * How it is simulated
 *  1. Launch (approximation A): the walker starts at the site given by
 *     rounding (in lattice coordinates) a uniformly random point of the
 *     circle of radius R_L = R_max + launch_margin (R_max: largest distance
 *     of a cluster site from the seed, in the plane). In the continuum this
 *     is exact; on the lattice the walk from infinity crosses a large circle
 *     uniformly only up to lattice corrections that vanish as R_L grows.
 *     Measured effect: test/dla-square.test.ts compares growth probabilities
 *     on a small fixed square-lattice cluster with its exact discrete
 *     harmonic measure (chi-square at significance 0.001: no detectable
 *     difference with 4·10^4 walkers at margin 2, the smallest allowed, nor
 *     at the default 8); test/dla-triangular.test.ts does the same on a
 *     fixed triangular-lattice domino (3·10^4 walkers, default margin).
 *  2. Return (approximation B, same kind): a walker farther than
 *     R_far = 2 R_L + 64 from the seed is moved to the site nearest (by
 *     rounding) to the point where a planar Brownian motion from its
 *     position first hits the launch circle (the exact exterior Poisson
 *     kernel, worker/walkers/poisson-return-2d.ts). It is never killed.
 *  3. Exact jumps. Square lattice: when the L∞ distance (in lattice
 *     coordinates) from the walker to the cluster is at least d >= 3, the
 *     walker jumps to the site where the lattice walk from the centre of
 *     the square of half-width L first reaches its boundary, with L the
 *     largest entry <= d − 1 of a ladder of half-widths (1 … 32, then
 *     steps of 1/16, up to 32768), sampled from the exact exit law
 *     (worker/lattice/square-exit-tables.ts). Every site strictly inside
 *     that square is at L∞ distance >= 2 from the cluster, hence neither a
 *     cluster site nor a perimeter site (a perimeter site is a nearest
 *     neighbour of a cluster site: L∞ distance 1), so the walk cannot stop
 *     before the boundary and the jump samples the lattice walk's own law;
 *     the boundary site is then checked like any other. d is a lower bound
 *     on the distance, the larger of two: capped cell distances (levels
 *     e = 1 … 12, cells of side 2^e; each cell stores the Chebyshev
 *     distance in cells, capped at 8, to the nearest cell holding a
 *     cluster site; a cell distance c proves an L∞ distance of at least
 *     (c − 1)·2^e plus the walker's distance to its cell's edge, derived in
 *     worker/lattice/lattice-walk.ts), and the radial bound
 *     (|w| − R_max)/√2. Triangular lattice: when no cluster site lies within
 *     hex distance L = 2^e (e >= 1, up to 64) of the walker, it jumps to the
 *     exit site of that hexagon (worker/lattice/hexagon-exit-tables.ts); L
 *     is the largest power of two allowed by multi-level occupancy marks
 *     (level e: cells of side 2^e in lattice coordinates; a cell is marked
 *     when a cluster site lies in the 3 × 3 block of cells around it, so an
 *     unmarked cell proves an L∞ distance — and so a hex distance — of at
 *     least 2^e + 1) and by the radial bound |w| − R_max.
 *  4. Near the cluster (no level unmarked): single steps; at each site the
 *     nearest neighbours are looked up and a perimeter site stops the walker.
 * Everything but 1 and 2 samples the lattice walk exactly.
 *
 * Storage is sparse (8 × 8 tiles, worker/index/tiled-grids.ts): cluster
 * sites, hit counts (m > 1) and the cell distances (square) or marks
 * (triangular) of every level, written only within 7 (1) cells of a cell
 * holding a site; memory grows with the number of particles, not with the
 * area of the bounding box.
 *
 * Determinism and checkpoints: Random.forRun(ensembleSeed, runIndex,
 * STREAM_GROWTH), consumed in a fixed order. A checkpoint holds positions
 * and, for m > 1, the hit counts of the perimeter sites (modelState: int32
 * triples i, j, hits in the order the sites were first hit).
 *
 * Observables at each record size: R_g, R_max, the centre offset and the
 * planar anisotropy measures (worker/core/anisotropy.ts; k = 4 is the
 * square lattice's fold, k = 6 the triangular one's).
 */
import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import { STOP_CHECK_EVERY, stopRaised, type StopSignal } from '../../core/stop-signal.js';
import { TiledInt32Grid } from '../../index/tiled-grids.js';
import { LatticeWalk } from '../../lattice/lattice-walk.js';
import { type PlanarLattice, planeOf, siteOf, toPlane, toSite } from '../../lattice/planar-lattice.js';

export interface DlaLatticeCounters extends Counters {
  walkers: number;
  jumps: number;
  steps: number;
  returns: number;
}

export class DlaLatticeKernel implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: DlaLatticeCounters;
  private readonly lattice: PlanarLattice;
  /** The walker, the cluster sites and the occupancy marks (worker/lattice/lattice-walk.ts). */
  private readonly walker: LatticeWalk;
  private readonly hitsToJoin: number;
  private readonly launchMargin: number;
  private readonly cluster: PlanarCluster;
  /** Hits of perimeter sites (m > 1 only). */
  private readonly hits: TiledInt32Grid;
  /** Sites hit at least once and not yet joined, in first-hit order (for checkpoints). */
  private hitOrder: number[] = [];
  private readonly rng: Random;
  /** Generator state at the start of the walker being walked (restored when a stop interrupts it). */
  private readonly walkerStart = new Uint32Array(4);

  constructor(lattice: PlanarLattice, task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    this.lattice = lattice;
    this.hitsToJoin = task.model.params.noise_reduction;
    this.launchMargin = task.model.params.launch_margin;
    const expect = Math.max(16, task.particles >> 4);
    this.walker = new LatticeWalk(lattice, task.particles);
    this.hits = new TiledInt32Grid(0, this.hitsToJoin > 1 ? expect : 4);
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, count: number, rMax: number): void => recordPlanarAnisotropy(extra, coords, 2, count, rMax);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { walkers: 0, jumps: 0, steps: 0, returns: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.occupy(0, 0);
      this.cluster.place(0, 0);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      this.rng = Random.fromState(checkpoint.rngState);
      const c = checkpoint.counters;
      this.counters = { walkers: c.walkers ?? 0, jumps: c.jumps ?? 0, steps: c.steps ?? 0, returns: c.returns ?? 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra, checkpoint.series);
      const p = checkpoint.positions;
      for (let k = 0; k < checkpoint.count; k++) {
        toSite(lattice, p[2 * k], p[2 * k + 1]);
        const i = siteOf.i;
        const j = siteOf.j;
        toPlane(lattice, i, j);
        if (planeOf.x !== p[2 * k] || planeOf.y !== p[2 * k + 1]) throw new RangeError(`checkpoint position ${k} is not a lattice site`);
        if (k > 0 && !this.isPerimeter(i, j)) throw new RangeError(`checkpoint position ${k} is not a perimeter site of the cluster before it`);
        this.occupy(i, j);
        this.cluster.append(planeOf.x, planeOf.y);
      }
      this.cluster.resumeRecords();
      this.restoreHits(checkpoint.modelState);
    }
  }

  get count(): number {
    return this.cluster.n;
  }

  get done(): boolean {
    return this.cluster.n >= this.task.particles;
  }

  growTo(target: number, stop?: StopSignal): void {
    const goal = Math.min(target, this.task.particles);
    while (this.cluster.n < goal) if (!this.addParticle(stop)) return;
  }

  /**
   * Launch walkers until a perimeter site reaches m hits, and add it; false
   * when the stop signal interrupted a walker. The state is then the one
   * after the last whole walker (its hits kept, as a checkpoint keeps them),
   * so a resume continues with the same draws.
   */
  private addParticle(stop: StopSignal | undefined): boolean {
    const m = this.hitsToJoin;
    for (;;) {
      if (!this.walk(stop)) return false;
      const i = walkerAt.i;
      const j = walkerAt.j;
      if (m > 1) {
        const h = this.hits.get(i, j) + 1;
        if (h < m) {
          if (h === 1) this.hitOrder.push(i, j);
          this.hits.set(i, j, h);
          continue;
        }
        // joined: its count goes back to 0 (hitOrder keeps the entry; checkpoints skip sites without hits)
        this.hits.set(i, j, 0);
      }
      this.occupy(i, j);
      toPlane(this.lattice, i, j);
      this.cluster.place(planeOf.x, planeOf.y);
      return true;
    }
  }

  /**
   * Run one walker from the launch circle to its first perimeter site (left
   * in walkerAt); false, with the generator put back to where the walker
   * began and no counter changed, when the stop signal is raised.
   */
  private walk(stop: StopSignal | undefined): boolean {
    const w = this.walker;
    this.rng.saveState(this.walkerStart);
    if (!w.walk(this.rng, this.cluster.rMax, this.launchMargin, stop)) {
      this.rng.loadState(this.walkerStart);
      return false;
    }
    walkerAt.i = w.atI;
    walkerAt.j = w.atJ;
    this.counters.walkers++;
    this.counters.jumps += w.jumps;
    this.counters.steps += w.steps;
    this.counters.returns += w.returns;
    return true;
  }

  private isPerimeter(x: number, y: number): boolean {
    return this.walker.isPerimeter(x, y);
  }

  private occupy(x: number, y: number): void {
    this.walker.occupy(x, y);
  }

  private restoreHits(state: Uint8Array): void {
    if (state.length % 12 !== 0) throw new RangeError(`checkpoint modelState of ${this.task.model.kind} must be int32 triples, got ${state.length} bytes`);
    const v = new DataView(state.buffer, state.byteOffset, state.byteLength);
    for (let o = 0; o < state.length; o += 12) {
      const i = v.getInt32(o, true);
      const j = v.getInt32(o + 4, true);
      const h = v.getInt32(o + 8, true);
      if (!(h >= 1 && h < this.hitsToJoin) || !this.isPerimeter(i, j)) throw new RangeError(`checkpoint modelState: hits ${h} at (${i}, ${j}) are not possible for ${this.task.model.kind}`);
      this.hits.set(i, j, h);
      this.hitOrder.push(i, j);
    }
  }

  /** Pending hits as int32 triples (i, j, hits), in first-hit order, skipping sites that have joined. */
  private hitState(): Uint8Array {
    const pending: number[] = [];
    for (let t = 0; t < this.hitOrder.length; t += 2) {
      const i = this.hitOrder[t];
      const j = this.hitOrder[t + 1];
      const h = this.hits.get(i, j);
      if (h > 0) pending.push(i, j, h);
    }
    const out = new Uint8Array(4 * pending.length);
    const v = new DataView(out.buffer);
    for (let t = 0; t < pending.length; t++) v.setInt32(4 * t, pending[t], true);
    return out;
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  /** Bytes held by the site grid, the hit counts and the marks (for benchmarks). */
  get storageBytes(): number {
    return this.walker.bytes + this.hits.bytes;
  }

  checkpoint(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { ...this.counters }, this.hitState());
  }

  checkpointView(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { ...this.counters }, this.hitState(), true);
  }

  result(): GrowthResult {
    return this.cluster.result(this.task, { ...this.counters }, this.stateHash());
  }

  /** Digest of positions, generator state, count, counters and pending hits. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.walkers).integer(this.counters.jumps).integer(this.counters.steps).integer(this.counters.returns);
    const pending = this.hitState();
    h.integer(pending.length);
    for (const b of pending) h.word(b);
    return h.digest();
  }
}

/** Where the last walker stopped. */
const walkerAt = { i: 0, j: 0 };
