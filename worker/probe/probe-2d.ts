/**
 * Harmonic-measure probing of a planar set of disks (pure: no I/O).
 *
 * The set (exact definition)
 *  - K = union of closed disks D(p_i, r_i), i = 0 … n−1, with centres p_i and
 *    contact radii r_i > 0. A probe walker is a *point* performing planar
 *    Brownian motion started from infinity; it touches disk i at the first
 *    instant |w − p_i| = r_i. The probe records which disk it touched first
 *    (ties between overlapping disks go to the one reached first along the
 *    path) and the contact point. The share of probes touching disk i is
 *    the harmonic measure (from infinity) of ∂K carried by disk i.
 *  - How our grown clusters map to this: a growth walker is a disk of
 *    diameter d whose *centre* stops when it comes within d of a cluster
 *    centre. That is exactly a point walker touching disks of radius d
 *    around the centres (the capture disks). So a cluster snapshot of
 *    diameter d is probed as the set with r_i = d for every i, and the
 *    measure found is the growth probability of each particle. A user's CSV
 *    of x, y, r rows is probed with r_i = r as given.
 *
 * How it is simulated (the growth walk of worker/models/dla-offlattice-2d/kernel.ts
 * without sticking; lengths are internally divided by s = max r_i, after
 * moving the origin to the centre of the bounding box of the centres)
 *  1. Launch uniformly on the circle of radius R_L = R_ext + launchMargin
 *     (default margin 0: the smallest circle about the origin enclosing K),
 *     R_ext = max(|p_i| + r_i): exact for a walker from infinity.
 *  2. Outside R_L the walker is returned to that circle by the exact
 *     exterior Poisson kernel (worker/walkers/poisson-return-2d.ts).
 *  3. Walk-on-spheres: the occupancy index (worker/index/occupancy-index-2d.ts,
 *     built on the scaled centres, where every scaled radius is ≤ 1) gives
 *     a lower bound on (nearest centre distance − 1) ≤ the distance to ∂K.
 *     When the index scanned exactly, the distance to ∂K is computed exactly
 *     from the listed centres (every centre within 2, and a centre farther
 *     than 2 leaves a gap of more than 1 to its disk, since r ≤ 1). Also
 *     |w| − R_ext is a free radius. Far from the set a dense grid of free
 *     distances (a distance transform, see buildFreeGrid) answers first,
 *     with an exact lower bound. If the free radius d ≥ minStep the
 *     walker jumps to a uniform point on the circle of radius d (exact).
 *  4. Otherwise (within minStep of ∂K) the final approach. Let i be the
 *     nearest disk, δ the distance to it and D the distance to the nearest
 *     OTHER disk (exact, from the listed centres; ≤ 1). When D ≥ minStep,
 *     the walker takes an exact lens step (worker/walkers/lens-exit-2d.ts):
 *     it leaves B(w, D') \ D_i, D' = min(D, δ + r_i), which meets no other
 *     disk, at a point sampled exactly by conformal maps; on disk i's arc
 *     that is its first contact, else it continues from the exit point.
 *  5. Only when two disks are both within minStep (the concave junction
 *     between touching or overlapping disks, where the harmonic measure is
 *     small) does it take one straight step of length minStep in a uniform
 *     direction, stopping at the exact first contact with a disk.
 * The one approximation is step 5, confined to concave junctions. Before
 * the lens step, straight steps were used everywhere within minStep of ∂K
 * (as growth still does): that loses hits at convex vertices (reported:
 * 0.992 of the vertex disks' share on a sharp polygon at minStep 0.02;
 * measured here: −0.94% on a triangle's vertex disks at 0.1, and a loss not
 * resolved at 4·10^6 walkers, −0.13% ± 0.16%, at 0.02);
 * test/probe-final-approach.slow.test.ts measures the vertex shares with
 * both and against the straight step at a 10 times smaller minStep.
 * Everything else is exact up to floating-point rounding.
 * ProbeWalk's `straightFinal` option restores the old straight final approach
 * everywhere (for that comparison only; jobs always use the lens step).
 *
 * Limits: an exact scan of the index lists at most 256 centres, so a set may
 * not hold more than 256 centres in any 3 × 3 block of index cells (cells
 * of side 2·max r); this is checked when the geometry is built, and sets
 * with very disparate radii or heavily overlapping disks are refused with a
 * one-line message. The far-field grid holds at most 2^24 cells (its side
 * doubles until it fits): at most 128 MB during the build (an int32 and a
 * float32 grid), 64 MB kept, in shared memory (ProbeGeometry.shared).
 *
 * Jobs and determinism: probing is split into independent jobs; job j uses
 * Random.forRun(seed, j, STREAM_PROBE) and is a function of (geometry, task)
 * only. Hit counts of jobs add up; the contact sample of a job is the
 * contact points of its first `contactSample` probes (independent draws
 * from the harmonic measure).
 */

import { ENGINE_VERSION } from '../core/engine-version.js';
import { OccupancyIndex2d, type SharedOccupancyIndex2d } from '../index/occupancy-index-2d.js';
import { sharedFloat64 } from '../core/shared-arrays.js';
import { returnToCircle, returned } from '../walkers/poisson-return-2d.js';
import { Random, STREAM_PROBE, parseSeed } from '../core/random.js';
import { direction, sampleDirection } from '../walkers/uniform-direction.js';
import { contact, firstContact } from '../walkers/segment-contact-2d.js';
import { probeGeometryProblem, probeMinStepFloor } from './probe-limits.js';
import { lensExit, lensExitPoint } from '../walkers/lens-exit-2d.js';

/** Default straight-step length near contact, in units of the largest contact radius. */
export const DEFAULT_PROBE_MIN_STEP = 0.02;
/** Default launch margin, in units of the largest contact radius. */
export const DEFAULT_PROBE_LAUNCH_MARGIN = 0;
/** At most this many centres may lie in one 3 × 3 block of index cells. */
const MAX_BLOCK = 256;

/** One probe job: plain JSON, so it can be queued. The geometry travels separately (snapshot artifact or CSV). */
export interface ProbeTask {
  /** Unsigned 64-bit seed as a decimal string. */
  seed: string;
  /** Job index j: the job draws from Random.forRun(seed, j, STREAM_PROBE). */
  jobIndex: number;
  /** Probe walkers in this job. */
  walkers: number;
  /** Contact points kept (the first ones of the job), 0 … walkers. */
  contactSample: number;
  /** Straight-step length near contact, in units of the largest contact radius, (0, 1]. */
  minStep: number;
  /** Launch and return circle margin beyond the set, in units of the largest contact radius, [0, 1000]. */
  launchMargin: number;
  /** Digest of the geometry (ProbeGeometry.digest); a job refuses a different set. */
  geometryDigest: string;
}

/** Result of one probe job: plain JSON. Hits are sparse: disks with at least one hit, ascending. */
export interface ProbeResult {
  engineVersion: string;
  seed: string;
  jobIndex: number;
  walkers: number;
  geometryDigest: string;
  hitIds: number[];
  hitCounts: number[];
  /** Contact points (original coordinates) and the disk touched, of the first contactSample probes. */
  contactX: number[];
  contactY: number[];
  contactId: number[];
  /** shortSteps counts final-approach steps: lens steps and straight steps. */
  counters: { jumps: number; shortSteps: number; returns: number };
  /**
   * Ball sets only (worker/probe/probe-3d.ts): radius of the launch sphere in
   * the set's units. In 3D a probe may escape, so Σ hits ≤ walkers, and
   * launchRadius · Σ hits / walkers is the Newtonian capacity.
   */
  launchRadius?: number;
}

/** A planar set of disks, in original coordinates. */
export type { DiskSet } from './disk-set.js';
import type { DiskSet } from './disk-set.js';
import { setDigest } from './set-digest.js';

/**
 * Digest of a disk set: "n-" + FNV-1a (32 bit) over the float64 words of
 * x, y and r of every disk in order (worker/probe/set-digest.ts).
 */
export function diskSetDigest(set: DiskSet): string {
  return setDigest(set.count, [set.x, set.y, set.r], [], '');
}

/**
 * A prepared disk set in shared memory (ProbeGeometry.shared): every array
 * a SharedArrayBuffer, so probe threads given it read one copy of the
 * index and grid (worker/runtime/probe-thread-pool.ts) instead of each
 * building its own; `new ProbeGeometry(shared)` answers exactly as the
 * geometry it was taken from.
 */
export interface SharedDiskGeometry {
  kind: 'shared-disk-geometry';
  count: number;
  centreX: number;
  centreY: number;
  scale: number;
  extent: number;
  radii: Float64Array | null;
  digest: string;
  index: SharedOccupancyIndex2d;
  gridFree: Float32Array;
  gridCells: number;
  gridSide: number;
  gridMin: number;
}

function isSharedDiskGeometry(v: DiskSet | SharedDiskGeometry): v is SharedDiskGeometry {
  return (v as SharedDiskGeometry).kind === 'shared-disk-geometry';
}

/** The prepared set: scaled coordinates and the occupancy index, reusable by many jobs. */
export class ProbeGeometry {
  readonly count: number;
  /** Origin shift and scale: original = centre + s · scaled. */
  readonly centreX: number;
  readonly centreY: number;
  readonly scale: number;
  /** max(|p_i| + r_i) in scaled units. */
  readonly extent: number;
  /** Scaled radii (null when all equal 1 after scaling). */
  readonly radii: Float64Array | null;
  readonly digest: string;
  readonly index: OccupancyIndex2d;
  /** Dense free-distance grid (see buildFreeGrid): cells of side gridSide over [gridMin, gridMin + gridCells·gridSide)². */
  readonly gridFree: Float32Array;
  readonly gridCells: number;
  readonly gridSide: number;
  readonly gridMin: number;

  /** From a set (built here), or from a shared geometry (nothing built: its arrays are read in place). */
  constructor(from: DiskSet | SharedDiskGeometry) {
    if (isSharedDiskGeometry(from)) {
      this.count = from.count;
      this.centreX = from.centreX;
      this.centreY = from.centreY;
      this.scale = from.scale;
      this.extent = from.extent;
      this.radii = from.radii;
      this.digest = from.digest;
      this.index = new OccupancyIndex2d(0, undefined, from.index);
      this.gridFree = from.gridFree;
      this.gridCells = from.gridCells;
      this.gridSide = from.gridSide;
      this.gridMin = from.gridMin;
      return;
    }
    const set = from;
    const n = set.count;
    if (!Number.isSafeInteger(n) || n < 1) throw new RangeError(`point set must hold at least 1 disk, got ${n}`);
    let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity, rMax = 0;
    let uniform = true;
    const r0 = typeof set.r === 'number' ? set.r : set.r[0];
    for (let i = 0; i < n; i++) {
      const x = set.x[i];
      const y = set.y[i];
      const r = typeof set.r === 'number' ? set.r : set.r[i];
      if (!Number.isFinite(x) || !Number.isFinite(y)) throw new RangeError(`disk ${i}: coordinates must be finite, got (${x}, ${y})`);
      if (!(Number.isFinite(r) && r > 0)) throw new RangeError(`disk ${i}: contact radius must be a finite number > 0, got ${r}`);
      if (r !== r0) uniform = false;
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
      if (r > rMax) rMax = r;
    }
    const shapeProblem = probeGeometryProblem(set, null, 'point set');
    if (shapeProblem !== null) throw new RangeError(shapeProblem);
    this.count = n;
    this.centreX = 0.5 * (minX + maxX);
    this.centreY = 0.5 * (minY + maxY);
    this.scale = rMax;
    const inv = 1 / rMax;
    // scaled centres, interleaved (x0, y0, x1, y1, …), in shared memory: the index reads them in
    // place (its positions array) and a shared geometry passes them on without a copy
    const xy = new Float64Array(new SharedArrayBuffer(16 * n));
    this.radii = uniform ? null : new Float64Array(n);
    let ext = 0;
    for (let i = 0; i < n; i++) {
      const r = typeof set.r === 'number' ? set.r : set.r[i];
      const ux = (set.x[i] - this.centreX) * inv;
      const uy = (set.y[i] - this.centreY) * inv;
      xy[2 * i] = ux;
      xy[2 * i + 1] = uy;
      const rr = uniform ? 1 : r * inv;
      if (this.radii !== null) this.radii[i] = rr;
      const e = Math.sqrt(ux * ux + uy * uy) + rr;
      if (e > ext) ext = e;
    }
    this.extent = ext;
    this.digest = diskSetDigest(set);
    checkDensity(xy, n);
    this.index = new OccupancyIndex2d(n, xy);
    for (let i = 0; i < n; i++) this.index.insert(xy[2 * i], xy[2 * i + 1]);
    // grid: side a power of two >= 2 with at most 2^24 cells, covering the enclosing circle
    let side = 2;
    while (((2 * ext) / side + 2) ** 2 > 16_777_216) side *= 2;
    const cells = Math.ceil((2 * ext) / side) + 2;
    this.gridSide = side;
    this.gridCells = cells;
    this.gridMin = -0.5 * cells * side;
    this.gridFree = buildFreeGrid(xy, n, this.gridMin, side, cells);
  }

  /** This geometry in shared memory (the grid and the scaled centres already are; the index's cells and the radii are copied once). */
  shared(): SharedDiskGeometry {
    return {
      kind: 'shared-disk-geometry',
      count: this.count,
      centreX: this.centreX,
      centreY: this.centreY,
      scale: this.scale,
      extent: this.extent,
      radii: this.radii === null ? null : sharedFloat64(this.radii),
      digest: this.digest,
      index: this.index.shared(),
      gridFree: this.gridFree,
      gridCells: this.gridCells,
      gridSide: this.gridSide,
      gridMin: this.gridMin,
    };
  }
}

/**
 * Far-field acceleration for a set that does not change while probed: a
 * dense grid holding, per cell, a lower bound on (distance from any point of
 * the cell to the nearest centre) − 1, which bounds the distance to ∂K since
 * every scaled radius is ≤ 1. With e = the exact Euclidean distance between
 * the cell's centre and the nearest centre of a cell holding a disk centre
 * (Felzenszwalb & Huttenlocher 2012, Theory of Computing 8, 415, the
 * separable squared-distance transform; citation from memory), any walker w
 * in the cell and centre p satisfy |w − p| ≥ e − side·√2 (each is within
 * side/√2 of its cell centre), so the cell stores e − side·√2 − 1.
 */
function buildFreeGrid(xy: Float64Array, n: number, min: number, side: number, cells: number): Float32Array {
  // squared distances in cells are integers below 2·cells² <= 2^26 (cells² <= 2^24 + a border), so
  // int32 holds them exactly (half the memory of float64, the same values); INF marks "no centre yet"
  const INF = 2147483647;
  const f = new Int32Array(cells * cells).fill(INF);
  for (let i = 0; i < n; i++) {
    const cx = Math.floor((xy[2 * i] - min) / side);
    const cy = Math.floor((xy[2 * i + 1] - min) / side);
    f[cy * cells + cx] = 0;
  }
  const line = new Float64Array(cells);
  const out = new Float64Array(cells);
  const v = new Int32Array(cells);
  const z = new Float64Array(cells + 1);
  const pass = (get: (k: number) => number, set: (k: number, val: number) => void): void => {
    for (let k = 0; k < cells; k++) line[k] = get(k);
    let kk = 0;
    v[0] = 0;
    z[0] = -Infinity;
    z[1] = Infinity;
    for (let q = 1; q < cells; q++) {
      if (line[q] >= INF) continue;
      if (line[v[kk]] >= INF) { v[kk] = q; continue; }
      let sIntersect = (line[q] + q * q - (line[v[kk]] + v[kk] * v[kk])) / (2 * q - 2 * v[kk]);
      while (sIntersect <= z[kk]) {
        kk--;
        sIntersect = (line[q] + q * q - (line[v[kk]] + v[kk] * v[kk])) / (2 * q - 2 * v[kk]);
      }
      kk++;
      v[kk] = q;
      z[kk] = sIntersect;
      z[kk + 1] = Infinity;
    }
    if (line[v[0]] >= INF) { for (let q = 0; q < cells; q++) set(q, INF); return; }
    kk = 0;
    for (let q = 0; q < cells; q++) {
      while (z[kk + 1] < q) kk++;
      out[q] = (q - v[kk]) * (q - v[kk]) + line[v[kk]];
    }
    for (let q = 0; q < cells; q++) set(q, out[q]);
  };
  for (let y = 0; y < cells; y++) pass((k) => f[y * cells + k], (k, val) => { f[y * cells + k] = val; });
  for (let x = 0; x < cells; x++) pass((k) => f[k * cells + x], (k, val) => { f[k * cells + x] = val; });
  // in shared memory from the start: a geometry shared between probe threads (ProbeGeometry.shared) passes it on as it is
  const g = new Float32Array(new SharedArrayBuffer(4 * cells * cells));
  const slack = side * Math.SQRT2 + 1;
  for (let k = 0; k < g.length; k++) {
    const b = Math.sqrt(f[k]) * side - slack;
    g[k] = b - 1e-5 * (1 + Math.abs(b)); // margin for rounding to float32 (relative error < 6e-8)
  }
  return g;
}

/** Refuse sets with more than MAX_BLOCK scaled centres in a 3 × 3 block of side-2 cells. */
function checkDensity(xy: Float64Array, n: number): void {
  // cell keys cx * 2^22 + cy are exact integers: |cx|, |cy| < 2^21 for any set the index can hold
  const cells = new Map<number, number>();
  for (let i = 0; i < n; i++) {
    const k = Math.floor(xy[2 * i] * 0.5) * 4194304 + Math.floor(xy[2 * i + 1] * 0.5);
    cells.set(k, (cells.get(k) ?? 0) + 1);
  }
  let worst = 0;
  for (const key of cells.keys()) {
    let s = 0;
    for (let dx = -1; dx <= 1; dx++) for (let dy = -1; dy <= 1; dy++) s += cells.get(key + dx * 4194304 + dy) ?? 0;
    if (s > worst) worst = s;
  }
  if (worst > MAX_BLOCK)
    throw new RangeError(
      `point set has ${worst} disk centres within a 6 x 6 square of the largest contact radius; at most ${MAX_BLOCK} are allowed (radii too disparate or disks overlapping too much)`,
    );
}

/** Throws a RangeError naming the first bad field of a probe task. */
export function checkProbeTask(task: ProbeTask): void {
  parseSeed(task.seed);
  if (!Number.isSafeInteger(task.jobIndex) || task.jobIndex < 0) throw new RangeError(`jobIndex must be a non-negative integer, got ${task.jobIndex}`);
  if (!Number.isSafeInteger(task.walkers) || task.walkers < 1 || task.walkers > 1e10)
    throw new RangeError(`walkers must be an integer in [1, 10000000000], got ${task.walkers}`);
  if (!Number.isSafeInteger(task.contactSample) || task.contactSample < 0 || task.contactSample > task.walkers)
    throw new RangeError(`contactSample must be an integer in [0, ${task.walkers}], got ${task.contactSample}`);
  if (!(task.minStep > 0 && task.minStep <= 1)) throw new RangeError(`minStep must be in (0, 1], got ${task.minStep}`);
  if (!(task.launchMargin >= 0 && task.launchMargin <= 1000)) throw new RangeError(`launchMargin must be in [0, 1000], got ${task.launchMargin}`);
}

/** Run one probe job on a prepared geometry. */
export function runProbeJob(geometry: ProbeGeometry, task: ProbeTask): ProbeResult {
  const floor = probeMinStepFloor(geometry.extent);
  if (!(task.minStep >= floor)) throw new RangeError(`minStep ${task.minStep} is below ${floor}, the floor for a set spanning ${geometry.extent.toPrecision(3)} contact radii`);
  checkProbeTask(task);
  if (task.geometryDigest !== geometry.digest)
    throw new RangeError(`geometryDigest must match the point set (${geometry.digest}), got "${task.geometryDigest}"`);
  const counts = new Float64Array(geometry.count);
  const sample = task.contactSample;
  const cX = new Float64Array(sample);
  const cY = new Float64Array(sample);
  const cId = new Int32Array(sample);
  const rng = Random.forRun(task.seed, task.jobIndex, STREAM_PROBE);
  const counters = { jumps: 0, shortSteps: 0, returns: 0 };
  const walk = new ProbeWalk(geometry, task.minStep, task.launchMargin, rng);
  for (let w = 0; w < task.walkers; w++) {
    const id = walk.run();
    counts[id]++;
    if (w < sample) {
      cX[w] = geometry.centreX + geometry.scale * walk.hitX;
      cY[w] = geometry.centreY + geometry.scale * walk.hitY;
      cId[w] = id;
    }
  }
  counters.jumps = walk.jumps;
  counters.shortSteps = walk.shortSteps;
  counters.returns = walk.returns;
  return probeResultOf(task, counts, { x: Array.from(cX), y: Array.from(cY), id: Array.from(cId) }, counters);
}

/**
 * The result of a probe job from its dense hit counts (kept sparse: the
 * points hit, ascending, with their counts), its sampled contacts and
 * counters; launchRadius for ball sets only. Used by the disk, ball and
 * lattice jobs alike.
 */
export function probeResultOf(
  task: ProbeTask,
  counts: Float64Array,
  contacts: { x: number[]; y: number[]; id: number[] },
  counters: ProbeResult['counters'],
  launchRadius?: number,
): ProbeResult {
  const hitIds: number[] = [];
  const hitCounts: number[] = [];
  for (let i = 0; i < counts.length; i++) if (counts[i] > 0) { hitIds.push(i); hitCounts.push(counts[i]); }
  return {
    engineVersion: ENGINE_VERSION,
    seed: task.seed,
    jobIndex: task.jobIndex,
    walkers: task.walkers,
    geometryDigest: task.geometryDigest,
    hitIds,
    hitCounts,
    contactX: contacts.x,
    contactY: contacts.y,
    contactId: contacts.id,
    counters,
    ...(launchRadius === undefined ? {} : { launchRadius }),
  };
}

/** Add the hit counts of several jobs into one dense array of length `count`. */
export function addProbeCounts(count: number, results: readonly ProbeResult[]): Float64Array {
  const out = new Float64Array(count);
  for (const r of results) {
    for (let k = 0; k < r.hitIds.length; k++) {
      const id = r.hitIds[k];
      if (!(id >= 0 && id < count)) throw new RangeError(`probe result of job ${r.jobIndex}: hit id ${id} outside [0, ${count})`);
      out[id] += r.hitCounts[k];
    }
  }
  return out;
}

/** The walker state machine; one instance per job (no allocation per walker). */
export class ProbeWalk {
  hitX = 0;
  hitY = 0;
  jumps = 0;
  shortSteps = 0;
  returns = 0;
  private readonly g: ProbeGeometry;
  private readonly minStep: number;
  private readonly launch: number;
  private readonly rng: Random;
  private readonly straightFinal: boolean;

  /** straightFinal: straight final steps everywhere within minStep of the set (the old final approach; for comparisons only). */
  constructor(g: ProbeGeometry, minStep: number, launchMargin: number, rng: Random, straightFinal = false) {
    this.g = g;
    this.minStep = minStep;
    this.launch = g.extent + launchMargin;
    this.rng = rng;
    this.straightFinal = straightFinal;
  }

  /** Run one walker from infinity to its first contact; returns the disk index, contact point in hitX/hitY (scaled). */
  run(): number {
    const rng = this.rng;
    const index = this.g.index;
    const radii = this.g.radii;
    const minStep = this.minStep;
    const ext = this.g.extent;
    const launch = this.launch;
    const launch2 = launch * launch;
    const grid = this.g.gridFree;
    const gCells = this.g.gridCells;
    const gMin = this.g.gridMin;
    const gInv = 1 / this.g.gridSide;
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
        this.returns++;
      }
      const gx = Math.floor((wx - gMin) * gInv);
      const gy = Math.floor((wy - gMin) * gInv);
      if (gx >= 0 && gy >= 0 && gx < gCells && gy < gCells) {
        const gf = grid[gy * gCells + gx];
        if (gf >= 1) {
          // far from the set: the grid bound (and the radial bound) suffice
          let d = gf;
          const rr = Math.sqrt(r2) - ext;
          if (rr > d) d = rr;
          sampleDirection(rng);
          wx += d * direction.x;
          wy += d * direction.y;
          this.jumps++;
          continue;
        }
      }
      index.query(wx, wy);
      let d = index.free;
      const nearCount = index.nearCount;
      const nearX = index.nearX;
      const nearY = index.nearY;
      const nearId = index.nearId;
      if (radii !== null && nearCount >= 0) {
        // exact distance to the union of disks of radius <= 1; centres not listed are > 2 away
        let gap = 1;
        for (let j = 0; j < nearCount; j++) {
          const qx = wx - nearX[j];
          const qy = wy - nearY[j];
          const e = Math.sqrt(qx * qx + qy * qy) - radii[nearId[j]];
          if (e < gap) gap = e;
        }
        if (gap > d) d = gap;
      }
      const reach = ext + d;
      if (r2 > reach * reach) d = Math.sqrt(r2) - ext;

      if (d >= minStep) {
        sampleDirection(rng);
        wx += d * direction.x;
        wy += d * direction.y;
        this.jumps++;
        continue;
      }
      if (!this.straightFinal) {
        // nearest disk i (gap g1) and the gap g2 to the nearest other disk; unlisted centres are > 2 away (gap > 1)
        let g1 = Infinity;
        let g2 = 1;
        let i1 = -1;
        for (let j = 0; j < nearCount; j++) {
          const qx = wx - nearX[j];
          const qy = wy - nearY[j];
          const e = Math.sqrt(qx * qx + qy * qy) - (radii === null ? 1 : radii[nearId[j]]);
          if (e < g1) { g2 = g1 < g2 ? g1 : g2; g1 = e; i1 = j; } else if (e < g2) g2 = e;
        }
        if (i1 >= 0 && g1 > 0 && g2 >= minStep) {
          const rho = radii === null ? 1 : radii[nearId[i1]];
          const lensR = g2 < g1 + rho ? g2 : g1 + rho;
          lensExit(wx, wy, nearX[i1], nearY[i1], rho, lensR, rng);
          this.shortSteps++;
          if (lensExitPoint.onDisk) {
            this.hitX = lensExitPoint.x;
            this.hitY = lensExitPoint.y;
            return nearId[i1];
          }
          wx = lensExitPoint.x;
          wy = lensExitPoint.y;
          continue;
        }
      }
      sampleDirection(rng);
      const cx = direction.x;
      const cy = direction.y;
      // straight step of length minStep with exact first contact (d < minStep <= 1: the scan was exact)
      const hit = firstContact(nearX, nearY, nearCount, wx, wy, cx, cy, minStep, radii, nearId);
      this.shortSteps++;
      if (hit >= 0) {
        this.hitX = wx + contact.t * cx;
        this.hitY = wy + contact.t * cy;
        return nearId[hit];
      }
      wx += minStep * cx;
      wy += minStep * cy;
    }
  }
}

/** The tasks of a probe of `walkers` probes split into `jobs` jobs (job sizes differ by at most one); `geometry` may be given by its digest alone. */
export function planProbeJobs(
  geometry: ProbeGeometry | string, seed: string, walkers: number, jobs: number, contactSampleTotal: number,
  minStep = DEFAULT_PROBE_MIN_STEP, launchMargin = DEFAULT_PROBE_LAUNCH_MARGIN,
): ProbeTask[] {
  if (!Number.isSafeInteger(jobs) || jobs < 1 || jobs > walkers) throw new RangeError(`jobs must be an integer in [1, ${walkers}], got ${jobs}`);
  const tasks: ProbeTask[] = [];
  const base = Math.floor(walkers / jobs);
  const extra = walkers - base * jobs;
  const sBase = Math.floor(contactSampleTotal / jobs);
  const sExtra = contactSampleTotal - sBase * jobs;
  for (let j = 0; j < jobs; j++) {
    const w = base + (j < extra ? 1 : 0);
    tasks.push({
      seed: parseSeed(seed).toString(),
      jobIndex: j,
      walkers: w,
      contactSample: Math.min(w, sBase + (j < sExtra ? 1 : 0)),
      minStep,
      launchMargin,
      geometryDigest: typeof geometry === 'string' ? geometry : geometry.digest,
    });
  }
  return tasks;
}
