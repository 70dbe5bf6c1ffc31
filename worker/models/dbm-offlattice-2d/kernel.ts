/**
 * Off-lattice dielectric breakdown model DBM(η) in the plane.
 *
 * The model (exact definition)
 *  - Particles are disks of diameter 1. The cluster starts as one seed disk
 *    centred at the origin.
 *  - Harmonic measure of a particle: ω_i is the probability that planar
 *    Brownian motion of a new disk's centre, started from infinity, first
 *    comes within distance 1 of a cluster centre at centre i (the disk first
 *    touches particle i). Σ_i ω_i = 1; ω_i = 0 for a particle no walker can
 *    reach first.
 *  - Particles are added one at a time. The next particle grows on particle i
 *    with probability ω_i^η / Σ_j ω_j^η (the sum over the particles with
 *    ω_j > 0; 0^η = 0 also for η = 0, see below), and the new disk is placed
 *    at a contact point on i drawn from the harmonic measure restricted to i:
 *    the first-touch point of a Brownian walker from infinity conditioned on
 *    touching particle i first.
 *  - η = 1 is exactly off-lattice DLA (worker/models/dla-offlattice-2d):
 *    choosing i with probability ω_i and then the contact point from the
 *    measure restricted to i is the first-touch law of one walker.
 *  - η = 0: ω^0 = 1 for every particle with ω > 0, so the next particle grows
 *    with equal probability on every particle a walker from infinity can
 *    touch first (every exposed particle; completely screened ones, ω = 0,
 *    never grow), at a point of that particle drawn from the harmonic
 *    measure restricted to it. It is Eden-like growth on the exposed surface,
 *    not the Eden model of worker/models/eden-offlattice-2d (whose growth
 *    sites and contact law differ).
 *
 * How it is simulated. One walker is the growth walk of off-lattice DLA,
 * worker/walkers/planar-growth-walk.ts, shared with that model (launch circle, exact Poisson return, walk-on-spheres on the occupancy
 * index, straight final steps of min_step with the exact contact: see the
 * header of worker/models/dla-offlattice-2d/kernel.ts); it returns the
 * particle i it touched first (an exact sample of ω) and its contact point
 * (an exact sample of the measure restricted to i, given i). Walkers are
 * independent. A particle is added by repeated attempts; an attempt is:
 *  1. Proposal: one walker; it touches particle i (probability ω_i).
 *  2. η = 1: accept i always (this path consumes the random stream exactly
 *     as dla-offlattice-2d does, so η = 1 gives its state hashes).
 *  3. η > 1 with params.method = 0 (the exact method), η − 1 = m + f
 *     (m integer, 0 <= f < 1):
 *     a) m more walkers; the attempt fails unless every one touches i
 *        (probability ω_i^m);
 *     b) if f > 0, a Bernoulli factory for ω_i^f: draw u uniform in [0, 1);
 *        with S_1 = 1 and S_(k+1) = S_k (k − f)/k, for k = 1, 2, …: stop
 *        (attempt fails) when u >= S_k, otherwise release walker k and
 *        succeed when it touches i. With K the number with P(K >= k) = S_k
 *        this succeeds when some of K independent walkers touches i, with
 *        probability Σ_k P(K = k)(1 − (1 − ω_i)^k) = 1 − E[(1 − ω_i)^K].
 *        P(K = k) = S_k f/k = f(1 − f)(2 − f)…(k − 1 − f)/k! are the
 *        coefficients of the binomial series 1 − (1 − x)^f = Σ_k P(K = k) x^k,
 *        so E[x^K] = 1 − (1 − x)^f and at x = 1 − ω_i the probability is
 *        exactly ω_i^f. Its cost, E[min(K, G)] ≈ ω_i^(f−1) walkers, is finite.
 *     Accepted, the particle goes at the contact point of the last walker that
 *     touched i. Every attempt accepts i with probability ω_i · ω_i^m · ω_i^f
 *     = ω_i^η, so the accepted particle is i with probability ω_i^η / Σ ω^η:
 *     exact for every η >= 1. For integer η this is "η walkers in a row touch
 *     the same particle". The contact point is an exact sample of the
 *     measure restricted to i: acceptance depends only on which particle each
 *     walker touched, never on where.
 *  3h. η > 1 with params.method = 1 (the history method, the default):
 *     every walker released is recorded in a hit history (hit-history.ts):
 *     a walker clock t (walkers so far), and per particle the clock of its
 *     birth or last reset and of its last k + 1 hits since then, where
 *     b = η − 1 and k = floor(b) + 1 + params.history_extra_gaps. After the
 *     proposal on i (step 1), the window of i's hits ending at this one spans
 *     g = min(k, hits of i since birth/reset) recurrence gaps (the birth
 *     starts the first gap) and S walkers. If g < g0 = floor(b) + 1 (i is
 *     young), fresh walkers are released (and recorded) until i has g0
 *     hits, so g = g0. The estimate is h_g(S) = Π_{j=g}^{S−1} (1 − b/j)
 *     (recurrence-power.ts). On a frozen cluster the g gaps are independent
 *     geometric with mean 1/ω_i, S is negative binomial, and
 *     E[h_g(S)] = ω_i^b exactly: Σ_s h_g(s) C(s − 1, g − 1) ω^g (1 − ω)^(s−g)
 *     = ω^b follows from the binomial series of (1 − x)^(b − g) (positive
 *     coefficients since g > b), and 0 < h_g <= 1. The attempt accepts i iff
 *     u H < h_g(S), u uniform in [0, 1) drawn before any fresh walker, with
 *     the normaliser H = min(1, params.history_headroom × the mean of h over
 *     recent proposals), a decayed mean over about NORMALISER_MEMORY =
 *     4096 proposals, updated only when a particle is placed (fixed while
 *     one is built). h_g decreases with S, so a young particle's fresh
 *     walkers stop as soon as even a hit at the next walker could not reach
 *     u H (rejected: the same law with fewer walkers). Accepted, the disk
 *     goes at the proposal walker's contact point. When a disk is placed it
 *     is born (no hits) and the particle it grew on forgets its hits (reset).
 *     An attempt then accepts i with probability ω_i E[min(1, h/H)], which
 *     is ω_i^η / H (the same factor for every particle) when nothing below
 *     is at work; the walkers per particle drop from about 1/Σ ω^η to about
 *     H/Σ ω^η plus the fresh walkers of young particles.
 *     THE APPROXIMATIONS (none vanishes at the defaults; the slow test
 *     test/dbm-offlattice-history.slow.test.ts compares the defaults with
 *     the exact method at η = 2, N = 200 and η = 4, N = 50):
 *      (a) stale history: the gaps of a window were recorded while the
 *          cluster was smaller, so h estimates a past ω_i. Resetting the
 *          particle grown on removes the largest change (its ω drops most);
 *          other particles keep windows of up to k gaps. Smaller k (history_
 *          extra_gaps = 0, the default) is less stale. Exact only on a frozen
 *          cluster.
 *      (b) shared history: consecutive attempts reuse the same recorded hits,
 *          so they are not independent, and the first accepted attempt is
 *          not exactly distributed as ω^η/Σ ω^η even on a frozen cluster
 *          (the effect is of order the ω of the particles involved).
 *      (c) cut weights: when h_g(S) > H the acceptance is 1 instead of h/H,
 *          which under-weights particles whose estimate fluctuates above H
 *          (the counter `capped` counts such acceptances). It vanishes as
 *          history_headroom → ∞ (H → 1: no speed-up left). Measured capped
 *          fractions at the default 64: about 1% of particles at η = 2 and
 *          about 14% at η = 4 (test/bench/dbm-bench.ts), so at η = 4 this
 *          bias is not small.
 *      (d) the normaliser H is computed from the same history; any H common
 *          to all particles cancels except through (c).
 *     η = 1 never uses the history (step 2), so its hashes stay those of DLA.
 *  4. 0 <= η < 1, a = 1 − η: the recurrence estimator with cap T
 *     (params.recurrence_cap). Release up to T − 1 more walkers; X is the
 *     index of the first one that touches i, or T when none does (X =
 *     min(G, T) with G geometric of mean 1/ω_i: the recurrence time of hits
 *     on i). With g(1) = 1, g(k + 1) = g(k)(k + a)/k, i.e.
 *     g(k) = Γ(k + a)/(Γ(k) Γ(1 + a)), g(G) is an unbiased estimate of ω_i^(−a)
 *     (Σ_k g(k) ω (1 − ω)^(k−1) = ω^(−a), from the binomial series of
 *     (1 − x)^(−1−a)). Accept i with probability g(X)/g(T) <= 1: draw u
 *     uniform in [0, 1) before the walkers and accept iff u g(T) < g(X).
 *     g(k) increases with k, and after k misses X >= k + 1, so once
 *     g(k + 1) > u g(T) the attempt is accepted whatever the later walkers
 *     do, and they are not released (the same law as releasing them: exact,
 *     derived here; about 1.6 times fewer walkers per particle at η = 0.5).
 *     The particle goes at the proposal walker's contact point.
 *     THE APPROXIMATION: capping G at T. An attempt accepts i with probability
 *     ω_i · E[g(min(G, T))]/g(T) = ω_i^η (1 − ε_i)/g(T), where
 *     ε_i = ω_i^a Σ_(k>=T) (g(k) − g(T)) ω_i (1 − ω_i)^(k−1) lies in [0, 1),
 *     vanishes as T → ∞ and is exponentially small once T ω_i >> 1; the
 *     weights of particles with ω_i ≲ 1/T are too small (→ (T ω_i)^a / Γ(1 + a)
 *     times their exact weight, up to a constant). At η = 0, g(k) = k and the
 *     weight is exactly 1 − (1 − ω_i)^T instead of 1. Larger T is more exact
 *     and costs up to T − 1 walkers per attempt. test/dbm-offlattice-statistics.slow.test.ts
 *     measures selection frequencies on a fixed 25-disk cluster against ω^η
 *     (no bias detected there: every ω_i >> 1/T). On larger clusters the
 *     bias is not small. We measured it (test/bench/dbm-cap-bench.ts) on one η = 0.5 cluster of 2000 disks,
 *     with ω from 3·10^5 walkers; the 430 particles they hit entered, and the
 *     particles never hit, which would add to it, were left out. The total
 *     variation distance between the capped and exact selection laws was
 *     0.22, 0.16, 0.091 and 0.048 for T = 64, 256, 1024 and 4096, falling
 *     about as T^(−a). So with the default T = 1024 about 9% of the growth
 *     probability moves from deep, screened particles to exposed ones, and
 *     more on larger clusters.
 * Everything else is exact up to the DLA walk's own approximation (min_step)
 * and floating-point rounding.
 *
 * Sources. The integer-η rule (η walkers in a row on the same particle) is
 * the published exact method named in tendril issue 13. The Bernoulli factory
 * for ω^f and the capped recurrence estimator are our own constructions from
 * the binomial series above (no source needed beyond it). The recurrence-time
 * estimators of Somfai, Goold, Ball, DeVita & Sander 2004 (Phys. Rev. E 70,
 * 051403) are the published idea behind the history method (estimate the
 * growth weight of a particle from the recurrence times of walker hits on
 * it); the paper's text was not available to us, so h_g, the young-particle
 * completion, the reset and the normaliser are our own constructions,
 * derived above.
 *
 * Counters: walkers (every walker released), attempts (proposal walkers),
 * capped (history method, approximation (c)), and the walk counters of DLA (jumps, short_steps, returns). Walkers per
 * particle = walkers / (particles − 1).
 *
 * Determinism: the random stream is Random.forRun(ensembleSeed, runIndex,
 * STREAM_GROWTH), consumed per particle in a fixed order. A stop abandons the
 * particle being built (all its attempts), restores the generator to where
 * that particle began, and leaves the state after the last whole particle.
 * The history method records its walkers in an undo journal while a
 * particle is built; a stop undoes them too. Checkpoints hold positions,
 * generator state, counters and records, and with the history method the
 * hit history, H and its two decayed sums (modelState; empty otherwise); the
 * index is rebuilt from positions. The state hash covers the same fields as
 * dla-offlattice-2d's (count, positions, generator state, jumps, short_steps,
 * returns), so η = 1 reproduces its hashes, and with the history method also
 * the history and H.
 */

import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthSeries, GrowthTask } from '../../core/growth-kernel.js';
import { ENGINE_VERSION } from '../../core/engine-version.js';
import { OccupancyIndex2d } from '../../index/occupancy-index-2d.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { countCentresWithin, massRadiusRadii, recordSizes } from '../../core/record-sizes.js';
import { StateHasher } from '../../core/state-hash.js';
import { PlanarGrowthWalk, WALK_STOPPED } from '../../walkers/planar-growth-walk.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { recordPlanarAnisotropy } from '../../core/anisotropy.js';
import { MAX_STEPS_PER_PARTICLE, WalkerStuck, type StopSignal } from '../../core/stop-signal.js';
import { HitHistory } from './hit-history.js';
import { RecurrencePower } from './recurrence-power.js';

/** The counters of this model (names as declared by its descriptor). */
export interface OffLatticeDbm2dCounters extends Counters {
  walkers: number;
  attempts: number;
  jumps: number;
  short_steps: number;
  returns: number;
  capped: number;
}

/** History method: the normaliser follows the mean estimate over about this many proposals. */
const NORMALISER_MEMORY = 4096;

/** params.method: 0 the exact method for η > 1, 1 the history method. */
export const METHOD_EXACT = 0;
export const METHOD_HISTORY = 1;

/** A walk interrupted by the stop signal (internal: addParticle turns it into `false`). */
const STOPPED = -1;

/** g(T) = Γ(T + a)/(Γ(T) Γ(1 + a)) by the recurrence of the header (a = 1 − η). */
export function recurrenceWeight(k: number, a: number): number {
  let g = 1;
  for (let j = 1; j < k; j++) g *= (j + a) / j;
  return g;
}

export class OffLatticeDbm2d implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: OffLatticeDbm2dCounters;
  private readonly eta: number;
  /** η − 1 = wholeExtra + fraction for η > 1. */
  private readonly wholeExtra: number;
  private readonly fraction: number;
  /** 1 − η for η < 1, and g(T). */
  private readonly deficit: number;
  private readonly cap: number;
  private readonly capWeight: number;
  /** History method (η > 1 and params.method = 1, the default): the hit history, h_g, the headroom and the normaliser H. */
  private readonly history: HitHistory | null;
  private readonly power: RecurrencePower | null;
  private readonly headroom: number;
  private normaliser = 1;
  /** Decayed sums of the proposals' h_g and of their number (H = min(1, headroom · mean)); this particle's part. */
  private weightSum = 0;
  private weightCount = 0;
  private pendingWeightSum = 0;
  private pendingCapped = 0;
  /** The particle the last accepted attempt grew on. */
  private grownOn = 0;
  private readonly xy: Float64Array;
  private readonly index: OccupancyIndex2d;
  private readonly rng: Random;
  private readonly sizes: number[];
  private readonly series: GrowthSeries;
  private n = 0;
  private rMax = 0;
  private sumX = 0;
  private sumY = 0;
  private sumR2 = 0;
  private nextRecord = 0;
  private readonly particleStart = new Uint32Array(4);
  /** The growth walk of every walker (worker/walkers/planar-growth-walk.ts). */
  private readonly walker: PlanarGrowthWalk;
  /** Work of the particle being built, committed to the counters when it is placed. */
  private pendingJumps = 0;
  private pendingShort = 0;
  private pendingReturns = 0;
  private pendingWalkers = 0;
  private pendingAttempts = 0;
  /** Contact point of the last walk. */
  private hitX = 0;
  private hitY = 0;

  /** The task must have passed the registry's checks (worker/models/registry.ts checkTask). */
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint, limits: { maxStepsPerParticle?: number } = {}) {
    this.task = structuredClone(task);
    const p = task.model.params;
    this.eta = p.eta;
    const extra = this.eta - 1;
    this.wholeExtra = extra > 0 ? Math.floor(extra) : 0;
    this.fraction = extra > 0 ? extra - this.wholeExtra : 0;
    this.deficit = this.eta < 1 ? 1 - this.eta : 0;
    this.cap = p.recurrence_cap;
    this.capWeight = recurrenceWeight(this.cap, this.deficit);
    const useHistory = this.eta > 1 && (p.method ?? METHOD_EXACT) === METHOD_HISTORY;
    this.history = useHistory ? new HitHistory(task.particles, Math.floor(extra) + 1 + (p.history_extra_gaps ?? 0)) : null;
    this.power = this.history === null ? null : new RecurrencePower(extra);
    this.headroom = p.history_headroom ?? 1;
    this.xy = new Float64Array(2 * task.particles);
    this.index = new OccupancyIndex2d(task.particles, this.xy);
    this.sizes = recordSizes(task.particles, task.recordsPerDecade);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { walkers: 0, attempts: 0, jumps: 0, short_steps: 0, returns: 0, capped: 0 };
      this.series = { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} };
      this.place(0, 0);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (this.history === null && checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind} with the exact method, got ${checkpoint.modelState.length} bytes`);
      if (this.history !== null) [this.normaliser, this.weightSum, this.weightCount] = this.history.load(checkpoint.modelState, checkpoint.count);
      this.rng = Random.fromState(checkpoint.rngState);
      const c = checkpoint.counters;
      this.counters = { walkers: c.walkers ?? 0, attempts: c.attempts ?? 0, jumps: c.jumps ?? 0, short_steps: c.short_steps ?? 0, returns: c.returns ?? 0, capped: c.capped ?? 0 };
      this.series = structuredClone(checkpoint.series);
      const pos = checkpoint.positions;
      for (let i = 0; i < checkpoint.count; i++) this.append(pos[2 * i], pos[2 * i + 1], false);
      while (this.nextRecord < this.sizes.length && this.sizes[this.nextRecord] <= this.n) this.nextRecord++;
    }
    this.walker = new PlanarGrowthWalk(this.index, this.rng, p.min_step, p.launch_margin, task.runIndex, limits.maxStepsPerParticle ?? MAX_STEPS_PER_PARTICLE);
  }

  get count(): number {
    return this.n;
  }

  get done(): boolean {
    return this.n >= this.task.particles;
  }

  growTo(target: number, stop?: StopSignal): void {
    const goal = Math.min(target, this.task.particles);
    while (this.n < goal) if (!this.addParticle(stop)) return;
  }

  positions(): ClusterPositions {
    return { dimension: 2, count: this.n, coords: this.xy };
  }

  checkpoint(): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(this.task),
      dimension: 2,
      count: this.n,
      positions: this.xy.slice(0, 2 * this.n),
      rngState: this.rng.state(),
      counters: { ...this.counters },
      series: structuredClone(this.series),
      modelState: this.history === null ? new Uint8Array(0) : this.history.serialise(this.n, [this.normaliser, this.weightSum, this.weightCount]),
    };
  }

  result(): GrowthResult {
    if (!this.done) throw new Error(`run ${this.task.runIndex} is not finished (${this.n} of ${this.task.particles} particles)`);
    const radii = massRadiusRadii(this.rMax, this.task.recordsPerDecade);
    return {
      engineVersion: ENGINE_VERSION,
      model: structuredClone(this.task.model),
      dimension: 2,
      particles: this.task.particles,
      ensembleSeed: this.task.ensembleSeed,
      runIndex: this.task.runIndex,
      series: structuredClone(this.series),
      massRadius: { radii, counts: countCentresWithin(this.xy, 2, this.n, radii) },
      counters: { ...this.counters },
      stateHash: this.stateHash(),
    };
  }

  /**
   * Digest of count, positions, generator state and the walk counters (the
   * fields dla-offlattice-2d hashes), and with the history method also the
   * hit history and the normaliser.
   */
  stateHash(): string {
    const h = new StateHasher();
    h.word(2).integer(this.n).float64Strided(this.xy, this.n, 2, 0).float64Strided(this.xy, this.n, 2, 1);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.jumps).integer(this.counters.short_steps).integer(this.counters.returns);
    if (this.history !== null) {
      this.history.hashInto(h, this.n);
      h.float64(this.normaliser).float64(this.weightSum).float64(this.weightCount);
    }
    return h.digest();
  }

  /**
   * The particle the next accepted attempt grows on, for tests: run attempts
   * on the current cluster without adding anything, and return the arrival
   * index of the particle chosen (the generator advances; counters do not).
   */
  sampleGrowthParticle(): number {
    this.beginParticle();
    for (;;) {
      const i = this.attempt(undefined);
      if (i >= 0) return i;
    }
  }

  /** Build one particle by attempts; false (nothing changed) when the stop signal interrupted it. */
  private addParticle(stop: StopSignal | undefined): boolean {
    this.beginParticle();
    for (;;) {
      const i = this.attempt(stop);
      if (i === STOPPED - 1) {
        this.rng.loadState(this.particleStart);
        this.history?.undo();
        return false;
      }
      if (i >= 0) {
        this.grownOn = i;
        break;
      }
    }
    const c = this.counters;
    c.jumps += this.pendingJumps;
    c.short_steps += this.pendingShort;
    c.returns += this.pendingReturns;
    c.walkers += this.pendingWalkers;
    c.attempts += this.pendingAttempts;
    c.capped += this.pendingCapped;
    if (this.history !== null) {
      // decayed mean of h over about the last NORMALISER_MEMORY proposals
      const keep = Math.pow(1 - 1 / NORMALISER_MEMORY, this.pendingAttempts);
      this.weightSum = this.weightSum * keep + this.pendingWeightSum;
      this.weightCount = this.weightCount * keep + this.pendingAttempts;
      this.normaliser = Math.min(1, (this.headroom * this.weightSum) / this.weightCount);
    }
    this.place(this.hitX, this.hitY);
    return true;
  }

  private beginParticle(): void {
    this.rng.saveState(this.particleStart);
    this.walker.steps = 0;
    this.pendingJumps = 0;
    this.pendingShort = 0;
    this.pendingReturns = 0;
    this.pendingWalkers = 0;
    this.pendingAttempts = 0;
    this.pendingCapped = 0;
    this.pendingWeightSum = 0;
    this.history?.mark();
  }

  /**
   * One attempt (header, steps 1–4): the arrival index of the particle it
   * accepts, with the contact point in hitX/hitY; −1 when it fails; −2 when
   * the stop signal interrupted it.
   */
  private attempt(stop: StopSignal | undefined): number {
    this.pendingAttempts++;
    const i = this.walk(stop);
    if (i === STOPPED) return STOPPED - 1;
    const eta = this.eta;
    if (eta === 1) return i;
    if (this.history !== null) return this.historyAttempt(i, stop);
    if (eta > 1) {
      for (let m = 0; m < this.wholeExtra; m++) {
        const j = this.walk(stop);
        if (j === STOPPED) return STOPPED - 1;
        if (j !== i) return -1;
      }
      const f = this.fraction;
      if (f > 0) {
        const u = this.rng.nextDouble();
        let survive = 1;
        for (let k = 1; ; k++) {
          if (u >= survive) return -1;
          const j = this.walk(stop);
          if (j === STOPPED) return STOPPED - 1;
          if (j === i) break;
          survive *= (k - f) / k;
        }
      }
      return i;
    }
    // η < 1: recurrence estimator with cap T
    const px = this.hitX;
    const py = this.hitY;
    const a = this.deficit;
    const cap = this.cap;
    // accept iff u·g(T) < g(X); g only grows while walkers miss i, so the
    // attempt is accepted as soon as g > u·g(T), without the walkers after
    const threshold = this.rng.nextDouble() * this.capWeight;
    let g = 1;
    for (let k = 1; k < cap && !(threshold < g); k++) {
      const j = this.walk(stop);
      if (j === STOPPED) return STOPPED - 1;
      if (j === i) break;
      g *= (k + a) / k;
    }
    this.hitX = px;
    this.hitY = py;
    return threshold < g ? i : -1;
  }

  /**
   * The rest of a history-method attempt whose proposal walker touched i
   * (header, "η > 1, history method"): −1 rejected, i accepted (contact point
   * of the proposal in hitX/hitY), −2 stopped.
   */
  private historyAttempt(i: number, stop: StopSignal | undefined): number {
    const history = this.history as HitHistory;
    const power = this.power as RecurrencePower;
    const need = power.minGaps;
    const bar = this.rng.nextDouble() * this.normaliser;
    let gaps = history.window(i);
    if (gaps < need) {
      // too few gaps since i's birth or reset: fresh walkers until i has
      // `need` hits, or until even a hit now could not reach the bar
      // (h_need decreases with the span: rejected whatever comes later)
      const px = this.hitX;
      const py = this.hitY;
      const born = history.birth[i];
      while (gaps < need) {
        const most = power.weight(need, Math.max(need, history.clock + 1 - born));
        if (!(bar < most)) {
          this.pendingWeightSum += most;
          return -1;
        }
        const j = this.walk(stop);
        if (j === STOPPED) return STOPPED - 1;
        if (j === i) gaps = history.window(i);
      }
      this.hitX = px;
      this.hitY = py;
    }
    const h = power.weight(gaps, history.span);
    this.pendingWeightSum += h;
    if (h > this.normaliser) this.pendingCapped++;
    return bar < h ? i : -1;
  }

  /**
   * One walker from the launch circle to its first contact
   * (worker/walkers/planar-growth-walk.ts, the walk of dla-offlattice-2d):
   * the arrival index of the particle it touched (contact point in
   * hitX/hitY), or STOPPED.
   */
  private walk(stop: StopSignal | undefined): number {
    const walker = this.walker;
    let hit: number;
    try {
      hit = walker.walk(this.rMax, stop, this.n + 1);
    } catch (e) {
      if (e instanceof WalkerStuck) throw new WalkerStuck(`${e.message.slice(0, -1)}, or params.eta = ${this.eta} makes acceptance too rare)`);
      throw e;
    }
    if (hit === WALK_STOPPED) return STOPPED;
    this.pendingJumps += walker.jumps;
    this.pendingShort += walker.shortSteps;
    this.pendingReturns += walker.returns;
    this.pendingWalkers++;
    this.history?.record(hit);
    this.hitX = walker.hitX;
    this.hitY = walker.hitY;
    return hit;
  }

  /** Add a particle and take a record if the new size is on the grid. */
  private place(px: number, py: number): void {
    this.append(px, py, true);
    if (this.nextRecord < this.sizes.length && this.n === this.sizes[this.nextRecord]) {
      const n = this.n;
      const mx = this.sumX / n;
      const my = this.sumY / n;
      const rg2 = this.sumR2 / n - (mx * mx + my * my);
      this.series.sizes.push(n);
      this.series.radiusOfGyration.push(Math.sqrt(rg2 > 0 ? rg2 : 0));
      this.series.maxRadius.push(this.rMax);
      this.series.centerOffset.push(Math.sqrt(mx * mx + my * my));
      recordPlanarAnisotropy(this.series.extra, this.xy, 2, n, this.rMax);
      this.nextRecord++;
    }
  }

  /**
   * Add a particle to positions, index and running sums (no record). With the
   * history method and `grown` (not when rebuilding from a checkpoint), the
   * new particle is born now and the particle it grew on forgets its hits
   * (header, approximation 2).
   */
  private append(px: number, py: number, grown: boolean): void {
    const i = this.n;
    const history = this.history;
    if (history !== null && grown) {
      history.restart(i);
      if (i > 0) history.restart(this.grownOn);
    }
    this.xy[2 * i] = px;
    this.xy[2 * i + 1] = py;
    this.index.insert(px, py);
    this.n = i + 1;
    const r2 = px * px + py * py;
    const r = Math.sqrt(r2);
    if (r > this.rMax) this.rMax = r;
    this.sumX += px;
    this.sumY += py;
    this.sumR2 += r2;
  }
}
