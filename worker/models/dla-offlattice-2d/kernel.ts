/**
 * Off-lattice diffusion-limited aggregation in the plane.
 *
 * The model (exact definition)
 *  - Particles are disks of diameter 1. The cluster starts as one seed disk
 *    centred at the origin.
 *  - Particles are added one at a time. Each new particle's centre performs
 *    planar Brownian motion started "from infinity" (uniformly distributed
 *    over directions), and the particle stops at the first instant its disk
 *    touches a disk of the cluster, i.e. when its centre first comes within
 *    distance 1 of a cluster centre. It joins the cluster there, touching it.
 *
 * How it is simulated
 *  1. Launch: the walker starts uniformly on the circle of radius
 *     R_L = R_max + 1 + launch_margin, where R_max is the largest centre
 *     distance from the origin. The first-hit distribution on any circle
 *     enclosing the cluster of a walker from infinity is uniform, so this is
 *     exact.
 *  2. Return: whenever the walker is outside R_L it is moved to the point
 *     where its Brownian path first hits the launch circle, sampled from the
 *     exact exterior Poisson kernel (worker/walkers/poisson-return-2d.ts). In two
 *     dimensions that hit is certain, so no walker is ever killed.
 *  3. Walk-on-spheres: the occupancy index (worker/index/occupancy-index-2d.ts)
 *     gives a lower bound d on the free distance (distance to the nearest
 *     centre, minus 1); the bound r − R_max − 1 from the walker's radius r is
 *     also used. When d >= min_step the walker jumps to a uniform point on the
 *     circle of radius d around it: the exact exit law of Brownian motion
 *     from a disk it cannot leave without first crossing that circle.
 *  4. Final approach: when d < min_step (the walker's centre is within
 *     1 + min_step of some centre), the walker instead takes one straight step
 *     of length min_step in a uniform direction, and sticks at the exact first
 *     point along that segment at which its centre is at distance 1 from a
 *     cluster centre, if there is one.
 *
 * The one numerical approximation: within distance min_step of contact the
 * Brownian path is replaced by straight steps of length min_step (step 4).
 * As min_step → 0 the process converges to the model above. The effect is
 * not small for coarse steps: measured at N = 1000 (300 clusters each, seed
 * 55, engine tendril-engine/2), mean R_g is 25.69 ± 0.06 for min_step = 1,
 * 27.68 ± 0.07 for 0.25, 28.45 ± 0.07 for 0.05 and 28.56 ± 0.07 for 0.01
 * — a straight final step
 * acts like a slightly larger capture radius. Hence the default 0.02, which
 * costs about 10% more steps than 0.25; test/dla-min-step.slow.test.ts shows
 * that 0.02 and 0.004 give the same mean R_g within the ensemble error, and
 * that the same test detects the bias of 0.25. Measured there with 1200
 * clusters each (MIN_STEP_CLUSTERS=1200): mean R_g at N = 1000 is
 * 28.500 ± 0.032 at 0.02 and 28.482 ± 0.032 at 0.004, a difference of
 * +0.06% ± 0.16%. The probe walkers (worker/probe/probe-2d.ts) replace the
 * straight steps by an exact lens step near a single disk; growth keeps the
 * straight steps, so that its trajectories and the pinned state hashes stay
 * the same. Everything else (launch,
 * return, walk-on-spheres jumps) samples the Brownian path exactly, up to
 * floating-point rounding.
 *
 * Observables at each record size: R_g, R_max, the centre-of-mass offset,
 * and the planar anisotropy measures of worker/core/anisotropy.ts (the
 * isotropic baseline for lattice models).
 *
 * Determinism: the result is a function of the task only. The random stream
 * is Random.forRun(ensembleSeed, runIndex, STREAM_GROWTH); per particle it is
 * consumed in a fixed order. Checkpoints are taken between particles and hold
 * positions, generator state, counters and records; the index is rebuilt by
 * re-inserting the particles in arrival order.
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
import { MAX_STEPS_PER_PARTICLE, type StopSignal } from '../../core/stop-signal.js';

/** The counters of this model (names as declared by its descriptor). */
export interface OffLatticeDla2dCounters extends Counters {
  /** Walk-on-spheres jumps (each uniform exit from a free disk). */
  jumps: number;
  /** Short straight steps taken next to the cluster. */
  short_steps: number;
  /** Returns of far walkers to the launch circle by the exact Poisson kernel. */
  returns: number;
}

export class OffLatticeDla2d implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 2;
  readonly counters: OffLatticeDla2dCounters;
  /** Centres in arrival order, interleaved: x0, y0, x1, y1, … */
  private readonly xy: Float64Array;
  /** Released (emptied) once the cluster is complete: nothing queries it then, and outputs are written without it. */
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
  /** Generator state at the start of the particle being walked (restored when a stop interrupts it). */
  private readonly particleStart = new Uint32Array(4);
  /** The growth walk (worker/walkers/planar-growth-walk.ts). */
  private readonly walker: PlanarGrowthWalk;

  /** The task must have passed the registry's checks (worker/models/registry.ts checkTask). */
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint, limits: { maxStepsPerParticle?: number } = {}) {
    this.task = structuredClone(task);
    // a checkpoint's positions array with room for the whole run becomes the kernel's own (no second copy)
    this.xy = checkpoint !== undefined && checkpoint.positions.length >= 2 * task.particles ? checkpoint.positions : new Float64Array(2 * task.particles);
    this.index = new OccupancyIndex2d(task.particles, this.xy);
    this.sizes = recordSizes(task.particles, task.recordsPerDecade);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { jumps: 0, short_steps: 0, returns: 0 };
      this.series = { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} };
      this.place(0, 0);
    } else {
      checkCheckpointOf(task, 2, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      const c = checkpoint.counters;
      this.counters = { jumps: c.jumps ?? 0, short_steps: c.short_steps ?? 0, returns: c.returns ?? 0 };
      this.series = structuredClone(checkpoint.series);
      const p = checkpoint.positions;
      for (let i = 0; i < checkpoint.count; i++) this.append(p[2 * i], p[2 * i + 1]);
      while (this.nextRecord < this.sizes.length && this.sizes[this.nextRecord] <= this.n) this.nextRecord++;
    }
    // most steps one particle may take before the run fails as stuck (MAX_STEPS_PER_PARTICLE; tests lower it)
    const maxSteps = limits.maxStepsPerParticle ?? MAX_STEPS_PER_PARTICLE;
    this.walker = new PlanarGrowthWalk(this.index, this.rng, task.model.params.min_step, task.model.params.launch_margin, task.runIndex, maxSteps);
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

  /** Bytes held by the occupancy index (for benchmarks). */
  get indexBytes(): number {
    return this.index.bytes;
  }

  /** Work of the occupancy index so far (for benchmarks): exact scans, fresh 3 × 3 block gathers and ring gathers. */
  get indexWork(): { exactScans: number; blockGathers: number; ringGathers: number } {
    const i = this.index;
    return { exactScans: i.exactScans, blockGathers: i.blockGathers, ringGathers: i.ringGathers };
  }

  checkpoint(): GrowthCheckpoint {
    return { ...this.checkpointView(), positions: this.xy.slice(0, 2 * this.n) };
  }

  checkpointView(): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(this.task),
      dimension: 2,
      count: this.n,
      positions: this.xy.subarray(0, 2 * this.n),
      rngState: this.rng.state(),
      counters: { ...this.counters },
      series: structuredClone(this.series),
      modelState: new Uint8Array(0),
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

  /** Digest of positions, generator state, count and counters. */
  stateHash(): string {
    const h = new StateHasher();
    h.word(2).integer(this.n).float64Strided(this.xy, this.n, 2, 0).float64Strided(this.xy, this.n, 2, 1);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.jumps).integer(this.counters.short_steps).integer(this.counters.returns);
    return h.digest();
  }

  /**
   * Run one walker from the launch circle until it sticks, and add it; false
   * (nothing changed) when the stop signal interrupted the walk.
   */
  private addParticle(stop: StopSignal | undefined): boolean {
    this.rng.saveState(this.particleStart);
    const walker = this.walker;
    walker.steps = 0;
    if (walker.walk(this.rMax, stop, this.n + 1) === WALK_STOPPED) {
      this.rng.loadState(this.particleStart);
      return false;
    }
    this.counters.jumps += walker.jumps;
    this.counters.short_steps += walker.shortSteps;
    this.counters.returns += walker.returns;
    this.place(walker.hitX, walker.hitY);
    return true;
  }

  /** Add a particle and take a record if the new size is on the grid. */
  private place(px: number, py: number): void {
    this.append(px, py);
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
    if (this.n === this.task.particles) this.index.release();
  }

  /** Add a particle to positions, index and running sums (no record). */
  private append(px: number, py: number): void {
    const i = this.n;
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
