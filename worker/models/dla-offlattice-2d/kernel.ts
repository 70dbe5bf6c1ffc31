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
 *     R_L = R_max + 1 + launchMargin, where R_max is the largest centre
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
 *     also used. When d >= minStep the walker jumps to a uniform point on the
 *     circle of radius d around it: the exact exit law of Brownian motion
 *     from a disk it cannot leave without first crossing that circle.
 *  4. Final approach: when d < minStep (the walker's centre is within
 *     1 + minStep of some centre), the walker instead takes one straight step
 *     of length minStep in a uniform direction, and sticks at the exact first
 *     point along that segment at which its centre is at distance 1 from a
 *     cluster centre, if there is one.
 *
 * The one numerical approximation: within distance minStep of contact the
 * Brownian path is replaced by straight steps of length minStep (step 4).
 * As minStep → 0 the process converges to the model above. The effect is
 * not small for coarse steps: measured at N = 1000 (300 clusters each, seed
 * 55, engine tendril-engine/2), mean R_g is 25.69 ± 0.06 for minStep = 1,
 * 27.68 ± 0.07 for 0.25, 28.45 ± 0.07 for 0.05 and 28.56 ± 0.07 for 0.01
 * — a straight final step
 * acts like a slightly larger capture radius. Hence the default 0.02, which
 * costs about 10% more steps than 0.25; test/dla-min-step.slow.test.ts shows
 * that 0.02 and 0.005 give the same mean R_g within the ensemble error, and
 * that the same test detects the bias of 0.25. Everything else (launch,
 * return, walk-on-spheres jumps) samples the Brownian path exactly, up to
 * floating-point rounding.
 *
 * Determinism: the result is a function of the task only. The random stream
 * is Random.forRun(ensembleSeed, runIndex, STREAM_GROWTH); per particle it is
 * consumed in a fixed order. Checkpoints are taken between particles and hold
 * positions, generator state, counters and records; the index is rebuilt by
 * re-inserting the particles in arrival order.
 */

import type {
  GrowthCheckpoint,
  GrowthCounters,
  GrowthKernel,
  GrowthResult,
  GrowthSeries,
  GrowthTask,
  OffLatticeDla2dParams,
} from '../../core/growth-kernel.js';
import { ENGINE_VERSION } from '../../core/engine-version.js';
import { OccupancyIndex2d } from '../../index/occupancy-index-2d.js';
import { returnToCircle, returned } from '../../walkers/poisson-return-2d.js';
import { Random, STREAM_GROWTH } from '../../core/random.js';
import { countWithin, massRadiusRadii, recordSizes } from '../../core/record-sizes.js';
import { StateHasher } from '../../core/state-hash.js';
import { direction, sampleDirection } from '../../walkers/uniform-direction.js';
import { contact, firstContact } from '../../walkers/segment-contact-2d.js';
import { canonicalJson } from '../../core/canonical-json.js';

export const DEFAULT_DLA_OFFLATTICE_2D: OffLatticeDla2dParams = {
  kind: 'dla-offlattice-2d',
  minStep: 0.02,
  launchMargin: 2,
};

/** Throws a RangeError naming the first bad field of a task for this model. */
export function checkDlaOffLattice2dTask(task: GrowthTask): void {
  const m = task.model as OffLatticeDla2dParams;
  if (!(m.minStep > 0 && m.minStep <= 1)) throw new RangeError(`model.minStep must be in (0, 1], got ${m.minStep}`);
  if (!(m.launchMargin > 0 && m.launchMargin <= 1000)) throw new RangeError(`model.launchMargin must be in (0, 1000], got ${m.launchMargin}`);
  checkCommonTask(task);
}

export function checkCommonTask(task: GrowthTask): void {
  if (!Number.isSafeInteger(task.particles) || task.particles < 1 || task.particles > 1e8)
    throw new RangeError(`particles must be an integer in [1, 100000000], got ${task.particles}`);
  if (!Number.isSafeInteger(task.recordsPerDecade) || task.recordsPerDecade < 10 || task.recordsPerDecade > 100)
    throw new RangeError(`recordsPerDecade must be an integer in [10, 100], got ${task.recordsPerDecade}`);
  if (!Number.isSafeInteger(task.runIndex) || task.runIndex < 0)
    throw new RangeError(`runIndex must be a non-negative integer, got ${task.runIndex}`);
}

export class OffLatticeDla2d implements GrowthKernel {
  readonly task: GrowthTask;
  readonly counters: GrowthCounters;
  private readonly minStep: number;
  private readonly launchMargin: number;
  private readonly x: Float64Array;
  private readonly y: Float64Array;
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

  constructor(task: GrowthTask, checkpoint?: GrowthCheckpoint) {
    checkDlaOffLattice2dTask(task);
    this.task = structuredClone(task);
    const m = task.model as OffLatticeDla2dParams;
    this.minStep = m.minStep;
    this.launchMargin = m.launchMargin;
    this.x = new Float64Array(task.particles);
    this.y = new Float64Array(task.particles);
    this.index = new OccupancyIndex2d(task.particles, false);
    this.sizes = recordSizes(task.particles, task.recordsPerDecade);
    if (checkpoint === undefined) {
      this.rng = Random.forRun(task.ensembleSeed, task.runIndex, STREAM_GROWTH);
      this.counters = { jumps: 0, shortSteps: 0, returns: 0 };
      this.series = { sizes: [], radiusOfGyration: [], maxRadius: [], centerOffset: [] };
      this.place(0, 0);
    } else {
      checkCheckpointMatches(task, checkpoint);
      this.rng = Random.fromState(checkpoint.rngState);
      this.counters = { ...checkpoint.counters };
      this.series = structuredClone(checkpoint.series);
      for (let i = 0; i < checkpoint.count; i++) this.append(checkpoint.x[i], checkpoint.y[i]);
      while (this.nextRecord < this.sizes.length && this.sizes[this.nextRecord] <= this.n) this.nextRecord++;
    }
  }

  get count(): number {
    return this.n;
  }

  get done(): boolean {
    return this.n >= this.task.particles;
  }

  growTo(target: number): void {
    const goal = Math.min(target, this.task.particles);
    while (this.n < goal) this.addParticle();
  }

  positions(): { x: Float64Array; y: Float64Array; count: number } {
    return { x: this.x, y: this.y, count: this.n };
  }

  /** Bytes held by the occupancy index (for benchmarks). */
  get indexBytes(): number {
    return this.index.bytes;
  }

  checkpoint(): GrowthCheckpoint {
    return {
      engineVersion: ENGINE_VERSION,
      task: structuredClone(this.task),
      count: this.n,
      x: this.x.slice(0, this.n),
      y: this.y.slice(0, this.n),
      rngState: this.rng.state(),
      counters: { ...this.counters },
      series: structuredClone(this.series),
    };
  }

  result(): GrowthResult {
    if (!this.done) throw new Error(`run ${this.task.runIndex} is not finished (${this.n} of ${this.task.particles} particles)`);
    const dist = new Float64Array(this.n);
    for (let i = 0; i < this.n; i++) dist[i] = Math.sqrt(this.x[i] * this.x[i] + this.y[i] * this.y[i]);
    const radii = massRadiusRadii(this.rMax, this.task.recordsPerDecade);
    return {
      engineVersion: ENGINE_VERSION,
      model: structuredClone(this.task.model),
      particles: this.task.particles,
      ensembleSeed: this.task.ensembleSeed,
      runIndex: this.task.runIndex,
      series: structuredClone(this.series),
      massRadius: { radii, counts: countWithin(dist, radii) },
      counters: { ...this.counters },
      stateHash: this.stateHash(),
    };
  }

  /** Digest of positions, generator state, count and counters. */
  stateHash(): string {
    const h = new StateHasher();
    h.word(2).integer(this.n).float64Array(this.x, this.n).float64Array(this.y, this.n);
    for (const w of this.rng.state()) h.word(w);
    h.integer(this.counters.jumps).integer(this.counters.shortSteps).integer(this.counters.returns);
    return h.digest();
  }

  /** Run one walker from the launch circle until it sticks, and add it. */
  private addParticle(): void {
    const rng = this.rng;
    const index = this.index;
    const minStep = this.minStep;
    const rMax = this.rMax;
    const launch = rMax + 1 + this.launchMargin;
    const launch2 = launch * launch;
    let jumps = 0;
    let shortSteps = 0;
    let returns = 0;

    // uniform point on the launch circle
    sampleDirection(rng);
    let wx = launch * direction.x;
    let wy = launch * direction.y;

    for (;;) {
      let r2 = wx * wx + wy * wy;
      if (r2 > launch2) {
        returnToCircle(wx, wy, launch, rng);
        wx = returned.x;
        wy = returned.y;
        r2 = launch2;
        returns++;
      }
      index.query(wx, wy);
      let d = index.free;
      // the disk of radius r − R_max − 1 around the walker is free too
      const reach = rMax + 1 + d;
      if (r2 > reach * reach) d = Math.sqrt(r2) - rMax - 1;

      sampleDirection(rng);
      const cx = direction.x;
      const cy = direction.y;

      if (d >= minStep) {
        // walk-on-spheres: exact exit point of the free disk of radius d
        wx += d * cx;
        wy += d * cy;
        jumps++;
        continue;
      }

      // Final approach: straight step of length minStep, stopping at the
      // first contact. Every centre within 1 + minStep is in index.nearX/Y
      // (d < minStep <= 1 means the exact scan answered).
      const hit = firstContact(index.nearX, index.nearY, index.nearCount, wx, wy, cx, cy, minStep, null, null);
      shortSteps++;
      if (hit >= 0) {
        wx += contact.t * cx;
        wy += contact.t * cy;
        break;
      }
      wx += minStep * cx;
      wy += minStep * cy;
    }

    this.counters.jumps += jumps;
    this.counters.shortSteps += shortSteps;
    this.counters.returns += returns;
    this.place(wx, wy);
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
      this.nextRecord++;
    }
  }

  /** Add a particle to positions, index and running sums (no record). */
  private append(px: number, py: number): void {
    const i = this.n;
    this.x[i] = px;
    this.y[i] = py;
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

function checkCheckpointMatches(task: GrowthTask, cp: GrowthCheckpoint): void {
  if (cp.engineVersion !== ENGINE_VERSION)
    throw new RangeError(`checkpoint engineVersion must be ${ENGINE_VERSION}, got ${cp.engineVersion}`);
  if (canonicalJson(cp.task) !== canonicalJson(task))
    throw new RangeError(`checkpoint task does not match the run task (run ${task.runIndex})`);
  if (!Number.isSafeInteger(cp.count) || cp.count < 1 || cp.count > task.particles)
    throw new RangeError(`checkpoint count must be an integer in [1, ${task.particles}], got ${cp.count}`);
  if (cp.x.length < cp.count || cp.y.length < cp.count)
    throw new RangeError(`checkpoint holds ${Math.min(cp.x.length, cp.y.length)} positions, fewer than its count ${cp.count}`);
  if (cp.rngState.length !== 4) throw new RangeError(`checkpoint rngState must have 4 words, got ${cp.rngState.length}`);
}
