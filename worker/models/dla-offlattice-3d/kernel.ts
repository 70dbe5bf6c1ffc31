/**
 * Off-lattice diffusion-limited aggregation in three dimensions.
 *
 * The model (exact definition)
 *  - Particles are balls of diameter 1. The cluster starts as one seed ball
 *    centred at the origin.
 *  - Particles are added one at a time. Each new particle's centre performs
 *    Brownian motion in R^3 started "from infinity" (uniformly distributed
 *    over directions), and the particle stops at the first instant its ball
 *    touches a ball of the cluster, i.e. when its centre first comes within
 *    distance 1 of a cluster centre. It joins the cluster there, touching it.
 *
 * How it is simulated
 *  1. Launch: the walker starts uniformly on the sphere of radius
 *     R_L = R_max + 1 + launch_margin, where R_max is the largest centre
 *     distance from the origin. The first-hit distribution on a sphere
 *     enclosing the cluster of a walker from infinity is uniform (harmonic
 *     measure from infinity of a ball), so this is exact.
 *  2. Escape or return: whenever the walker is outside R_L, at distance r,
 *     its Brownian path ever comes back to the launch sphere with probability
 *     R_L / r (Brownian motion in 3D is transient). If it does, it is moved
 *     to the first hit point, sampled from the exact exterior Poisson kernel
 *     of the ball (worker/walkers/poisson-return-3d.ts; counter `returns`).
 *     If it does not, the walk is gone for good and a fresh walker is
 *     launched as in step 1 (counter `escapes`): the particle that joins the
 *     cluster is the first walker that does not escape, and a walker from
 *     infinity conditioned to reach the cluster's neighbourhood is again
 *     uniform on the launch sphere, so this is exact, not a killing bias.
 *  3. Walk-on-spheres: the occupancy index (worker/index/occupancy-index-3d.ts)
 *     gives a lower bound d on the free distance (distance to the nearest
 *     centre, minus 1); the bound r − R_max − 1 from the walker's radius r is
 *     also used. When d >= min_step the walker jumps to a uniform point on the
 *     sphere of radius d around it: the exact exit law of Brownian motion
 *     from a ball it cannot leave without first crossing that sphere
 *     (counter `jumps`).
 *  4. Final approach: when d < min_step (the walker's centre is within
 *     1 + min_step of some centre), the walker instead takes one straight step
 *     of length min_step in a uniform direction, and sticks at the exact first
 *     point along that segment at which its centre is at distance 1 from a
 *     cluster centre (ray–sphere intersection), if there is one (counter
 *     `short_steps`).
 *
 * The one numerical approximation: within distance min_step of contact the
 * Brownian path is replaced by straight steps of length min_step (step 4),
 * measured exactly as in 2D (worker/models/dla-offlattice-2d/kernel.ts); as
 * min_step → 0 the process converges to the model above. A straight final
 * step acts like a slightly larger capture radius: measured at N = 1000
 * (300 clusters each, engine tendril-engine/2), mean R_g is 10.50 for
 * min_step = 0.5, 11.153 for 0.02 and 11.144 for 0.005 (z = 0.28 between the
 * last two; test/dla-3d-min-step.slow.test.ts), hence the default 0.02. Everything else (launch, escape, return,
 * walk-on-spheres jumps) samples the Brownian path exactly, up to
 * floating-point rounding.
 *
 * Observables at each record size: R_g, R_max and the centre-of-mass offset;
 * M(r), the number of centres within r of the seed, for the final cluster.
 *
 * Determinism: the result is a function of the task only. The random stream
 * is Random.forRun(ensembleSeed, runIndex, STREAM_GROWTH); per particle it is
 * consumed in a fixed order. Checkpoints are taken between particles and hold
 * positions, generator state, counters and records; the index is rebuilt by
 * re-inserting the particles in arrival order (its answers do not depend on
 * the order of queries).
 */

import type { Counters, ClusterPositions, GrowthCheckpoint, GrowthKernel, GrowthResult, GrowthSeries, GrowthTask } from '../../core/growth-kernel.js';
import { ENGINE_VERSION } from '../../core/engine-version.js';
import { OccupancyIndex3d } from '../../index/occupancy-index-3d.js';
import { returnToSphere, returned3 } from '../../walkers/poisson-return-3d.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { countCentresWithin, massRadiusRadii, recordSizes } from '../../core/record-sizes.js';
import { StateHasher } from '../../core/state-hash.js';
import { direction3, sampleDirection3d } from '../../walkers/uniform-direction-3d.js';
import { contact3, firstContact3d } from '../../walkers/segment-contact-3d.js';
import { checkCheckpointOf } from '../../core/checkpoint-check.js';
import { MAX_STEPS_PER_PARTICLE, STOP_CHECK_EVERY, walkInterrupted, type StopSignal } from '../../core/stop-signal.js';

/** The counters of this model (names as declared by its descriptor). */
export interface OffLatticeDla3dCounters extends Counters {
  /** Walk-on-spheres jumps (each uniform exit from a free ball). */
  jumps: number;
  /** Short straight steps taken next to the cluster. */
  short_steps: number;
  /** Returns of far walkers to the launch sphere by the exact Poisson kernel. */
  returns: number;
  /** Far walkers that never come back (probability 1 − R_L/r), replaced by fresh launches. */
  escapes: number;
}

export class OffLatticeDla3d implements GrowthKernel {
  readonly task: GrowthTask;
  readonly dimension = 3;
  readonly counters: OffLatticeDla3dCounters;
  private readonly minStep: number;
  private readonly launchMargin: number;
  /** Centres in arrival order, interleaved: x0, y0, z0, x1, … (held by the index, which needs them too). */
  private readonly xyz: Float64Array;
  private readonly index: OccupancyIndex3d;
  private readonly rng: Random;
  private readonly sizes: number[];
  private readonly series: GrowthSeries;
  private n = 0;
  private rMax = 0;
  private sumX = 0;
  private sumY = 0;
  private sumZ = 0;
  private sumR2 = 0;
  private nextRecord = 0;
  /** Generator state at the start of the particle being walked (restored when a stop interrupts it). */
  private readonly particleStart = new Uint32Array(4);
  /** Walker steps until the stop signal is read next (carried across particles). */
  private untilCheck = STOP_CHECK_EVERY;
  /** Most steps one particle may take before the run fails as stuck (MAX_STEPS_PER_PARTICLE; tests lower it). */
  private readonly maxSteps: number;

  /** The task must have passed the registry's checks (worker/models/registry.ts checkTask). */
  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint, limits: { maxStepsPerParticle?: number } = {}) {
    this.task = structuredClone(task);
    this.maxSteps = limits.maxStepsPerParticle ?? MAX_STEPS_PER_PARTICLE;
    this.minStep = task.model.params.min_step;
    this.launchMargin = task.model.params.launch_margin;
    this.index = new OccupancyIndex3d(task.particles);
    this.xyz = this.index.coords;
    this.sizes = recordSizes(task.particles, task.recordsPerDecade);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { jumps: 0, short_steps: 0, returns: 0, escapes: 0 };
      this.series = { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [], extra: {} };
      this.place(0, 0, 0);
    } else {
      checkCheckpointOf(task, 3, checkpoint);
      if (checkpoint.modelState.length !== 0) throw new RangeError(`checkpoint modelState must be empty for ${task.model.kind}, got ${checkpoint.modelState.length} bytes`);
      this.rng = Random.fromState(checkpoint.rngState);
      const c = checkpoint.counters;
      this.counters = { jumps: c.jumps ?? 0, short_steps: c.short_steps ?? 0, returns: c.returns ?? 0, escapes: c.escapes ?? 0 };
      this.series = structuredClone(checkpoint.series);
      const p = checkpoint.positions;
      for (let i = 0; i < checkpoint.count; i++) this.append(p[3 * i], p[3 * i + 1], p[3 * i + 2]);
      while (this.nextRecord < this.sizes.length && this.sizes[this.nextRecord] <= this.n) this.nextRecord++;
    }
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
    return { dimension: 3, count: this.n, coords: this.xyz };
  }

  /** Bytes held by the occupancy index (for benchmarks). */
  get indexBytes(): number {
    return this.index.bytes;
  }

  checkpoint(): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(this.task),
      dimension: 3,
      count: this.n,
      positions: this.xyz.slice(0, 3 * this.n),
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
      dimension: 3,
      particles: this.task.particles,
      ensembleSeed: this.task.ensembleSeed,
      runIndex: this.task.runIndex,
      series: structuredClone(this.series),
      massRadius: { radii, counts: countCentresWithin(this.xyz, 3, this.n, radii) },
      counters: { ...this.counters },
      stateHash: this.stateHash(),
    };
  }

  /** Digest of positions, generator state, count and counters. */
  stateHash(): string {
    const h = new StateHasher();
    h.word(3).integer(this.n);
    for (let k = 0; k < 3; k++) h.float64Strided(this.xyz, this.n, 3, k);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.jumps).integer(this.counters.short_steps).integer(this.counters.returns).integer(this.counters.escapes);
    return h.digest();
  }

  /**
   * Run walkers from the launch sphere until one sticks, and add it; false
   * (nothing changed) when the stop signal interrupted the walk.
   */
  private addParticle(stop: StopSignal | undefined): boolean {
    const rng = this.rng;
    rng.saveState(this.particleStart);
    let untilCheck = this.untilCheck;
    let checked = 0;
    const index = this.index;
    const minStep = this.minStep;
    const rMax = this.rMax;
    const launch = rMax + 1 + this.launchMargin;
    const launch2 = launch * launch;
    let jumps = 0;
    let shortSteps = 0;
    let returns = 0;
    let escapes = 0;

    // uniform point on the launch sphere
    sampleDirection3d(rng);
    let wx = launch * direction3.x;
    let wy = launch * direction3.y;
    let wz = launch * direction3.z;

    for (;;) {
      if (--untilCheck === 0) {
        untilCheck = STOP_CHECK_EVERY;
        checked += STOP_CHECK_EVERY;
        if (walkInterrupted(stop, checked, this.maxSteps, this.task.runIndex, this.n + 1, Math.sqrt(wx * wx + wy * wy + wz * wz), minStep)) {
          rng.loadState(this.particleStart);
          this.untilCheck = STOP_CHECK_EVERY;
          return false;
        }
      }
      let r2 = wx * wx + wy * wy + wz * wz;
      if (r2 > launch2) {
        if (returnToSphere(wx, wy, wz, launch, rng)) {
          wx = returned3.x;
          wy = returned3.y;
          wz = returned3.z;
          returns++;
        } else {
          sampleDirection3d(rng);
          wx = launch * direction3.x;
          wy = launch * direction3.y;
          wz = launch * direction3.z;
          escapes++;
        }
        r2 = launch2;
      }
      index.query(wx, wy, wz);
      let d = index.free;
      // the ball of radius r − R_max − 1 around the walker is free too
      const reach = rMax + 1 + d;
      if (r2 > reach * reach) d = Math.sqrt(r2) - rMax - 1;

      sampleDirection3d(rng);
      const ux = direction3.x;
      const uy = direction3.y;
      const uz = direction3.z;

      if (d >= minStep) {
        // walk-on-spheres: exact exit point of the free ball of radius d
        wx += d * ux;
        wy += d * uy;
        wz += d * uz;
        jumps++;
        continue;
      }

      // Final approach: straight step of length minStep, stopping at the
      // first contact. Every centre within 1 + minStep <= 2 is in
      // index.nearX/Y/Z (d < minStep <= 1 means the exact scan answered).
      const hit = firstContact3d(index.nearX, index.nearY, index.nearZ, index.nearCount, wx, wy, wz, ux, uy, uz, minStep, 1);
      shortSteps++;
      if (hit >= 0) {
        const t = contact3.t;
        wx += t * ux;
        wy += t * uy;
        wz += t * uz;
        break;
      }
      wx += minStep * ux;
      wy += minStep * uy;
      wz += minStep * uz;
    }

    this.counters.jumps += jumps;
    this.counters.short_steps += shortSteps;
    this.counters.returns += returns;
    this.counters.escapes += escapes;
    this.untilCheck = untilCheck;
    this.place(wx, wy, wz);
    return true;
  }

  /** Add a particle and take a record if the new size is on the grid. */
  private place(px: number, py: number, pz: number): void {
    this.append(px, py, pz);
    if (this.nextRecord < this.sizes.length && this.n === this.sizes[this.nextRecord]) {
      const n = this.n;
      const mx = this.sumX / n;
      const my = this.sumY / n;
      const mz = this.sumZ / n;
      const m2 = mx * mx + my * my + mz * mz;
      const rg2 = this.sumR2 / n - m2;
      this.series.sizes.push(n);
      this.series.radiusOfGyration.push(Math.sqrt(rg2 > 0 ? rg2 : 0));
      this.series.maxRadius.push(this.rMax);
      this.series.centerOffset.push(Math.sqrt(m2));
      this.nextRecord++;
    }
  }

  /** Add a particle to positions, index and running sums (no record). */
  private append(px: number, py: number, pz: number): void {
    const i = this.n;
    this.index.insert(px, py, pz); // stores the centre in this.xyz
    this.n = i + 1;
    const r2 = px * px + py * py + pz * pz;
    const r = Math.sqrt(r2);
    if (r > this.rMax) this.rMax = r;
    this.sumX += px;
    this.sumY += py;
    this.sumZ += pz;
    this.sumR2 += r2;
  }
}
