/**
 * Harmonic-measure probing and Newtonian capacity of a set of balls in three
 * dimensions (pure: no I/O).
 *
 * The set (exact definition)
 *  - K = union of closed balls B(p_i, a), i = 0 … n−1, of one common radius
 *    a > 0. A probe walker is a *point* performing Brownian motion in R^3; it
 *    touches ball i at the first instant |w − p_i| = a. Cluster snapshots of
 *    diameter d are probed with a = d: a growth walker's centre stops within
 *    d of a cluster centre, so these capture balls carry the growth
 *    probabilities (as in 2D, worker/probe/probe-2d.ts).
 *  - Harmonic measure from infinity: the share of probes from infinity that
 *    touch ball i first, among those that touch K.
 *  - Newtonian capacity, in units where a ball of radius a has capacity a
 *    (cap(K) = total charge of the equilibrium measure, whose potential
 *    ∫ dμ(y)/|x − y| is 1 on K; a thin disk of radius a has 2a/π). A walker
 *    started uniformly on a sphere of radius R enclosing K hits K with
 *    probability exactly cap(K)/R: the hitting probability is the potential
 *    ∫ dμ(y)/|x − y| of the equilibrium measure, and by Newton's theorem the
 *    mean of 1/|x − y| over the sphere is 1/R for every y inside it (Kellogg
 *    1929, Foundations of Potential Theory, ch. VI and XI; exact). So
 *    cap(K) = R · (hits / walkers), with the binomial standard error.
 *
 * How it is simulated: the growth walk of worker/models/dla-offlattice-3d/kernel.ts
 * without sticking, in units of a (lengths divided by a, after moving the
 * origin to the centre of the bounding box of the centres):
 *  1. launch uniformly on the sphere of radius R_L = R_ext + launch margin,
 *     R_ext = max |p_i| + 1 (exact for a walker from infinity);
 *  2. outside R_L: the walker escapes for good with probability 1 − R_L/r
 *     (it then counts as a miss), else returns to the sphere by the exact
 *     exterior Poisson kernel (worker/walkers/poisson-return-3d.ts);
 *  3. walk-on-spheres with the free radius from the 3D occupancy index
 *     (worker/index/occupancy-index-3d.ts) and from r − R_ext;
 *  4. within min_step of contact, straight steps of length min_step with the
 *     exact first contact (the one approximation, as in growth).
 *
 * Jobs and determinism: job j draws from Random.forRun(seed, j, STREAM_PROBE)
 * and is a function of (set, task) only; hit counts of jobs add up.
 *
 * Two job forms run the same walk (same draws, same hits): runProbe3dJob
 * (Probe3dTask, dense hits; `tendril probe` on a snapshot) and
 * runBallProbeJob (the queueable ProbeTask/ProbeResult of
 * worker/probe/probe-2d.ts, with the set's digest and the launch radius for
 * the capacity; ensemble probing in specs, embedded and farm). No contact
 * points are kept in 3D (contactSample must be 0).
 */

import { OccupancyIndex3d } from '../index/occupancy-index-3d.js';
import { returnToSphere, returned3 } from '../walkers/poisson-return-3d.js';
import { Random, STREAM_PROBE, parseSeed } from '../core/random.js';
import { direction3, sampleDirection3d } from '../walkers/uniform-direction-3d.js';
import { firstContact3d } from '../walkers/segment-contact-3d.js';
import { checkProbeTask, probeResultOf, type ProbeResult, type ProbeTask } from './probe-2d.js';
import { setDigest } from './set-digest.js';

/** Default straight-step length near contact, in units of the ball radius. */
export const DEFAULT_PROBE3D_MIN_STEP = 0.02;

/** Balls of one common radius. */
export interface BallSet {
  count: number;
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  /** Common radius a > 0 of every ball. */
  radius: number;
}

export interface Probe3dTask {
  /** Unsigned 64-bit seed as a decimal string. */
  seed: string;
  /** Job index j: the job draws from Random.forRun(seed, j, STREAM_PROBE). */
  jobIndex: number;
  walkers: number;
  /** Straight-step length near contact, in units of the radius, in (0, 1]. */
  minStep: number;
  /** Launch sphere radius minus R_ext, in units of the radius, >= 0. */
  launchMargin: number;
}

export interface Probe3dResult {
  walkers: number;
  /** Probes that touched ball i first. */
  hits: Float64Array;
  /** Probes that touched K (the sum of hits). */
  hitTotal: number;
  /** Launch radius R_L in the set's own units. */
  launchRadius: number;
  /** Walk-on-spheres jumps in the job. */
  jumps: number;
}

/** The set prepared for probing: centred, scaled to radius 1, indexed. */
export class ProbeGeometry3d {
  readonly count: number;
  readonly radius: number;
  /** R_ext in scaled units: max |p_i| + 1 about the bounding-box centre. */
  readonly extent: number;
  readonly index: OccupancyIndex3d;
  /** ballSetDigest of the set as given. */
  readonly digest: string;

  constructor(set: BallSet) {
    const n = set.count;
    if (!Number.isInteger(n) || n < 1) throw new RangeError(`ball set: count must be a positive integer, got ${n}`);
    if (!(set.radius > 0 && Number.isFinite(set.radius))) throw new RangeError(`ball set: radius must be a positive number, got ${set.radius}`);
    this.count = n;
    this.radius = set.radius;
    const lo = [Infinity, Infinity, Infinity];
    const hi = [-Infinity, -Infinity, -Infinity];
    const axes = [set.x, set.y, set.z];
    for (let k = 0; k < 3; k++)
      for (let i = 0; i < n; i++) {
        const v = axes[k][i];
        if (!Number.isFinite(v)) throw new RangeError(`ball set: coordinate ${'xyz'[k]} of ball ${i} is not finite`);
        if (v < lo[k]) lo[k] = v;
        if (v > hi[k]) hi[k] = v;
      }
    const c = [0, 1, 2].map((k) => 0.5 * (lo[k] + hi[k]));
    const inv = 1 / set.radius;
    this.index = new OccupancyIndex3d(n);
    let ext = 0;
    for (let i = 0; i < n; i++) {
      const x = (set.x[i] - c[0]) * inv;
      const y = (set.y[i] - c[1]) * inv;
      const z = (set.z[i] - c[2]) * inv;
      this.index.insert(x, y, z);
      const r = Math.sqrt(x * x + y * y + z * z);
      if (r > ext) ext = r;
    }
    this.extent = ext + 1;
    this.digest = ballSetDigest(set);
  }
}

/**
 * Digest of a ball set: "n-b" + FNV-1a (32 bit) over the float64 words of
 * x, y, z of every ball in order, then the radius (worker/probe/set-digest.ts).
 * The "b" keeps a ball set's digest apart from a disk set's
 * (worker/probe/probe-2d.ts diskSetDigest).
 */
export function ballSetDigest(set: BallSet): string {
  return setDigest(set.count, [set.x, set.y, set.z], [set.radius], 'b');
}

export function checkProbe3dTask(t: Probe3dTask): void {
  parseSeed(t.seed);
  if (!Number.isSafeInteger(t.jobIndex) || t.jobIndex < 0) throw new RangeError(`job_index: ${t.jobIndex} is out of range; allowed: a non-negative integer`);
  if (!Number.isSafeInteger(t.walkers) || t.walkers < 1) throw new RangeError(`walkers: ${t.walkers} is out of range; allowed: a positive integer`);
  if (!(t.minStep > 0 && t.minStep <= 1)) throw new RangeError(`min_step: ${t.minStep} is out of range; allowed: a number in (0, 1]`);
  if (!(t.launchMargin >= 0 && Number.isFinite(t.launchMargin))) throw new RangeError(`launch_margin: ${t.launchMargin} is out of range; allowed: a finite number >= 0`);
}

/** Counts of one walk of many probes (see walkProbes). */
interface WalkCounts {
  hitTotal: number;
  jumps: number;
  shortSteps: number;
  returns: number;
}

/** The walk of `walkers` probes from the launch sphere; adds each hit to hits[ball]. */
function walkProbes(g: ProbeGeometry3d, rng: Random, walkers: number, minStep: number, launchMargin: number, hits: Float64Array): WalkCounts {
  const index = g.index;
  const ext = g.extent;
  const launch = ext + launchMargin;
  const launch2 = launch * launch;
  let hitTotal = 0;
  let jumps = 0;
  let shortSteps = 0;
  let returns = 0;
  for (let w = 0; w < walkers; w++) {
    sampleDirection3d(rng);
    let wx = launch * direction3.x;
    let wy = launch * direction3.y;
    let wz = launch * direction3.z;
    for (;;) {
      let r2 = wx * wx + wy * wy + wz * wz;
      if (r2 > launch2) {
        if (!returnToSphere(wx, wy, wz, launch, rng)) break; // escaped: a miss
        returns++;
        wx = returned3.x;
        wy = returned3.y;
        wz = returned3.z;
        r2 = launch2;
      }
      index.query(wx, wy, wz);
      let d = index.free;
      const reach = ext + d;
      if (r2 > reach * reach) d = Math.sqrt(r2) - ext;
      sampleDirection3d(rng);
      const ux = direction3.x;
      const uy = direction3.y;
      const uz = direction3.z;
      if (d >= minStep) {
        wx += d * ux;
        wy += d * uy;
        wz += d * uz;
        jumps++;
        continue;
      }
      shortSteps++;
      const j = firstContact3d(index.nearX, index.nearY, index.nearZ, index.nearCount, wx, wy, wz, ux, uy, uz, minStep, 1);
      if (j >= 0) {
        hits[index.nearId[j]]++;
        hitTotal++;
        break;
      }
      wx += minStep * ux;
      wy += minStep * uy;
      wz += minStep * uz;
    }
  }
  return { hitTotal, jumps, shortSteps, returns };
}

/** Run one probe job on the geometry. */
export function runProbe3dJob(g: ProbeGeometry3d, task: Probe3dTask): Probe3dResult {
  checkProbe3dTask(task);
  const rng = Random.forRun(task.seed, task.jobIndex, STREAM_PROBE);
  const hits = new Float64Array(g.count);
  const c = walkProbes(g, rng, task.walkers, task.minStep, task.launchMargin, hits);
  return { walkers: task.walkers, hits, hitTotal: c.hitTotal, launchRadius: (g.extent + task.launchMargin) * g.radius, jumps: c.jumps };
}

/**
 * One queueable probe job (ProbeTask → ProbeResult, the form of
 * worker/probe/probe-2d.ts) on a ball set: the same walk and draws as
 * runProbe3dJob; hits sparse; launchRadius (original units) set, so that
 * the Newtonian capacity is launchRadius · (Σ hits)/walkers. Refuses a task
 * planned for another set (digest) and a contact sample (none in 3D).
 */
export function runBallProbeJob(g: ProbeGeometry3d, task: ProbeTask): ProbeResult {
  checkProbeTask(task);
  if (task.contactSample !== 0) throw new RangeError(`contactSample must be 0 for a ball set (no contact points are kept in 3D), got ${task.contactSample}`);
  if (task.geometryDigest !== g.digest) throw new RangeError(`geometryDigest must match the ball set (${g.digest}), got "${task.geometryDigest}"`);
  const rng = Random.forRun(task.seed, task.jobIndex, STREAM_PROBE);
  const counts = new Float64Array(g.count);
  const c = walkProbes(g, rng, task.walkers, task.minStep, task.launchMargin, counts);
  return probeResultOf(task, counts, { x: [], y: [], id: [] }, { jumps: c.jumps, shortSteps: c.shortSteps, returns: c.returns }, (g.extent + task.launchMargin) * g.radius);
}

/** Newtonian capacity from probe counts (units: a ball of radius a has capacity a), with its binomial standard error. */
export function capacityFromProbes(hitTotal: number, walkers: number, launchRadius: number): { capacity: number; error: number } {
  const p = hitTotal / walkers;
  return { capacity: launchRadius * p, error: launchRadius * Math.sqrt((p * (1 - p)) / walkers) };
}

/** Run `jobs` jobs (walkers split as evenly as possible) and add them up. */
export function runProbe3d(g: ProbeGeometry3d, opts: { seed: string; walkers: number; jobs: number; minStep?: number; launchMargin?: number }): Probe3dResult {
  const hits = new Float64Array(g.count);
  let hitTotal = 0;
  let jumps = 0;
  let launchRadius = 0;
  for (let j = 0; j < opts.jobs; j++) {
    const walkers = Math.floor(opts.walkers / opts.jobs) + (j < opts.walkers % opts.jobs ? 1 : 0);
    if (walkers === 0) continue;
    const r = runProbe3dJob(g, { seed: opts.seed, jobIndex: j, walkers, minStep: opts.minStep ?? DEFAULT_PROBE3D_MIN_STEP, launchMargin: opts.launchMargin ?? 0 });
    for (let i = 0; i < g.count; i++) hits[i] += r.hits[i];
    hitTotal += r.hitTotal;
    jumps += r.jumps;
    launchRadius = r.launchRadius;
  }
  return { walkers: opts.walkers, hits, hitTotal, launchRadius, jumps };
}
