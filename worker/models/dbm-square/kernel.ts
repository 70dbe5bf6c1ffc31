/**
 * The dielectric breakdown model on the square lattice with the Laplace
 * potential (Niemeyer, Pietronero & Wiesmann 1984, Phys. Rev. Lett. 52,
 * 1033), parameter η (eta), 0 <= η <= 6.
 *
 * The model (exact definition)
 *  - Sites (i, j) of the square lattice, spacing 1, site (i, j) at (i, j) in
 *    the plane; nearest neighbours (±1, 0), (0, ±1). The cluster starts as
 *    the seed site (0, 0).
 *  - Perimeter (site convention): the empty sites that are nearest
 *    neighbours of at least one cluster site. Each counts once, however
 *    many cluster neighbours it has.
 *  - Potential: φ solves the discrete Laplace equation
 *      φ(s) = (φ(s + e1) + φ(s − e1) + φ(s + e2) + φ(s − e2)) / 4
 *    at every empty site s with |s| < R_far, with φ = 0 on the cluster and
 *    φ = 1 on every site with |s| >= R_far (the far boundary, a lattice
 *    circle centred on the seed), where
 *      R_far = max(c · R_max, R_max + k),
 *    R_max the largest distance of a cluster site from the seed before the
 *    step, c = far_factor, k = far_margin.
 *  - Growth: one perimeter site s is chosen with probability
 *    φ(s)^η / Σ_perimeter φ^η and joins the cluster; then the potential is
 *    solved again. With 0^0 = 1, η = 0 chooses every perimeter site with the
 *    same probability: the Eden model on perimeter sites (eden-square). For
 *    η > 0, sites in enclosed holes (φ = 0 exactly) never grow.
 *  - η = 1 and random walks: a walk from far away, killed when it steps
 *    onto the cluster, enters it through the bond (s, z) (s a perimeter
 *    site, z a cluster neighbour) with probability φ(s)/4 per bond (up to
 *    the normalisation, in the limit R_far → ∞), so φ(s) is the entry
 *    probability through any one bond of s. The limit of φ is, up to a
 *    factor, the Green's function of the lattice walk with pole at infinity,
 *    u(s) = Σ_z a(s − z) H(z) − κ (a the potential kernel, H the harmonic
 *    measure of the cluster from infinity, κ its value on the cluster;
 *    Lawler & Limic 2010, Random Walk: A Modern Introduction, ch. 6, from
 *    memory): test/dbm-square.test.ts checks the growth probabilities
 *    against u(s) / Σ u. This is not dla-square's law (there a walker stops
 *    at the first perimeter site it visits); a bond convention (weight per
 *    (cluster site, perimeter site) pair) would be another model, not
 *    offered here.
 *
 * How it is simulated (approximations, each with its parameter and test)
 *  A. Far boundary at R_far (params far_factor c, far_margin k): the model
 *     with R_far → ∞ is the limit of interest (sampled exactly, with no
 *     grid, by walkers in worker/models/dbm-square-walkers); at finite R_far
 *     the growth probabilities differ from it. Measured effect: test/dbm-square.test.ts
 *     compares them on small fixed clusters with the exact limit above
 *     (numbers in the README, "The lattice dielectric breakdown model").
 *  B. Solver tolerance (param tolerance): the potential is solved by
 *     SSOR-preconditioned conjugate gradients warm-started from the previous particle's
 *     potential (worker/models/dbm-square/potential-grid.ts) until the
 *     largest residual of the averaged equation is at most the tolerance.
 *     Measured effect: test/dbm-square.test.ts compares the growth
 *     probabilities with a solve to 1e-13.
 *  Enclosed holes get their exact φ = 0 (worker/models/dbm-square/enclosed-regions.ts).
 *  At η = 0 no potential is needed and none is solved.
 *
 * Storage: the cluster and perimeter list in sparse 8 × 8 tiles
 * (worker/lattice/perimeter-sites.ts, shared with the Eden kernel); the potential on a
 * box grid of half-width floor(R_far) + 2 or more, grown with the cluster
 * (its area follows R_far², not the largest allowed size; a box above
 * MAX_GRID_SITES is refused with one line).
 *
 * Determinism and checkpoints: one nextDouble() per particle from
 * Random.forRun(ensembleSeed, runIndex, STREAM_GROWTH), compared with the
 * running sum of the weights in perimeter-list order (a function of the
 * arrival order alone, as in the Eden kernel). The potential depends on the
 * whole history of warm starts, so a checkpoint keeps it: modelState holds
 * (little-endian float64) R_far of the last solve, the number of unknowns,
 * and φ at the unknowns in row-major order. Resuming replays the arrivals
 * (cluster, perimeter, holes, the same sequence of R_far and box sizes) and
 * puts φ back, so the run continues to the same bits. The stop signal is
 * read once per solver iteration; a stopped solve leaves φ untouched.
 *
 * Counters: solver_iterations (conjugate-gradient iterations, all particles)
 * and perimeter_sites. Observables: R_g, R_max, the centre offset and the
 * planar anisotropy measures (worker/core/anisotropy.ts, fold 4).
 */
import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import type { StopSignal } from '../../core/stop-signal.js';
import { PerimeterSites } from '../../lattice/perimeter-sites.js';
import { SQUARE } from '../../lattice/planar-lattice.js';
import { replayCheckpointSites } from '../../lattice/checkpoint-site-replay.js';
import { CLUSTER, PotentialGrid } from './potential-grid.js';
import { EnclosedRegions } from './enclosed-regions.js';

export class DbmSquare implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: Counters;
  private readonly eta: number;
  private readonly farFactor: number;
  private readonly farMargin: number;
  private readonly tolerance: number;
  private readonly cluster: PlanarCluster;
  private readonly perimeter: PerimeterSites;
  /** The potential (η > 0 only). */
  readonly grid: PotentialGrid | null;
  private readonly enclosed = new EnclosedRegions();
  private readonly rng: Random;

  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    const p = task.model.params;
    this.eta = p.eta;
    this.farFactor = p.far_factor;
    this.farMargin = p.far_margin;
    this.tolerance = p.tolerance;
    this.perimeter = new PerimeterSites(SQUARE, Math.max(16, task.particles >> 5));
    this.grid = this.eta > 0 ? new PotentialGrid(Math.ceil(this.farMargin) + 2) : null;
    const recordExtra = (extra: Record<string, number[]>, coords: Float64Array, count: number, rMax: number): void => recordPlanarAnisotropy(extra, coords, 2, count, rMax);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { solver_iterations: 0, perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.join(0, 0);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      this.rng = Random.fromState(checkpoint.rngState);
      this.counters = { solver_iterations: checkpoint.counters.solver_iterations ?? 0, perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra, checkpoint.series);
      replayCheckpointSites(SQUARE, checkpoint.positions, checkpoint.count, this.perimeter, (i, j, k) => {
        if (k > 0) this.prepareBoundary();
        this.join(i, j, true);
      });
      this.cluster.resumeRecords();
      this.restorePotential(checkpoint.modelState);
    }
    this.counters.perimeter_sites = this.perimeter.count;
  }

  get count(): number {
    return this.cluster.n;
  }

  get done(): boolean {
    return this.cluster.n >= this.task.particles;
  }

  /** R_far for the current cluster. */
  farRadius(): number {
    const r = this.cluster.rMax;
    return Math.max(this.farFactor * r, r + this.farMargin);
  }

  growTo(target: number, stop?: StopSignal): void {
    const goal = Math.min(target, this.task.particles);
    while (this.cluster.n < goal) {
      let slot: number;
      if (this.grid === null) slot = this.rng.nextBelow(this.perimeter.count);
      else {
        this.prepareBoundary();
        if (!this.grid.solve(this.tolerance, stop)) break;
        this.counters.solver_iterations += this.grid.iterations;
        slot = this.chooseSlot();
      }
      const i = this.perimeter.perimI[slot];
      const j = this.perimeter.perimJ[slot];
      this.join(i, j);
    }
    this.counters.perimeter_sites = this.perimeter.count;
  }

  /** Move the far boundary out to R_far of the current cluster (the box grows with it). */
  private prepareBoundary(): void {
    const grid = this.grid;
    if (grid === null) return;
    const rf = this.farRadius();
    if (rf > grid.radius) grid.setRadius(rf);
  }

  /** A perimeter slot with probability φ^η / Σ φ^η (one nextDouble). */
  private chooseSlot(): number {
    const weights = this.weights();
    const total = weights.total;
    if (!(total > 0)) throw new RangeError('dbm-square: every perimeter site has potential 0 (the solve failed)');
    const u = this.rng.nextDouble() * total;
    const w = weights.w;
    let sum = 0;
    let last = -1;
    for (let s = 0; s < this.perimeter.count; s++) {
      const v = w[s];
      if (v <= 0) continue;
      sum += v;
      last = s;
      if (u < sum) return s;
    }
    return last;
  }

  private weightBuffer = new Float64Array(1024);

  /** φ^η of every perimeter slot (0 where φ <= 0) and their sum, in slot order. */
  weights(): { w: Float64Array; total: number } {
    const grid = this.grid!;
    const { count, perimI, perimJ } = this.perimeter;
    if (this.weightBuffer.length < count) this.weightBuffer = new Float64Array(2 * count);
    const w = this.weightBuffer;
    const { phi, half, side } = grid;
    const eta = this.eta;
    let total = 0;
    for (let s = 0; s < count; s++) {
      const f = phi[(perimJ[s] + half) * side + (perimI[s] + half)];
      const v = f > 0 ? (eta === 1 ? f : eta === 2 ? f * f : Math.pow(f, eta)) : 0;
      w[s] = v;
      total += v;
    }
    return { w, total };
  }

  /** The perimeter sites in slot order (for tests). */
  perimeterSites(): Array<[number, number]> {
    const out: Array<[number, number]> = [];
    const { count, perimI, perimJ } = this.perimeter;
    for (let s = 0; s < count; s++) out.push([perimI[s], perimJ[s]]);
    return out;
  }

  /**
   * The growth probability of every perimeter site (slot order) for the
   * current cluster, after solving the potential (for tests and the far-boundary measurement).
   */
  growthProbabilities(): Float64Array {
    const n = this.perimeter.count;
    if (this.grid === null) return new Float64Array(n).fill(1 / n);
    this.prepareBoundary();
    this.grid.solve(this.tolerance);
    const { w, total } = this.weights();
    const out = new Float64Array(n);
    for (let s = 0; s < n; s++) out[s] = w[s] / total;
    return out;
  }

  /** Add (i, j) to the cluster: perimeter list, potential grid, holes, records. */
  private join(i: number, j: number, replay = false): void {
    const v = this.perimeter.valueAt(i, j);
    if (v > 0) this.perimeter.removeSlot(v - 1);
    this.perimeter.occupy(i, j);
    if (replay) this.cluster.append(i, j);
    else this.cluster.place(i, j);
    if (this.grid !== null) {
      this.grid.block(i, j, CLUSTER);
      this.enclosed.afterJoin(this.grid, i, j, this.cluster.rMax);
    }
  }

  /** modelState: float64 LE R_far, number of unknowns, φ at the unknowns (empty for η = 0). */
  private potentialState(): Uint8Array {
    if (this.grid === null) return new Uint8Array(0);
    const values = this.grid.unknownValues();
    const out = new Uint8Array(8 * (2 + values.length));
    const v = new DataView(out.buffer);
    v.setFloat64(0, this.grid.radius, true);
    v.setFloat64(8, values.length, true);
    for (let k = 0; k < values.length; k++) v.setFloat64(16 + 8 * k, values[k], true);
    return out;
  }

  private restorePotential(state: Uint8Array): void {
    if (this.grid === null) {
      if (state.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${this.task.model.kind} at eta = 0, got ${state.length} bytes`);
      return;
    }
    if (state.length < 16 || state.length % 8 !== 0) throw new RangeError(`checkpoint modelState of ${this.task.model.kind} must be float64 values (R_far, count, potential), got ${state.length} bytes`);
    const v = new DataView(state.buffer, state.byteOffset, state.byteLength);
    const radius = v.getFloat64(0, true);
    const n = v.getFloat64(8, true);
    // a checkpoint taken while a solve was stopped holds the boundary already moved out for the next particle
    if (radius !== this.grid.radius) this.prepareBoundary();
    if (radius !== this.grid.radius) throw new RangeError(`checkpoint modelState: far boundary radius ${radius} does not match the cluster's ${this.grid.radius}`);
    if (n !== state.length / 8 - 2) throw new RangeError(`checkpoint modelState: ${n} potential values announced, ${state.length / 8 - 2} present`);
    const values = new Float64Array(n);
    for (let k = 0; k < n; k++) values[k] = v.getFloat64(16 + 8 * k, true);
    this.grid.restoreUnknownValues(values);
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  /** Bytes held by the site tiles, the perimeter list and the potential grid (for benchmarks). */
  get storageBytes(): number {
    return this.perimeter.bytes + (this.grid?.bytes ?? 0);
  }

  /** Sites found enclosed so far (φ = 0 exactly). */
  get holeSites(): number {
    return this.enclosed.holeSites;
  }

  checkpoint(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), { solver_iterations: this.counters.solver_iterations, perimeter_sites: this.perimeter.count }, this.potentialState());
  }

  result(): GrowthResult {
    return this.cluster.result(this.task, { solver_iterations: this.counters.solver_iterations, perimeter_sites: this.perimeter.count }, this.stateHash());
  }

  /** Digest of positions, generator state, counters, holes and the potential at the unknowns. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.perimeter.count).integer(this.counters.solver_iterations).integer(this.enclosed.holeSites);
    if (this.grid !== null) {
      const values = this.grid.unknownValues();
      h.integer(values.length).float64Array(values, values.length);
    }
    return h.digest();
  }
}
