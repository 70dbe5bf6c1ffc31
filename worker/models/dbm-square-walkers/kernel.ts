/**
 * The dielectric breakdown model on the square lattice in the limit of the
 * far boundary at infinity, sampled exactly by lattice random walkers
 * (no potential is solved). Parameter η (eta): 0, or 1 <= η <= 6.
 *
 * The model (exact definition)
 *  - Sites (i, j) of the square lattice, spacing 1, site (i, j) at (i, j) in
 *    the plane; nearest neighbours (±1, 0), (0, ±1). The cluster starts as
 *    the seed site (0, 0). The perimeter is the set of empty sites with at
 *    least one cluster site among their nearest neighbours; n_c(s) (1 … 4)
 *    is the number of cluster neighbours of perimeter site s.
 *  - u is the Green's function of the simple random walk with pole at
 *    infinity for the cluster A: u = 0 on A, u is discrete-harmonic
 *    (u(s) = mean of its four neighbours) at every empty site, and
 *    u(x) ~ (2/π) ln|x| far away. Equivalently u(s) = Σ_z a(s − z) H(z) − κ
 *    (a the potential kernel, H the harmonic measure of A from infinity, κ
 *    the value of the sum on A; Lawler & Limic 2010, Random Walk: A Modern
 *    Introduction, ch. 6, from memory). u = 0 in enclosed holes.
 *  - Growth: a perimeter site s joins with probability u(s)^η / Σ u^η over
 *    the perimeter (sites with u = 0 never join when η > 0). With 0^0 = 1,
 *    η = 0 chooses every perimeter site with the same probability (the Eden
 *    model on perimeter sites).
 *  - This is dbm-square (worker/models/dbm-square/kernel.ts: φ solved with
 *    φ = 1 on a circle of radius R_far) in its limit R_far → ∞, the limit
 *    that kernel's header calls the model of interest: φ·(2/π) ln R_far → u
 *    at every fixed site, so φ^η / Σ φ^η → u^η / Σ u^η.
 *
 * The sampler (exact, derived here)
 *  1. Walkers. A walker is the walk of dla-square (worker/lattice/lattice-walk.ts,
 *     walkToCluster): simple random walk from the launch circle, exact jumps
 *     by the tabulated exit law of free squares (worker/lattice/square-exit-tables.ts),
 *     exact Poisson return of far walkers, but it does not stop at the first
 *     perimeter site: it walks on until it steps onto a cluster site. The
 *     walk from infinity killed on A steps from s onto cluster neighbour z
 *     with probability G(s)/4, where G(s) is the expected number of visits
 *     to s before the kill, and G = c·u (harmonic off A, 0 on A, with the
 *     same logarithmic growth up to the factor c): each bond (s, z) is
 *     entered with probability u(s)/Z, Z = Σ_s n_c(s) u(s), and the walker
 *     stands on s just before entering with probability
 *       h(s) = n_c(s) u(s) / Z.
 *  2. One attempt (for η >= 1; η − 1 = m + f, m an integer, 0 <= f < 1):
 *     a) proposal: one walker; let s be the site it stood on before entering
 *        (probability h(s));
 *     b) a coin with success probability n_c(s)^−η (<= 1, since n_c >= 1;
 *        no draw when n_c(s) = 1);
 *     c) m more walkers, each of which must enter from the same site s
 *        (probability h(s)^m);
 *     d) if f > 0, a Bernoulli factory for h(s)^f, as in
 *        worker/models/dbm-offlattice-2d/kernel.ts: draw v uniform in
 *        [0, 1); with S_1 = 1, S_(k+1) = S_k (k − f)/k, for k = 1, 2, …:
 *        fail when v >= S_k, otherwise release walker k and succeed when it
 *        enters from s. With P(K >= k) = S_k, P(K = k) = f(1 − f)…(k − 1 − f)/k!
 *        are the coefficients of 1 − (1 − x)^f = Σ_k P(K = k) x^k, so the
 *        success probability 1 − E[(1 − h(s))^K] is exactly h(s)^f.
 *     Each of b), c), d) is a probability <= 1, and they are independent
 *     given s, so an attempt accepts s with probability
 *       h(s) · n_c(s)^−η · h(s)^m · h(s)^f = h(s)^η n_c(s)^−η = (u(s)/Z)^η.
 *     Every failed attempt is followed by a fresh one (independent
 *     walkers), so the joined site is s with probability
 *       (u(s)/Z)^η / Σ_t (u(t)/Z)^η = u(s)^η / Σ_t u(t)^η:
 *     the model's law, for every η >= 1. (The coin is taken before the extra
 *     walkers, which saves walkers and changes no probability.) The success
 *     probability of an attempt is Σ_s (u(s)/Z)^η, so the mean number of
 *     attempts per particle is its inverse; the coin's largest value is 1
 *     (at n_c = 1), so no constant factor could raise it.
 *     Bond instead of site matching (each extra walker through the proposal's
 *     bond, probability u/Z, and a coin 1/n_c) gives the same acceptance
 *     (u/Z)^(η−1)/n_c · h and is not used.
 *  3. η = 0: one perimeter site uniformly (one nextBelow draw over the
 *     perimeter list, in the list order of worker/lattice/perimeter-sites.ts):
 *     the same draws and sites as dbm-square at η = 0.
 *  4. 0 < η < 1 is refused: h(s)^(η−1) has exponent < 0, which no finite
 *     number of walkers turns into a probability without a cap (the
 *     off-lattice model's capped recurrence estimator is an approximation).
 * Approximations: only those of the dla-square walk, launch (A) and return
 * (B) (worker/models/dla-lattice/dla-lattice-kernel.ts, measured there); the
 * jumps are exact. test/dbm-square-walkers.test.ts compares the selection
 * frequencies on small fixed clusters with u^η/Σu^η for η = 1, 1.5 and 2.
 *
 * Storage: the walker's sparse site tiles and marks (worker/lattice/lattice-walk.ts)
 * and the perimeter list (worker/lattice/perimeter-sites.ts); nothing grows
 * with the area.
 *
 * Determinism and checkpoints: Random.forRun(ensembleSeed, runIndex,
 * STREAM_GROWTH), consumed in a fixed order. A stop abandons the particle
 * being built (all its attempts), puts the generator back to where that
 * particle began and leaves the state after the last whole particle. A
 * checkpoint holds positions, generator state, counters and records
 * (modelState is empty); resuming replays the arrivals.
 *
 * Counters: walkers (every walker released), attempts (proposal walkers),
 * jumps, steps, returns (the walk's moves) and perimeter_sites. No
 * per-particle work ceiling: a lattice walk always moves, and at large η a
 * particle may legitimately need very many attempts (the stop signal still
 * ends it).
 */
import type { ClusterPositions, Counters, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthTask } from '../../core/growth-kernel.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { StateHasher } from '../../core/state-hash.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { PlanarCluster } from '../../core/planar-cluster.js';
import type { StopSignal } from '../../core/stop-signal.js';
import { PerimeterSites } from '../../lattice/perimeter-sites.js';
import { LatticeWalk } from '../../lattice/lattice-walk.js';
import { SQUARE } from '../../lattice/planar-lattice.js';
import { replayCheckpointSites } from '../../lattice/checkpoint-site-replay.js';

export interface DbmSquareWalkersCounters extends Counters {
  walkers: number;
  attempts: number;
  jumps: number;
  steps: number;
  returns: number;
  perimeter_sites: number;
}

/** The one-line refusal of 0 < η < 1 (null when η is allowed). */
export function etaProblem(eta: number, kind: string): string | null {
  if (eta > 0 && eta < 1) return `params.eta: ${eta} is out of range for ${kind}; allowed: 0, or a number from 1 to 6 (the walker sampler is exact only there; dbm-square takes any η from 0 to 6)`;
  return null;
}

const ACCEPTED = 0;
const REJECTED = 1;
const STOPPED = 2;

export class DbmSquareWalkers implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: DbmSquareWalkersCounters;
  private readonly eta: number;
  /** η − 1 = wholeExtra + fraction (η >= 1). */
  private readonly wholeExtra: number;
  private readonly fraction: number;
  /** coin[n] = n^−η, n = 1 … 4. */
  private readonly coin = new Float64Array(5);
  private readonly launchMargin: number;
  private readonly walker: LatticeWalk;
  private readonly perimeter: PerimeterSites;
  private readonly cluster: PlanarCluster;
  private readonly rng: Random;
  private readonly particleStart = new Uint32Array(4);
  private pendingWalkers = 0;
  private pendingAttempts = 0;
  private pendingJumps = 0;
  private pendingSteps = 0;
  private pendingReturns = 0;
  /** The site the accepted proposal stood on. */
  private chosenI = 0;
  private chosenJ = 0;

  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    this.task = structuredClone(task);
    const p = task.model.params;
    this.eta = p.eta;
    const problem = etaProblem(this.eta, task.model.kind);
    if (problem !== null) throw new RangeError(problem);
    const extra = this.eta >= 1 ? this.eta - 1 : 0;
    this.wholeExtra = Math.floor(extra);
    this.fraction = extra - this.wholeExtra;
    for (let n = 1; n <= 4; n++) this.coin[n] = Math.pow(n, -this.eta);
    this.launchMargin = p.launch_margin;
    this.walker = new LatticeWalk(SQUARE, task.particles);
    this.perimeter = new PerimeterSites(SQUARE, Math.max(16, task.particles >> 5));
    const recordExtra = (extraObs: Record<string, number[]>, coords: Float64Array, count: number, rMax: number): void => recordPlanarAnisotropy(extraObs, coords, 2, count, rMax);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { walkers: 0, attempts: 0, jumps: 0, steps: 0, returns: 0, perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra);
      this.join(0, 0, false);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      const c = checkpoint.counters;
      this.counters = { walkers: c.walkers ?? 0, attempts: c.attempts ?? 0, jumps: c.jumps ?? 0, steps: c.steps ?? 0, returns: c.returns ?? 0, perimeter_sites: 0 };
      this.cluster = new PlanarCluster(task.particles, task.recordsPerDecade, recordExtra, checkpoint.series);
      replayCheckpointSites(SQUARE, checkpoint.positions, checkpoint.count, this.perimeter, (i, j) => this.join(i, j, true));
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

  growTo(target: number, stop?: StopSignal): void {
    const goal = Math.min(target, this.task.particles);
    while (this.cluster.n < goal) {
      if (this.eta === 0) {
        const slot = this.rng.nextBelow(this.perimeter.count);
        this.join(this.perimeter.perimI[slot], this.perimeter.perimJ[slot], false);
      } else if (!this.addParticle(stop)) break;
    }
    this.counters.perimeter_sites = this.perimeter.count;
  }

  /** Attempts until one accepts (header, step 2); false when the stop signal ended it (state as before the particle). */
  private addParticle(stop: StopSignal | undefined): boolean {
    this.rng.saveState(this.particleStart);
    this.pendingWalkers = 0;
    this.pendingAttempts = 0;
    this.pendingJumps = 0;
    this.pendingSteps = 0;
    this.pendingReturns = 0;
    for (;;) {
      const r = this.attempt(stop);
      if (r === STOPPED) {
        this.rng.loadState(this.particleStart);
        return false;
      }
      if (r === ACCEPTED) break;
    }
    const c = this.counters;
    c.walkers += this.pendingWalkers;
    c.attempts += this.pendingAttempts;
    c.jumps += this.pendingJumps;
    c.steps += this.pendingSteps;
    c.returns += this.pendingReturns;
    this.join(this.chosenI, this.chosenJ, false);
    return true;
  }

  /** One attempt: ACCEPTED (site in chosenI/J), REJECTED or STOPPED. */
  private attempt(stop: StopSignal | undefined): number {
    this.pendingAttempts++;
    if (!this.walk(stop)) return STOPPED;
    const w = this.walker;
    const si = w.atI;
    const sj = w.atJ;
    const nc = this.clusterNeighbours(si, sj);
    if (nc > 1 && this.rng.nextDouble() >= this.coin[nc]) return REJECTED;
    for (let m = 0; m < this.wholeExtra; m++) {
      if (!this.walk(stop)) return STOPPED;
      if (w.atI !== si || w.atJ !== sj) return REJECTED;
    }
    const f = this.fraction;
    if (f > 0) {
      const v = this.rng.nextDouble();
      let survive = 1;
      for (let k = 1; ; k++) {
        if (v >= survive) return REJECTED;
        if (!this.walk(stop)) return STOPPED;
        if (w.atI === si && w.atJ === sj) break;
        survive *= (k - f) / k;
      }
    }
    this.chosenI = si;
    this.chosenJ = sj;
    return ACCEPTED;
  }

  /** One walker until it steps onto the cluster (the site before in walker.atI/atJ); false when stopped. */
  private walk(stop: StopSignal | undefined): boolean {
    const w = this.walker;
    if (!w.walkToCluster(this.rng, this.cluster.rMax, this.launchMargin, stop)) return false;
    this.pendingWalkers++;
    this.pendingJumps += w.jumps;
    this.pendingSteps += w.steps;
    this.pendingReturns += w.returns;
    return true;
  }

  /** n_c: cluster sites among the four nearest neighbours of (i, j). */
  private clusterNeighbours(i: number, j: number): number {
    const w = this.walker;
    return (w.isSite(i + 1, j) ? 1 : 0) + (w.isSite(i - 1, j) ? 1 : 0) + (w.isSite(i, j + 1) ? 1 : 0) + (w.isSite(i, j - 1) ? 1 : 0);
  }

  private join(i: number, j: number, replay: boolean): void {
    const v = this.perimeter.valueAt(i, j);
    if (v > 0) this.perimeter.removeSlot(v - 1);
    this.perimeter.occupy(i, j);
    this.walker.occupy(i, j);
    if (replay) this.cluster.append(i, j);
    else this.cluster.place(i, j);
  }

  /** The perimeter sites in slot order (for tests). */
  perimeterSites(): Array<[number, number]> {
    const out: Array<[number, number]> = [];
    const { count, perimI, perimJ } = this.perimeter;
    for (let s = 0; s < count; s++) out.push([perimI[s], perimJ[s]]);
    return out;
  }

  positions(): ClusterPositions {
    return this.cluster.positions();
  }

  /** Bytes held by the walker's site tiles and marks and the perimeter list (for benchmarks). */
  get storageBytes(): number {
    return this.walker.bytes + this.perimeter.bytes;
  }

  private countersNow(): Record<string, number> {
    return { ...this.counters, perimeter_sites: this.perimeter.count };
  }

  checkpoint(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), this.countersNow(), new Uint8Array(0));
  }

  checkpointView(): GrowthCheckpoint {
    return this.cluster.checkpoint(this.task, this.rng.state(), this.countersNow(), new Uint8Array(0), true);
  }

  result(): GrowthResult {
    return this.cluster.result(this.task, this.countersNow(), this.stateHash());
  }

  /** Digest of positions, generator state and counters. */
  stateHash(): string {
    const h = new StateHasher();
    this.cluster.hashPositions(h);
    for (const x of this.rng.state()) h.word(x);
    const c = this.counters;
    h.integer(c.walkers).integer(c.attempts).integer(c.jumps).integer(c.steps).integer(c.returns).integer(this.perimeter.count);
    return h.digest();
  }
}
