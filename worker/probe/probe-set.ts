/**
 * The set a probe job runs on, in any dimension: a planar set of disks
 * (DiskSet, worker/probe/probe-2d.ts; with its `lattice` field set, the
 * sites of a lattice cluster, probed by lattice walkers, worker/probe/probe-lattice.ts)
 * or a set of balls in 3D (BallSet, worker/probe/probe-3d.ts). A set is a
 * ball set when it has a z axis.
 *
 * prepareProbe builds the geometry of either kind once; its run() takes the
 * same queueable ProbeTask and returns the same ProbeResult, so probe
 * threads, the embedded mode and the farm handle both dimensions through
 * this one door (pure: no I/O).
 */
import { ProbeGeometry, diskSetDigest, runProbeJob, type ProbeResult, type ProbeTask, type SharedDiskGeometry } from './probe-2d.js';
import { ProbeGeometry3d, ballSetDigest, runBallProbeJob, type BallSet } from './probe-3d.js';
import type { DiskSet } from './disk-set.js';
import { LatticeProbeGeometry, latticePerimeterOf, latticeSetDigest, runLatticeProbeJob } from './probe-lattice.js';

export type ProbeSet = DiskSet | BallSet;

/** Whether a set is a 3D ball set (it has a z axis). */
export function isBallSet(set: ProbeSet): set is BallSet {
  return (set as BallSet).z !== undefined;
}

/** Spatial dimension of a probe set. */
export function probeSetDimension(set: ProbeSet): 2 | 3 {
  return isBallSet(set) ? 3 : 2;
}

/** The digest a probe task carries for this set (diskSetDigest or ballSetDigest). */
export function probeSetDigest(set: ProbeSet): string {
  if (isBallSet(set)) return ballSetDigest(set);
  return set.lattice ? latticeSetDigest(set) : diskSetDigest(set);
}

/** A set prepared for probing: its digest and a job runner. */
export interface PreparedProbe {
  readonly digest: string;
  run(task: ProbeTask): ProbeResult;
}

/** Prepare a set of either kind (throws a RangeError naming what is wrong with it). */
export function prepareProbe(set: ProbeSet): PreparedProbe {
  if (isBallSet(set)) {
    const g = new ProbeGeometry3d(set);
    return { digest: g.digest, run: (task) => runBallProbeJob(g, task) };
  }
  if (set.lattice) {
    const lg = new LatticeProbeGeometry(set);
    return { digest: lg.digest, run: (task) => runLatticeProbeJob(lg, task) };
  }
  const g = new ProbeGeometry(set);
  return { digest: g.digest, run: (task) => runProbeJob(g, task) };
}

/**
 * A prepared set that probe threads share (worker/runtime/probe-thread-pool.ts):
 * built once, in shared memory. Only planar disk sets are shared so far;
 * ball sets (3D) and lattice sets are still prepared by each thread.
 */
export type SharedProbe = SharedDiskGeometry;

/** Whether prepareSharedProbe can share this set's geometry between threads. */
export function isShareableProbeSet(set: ProbeSet): boolean {
  return !isBallSet(set) && !set.lattice;
}

/**
 * Prepare a set in shared memory (throws a RangeError naming what is wrong
 * with it, as prepareProbe): the prepared probe, reading the shared copy
 * (the geometry built on the way is dropped), and that shared copy to
 * post to other threads; null for a set that is not shareable.
 */
export function prepareSharedProbe(set: ProbeSet): { prepared: PreparedProbe; shared: SharedProbe } | null {
  if (isBallSet(set) || set.lattice) return null;
  const shared = new ProbeGeometry(set).shared();
  return { prepared: preparedOfShared(shared), shared };
}

/** The prepared probe of a shared geometry (nothing is built: the shared arrays are read in place). */
export function preparedOfShared(shared: SharedProbe): PreparedProbe {
  const g = new ProbeGeometry(shared);
  return { digest: g.digest, run: (task) => runProbeJob(g, task) };
}

/** Compact copies of a set's arrays (cheap to send to a thread). */
export function plainProbeSet(set: ProbeSet): ProbeSet {
  if (isBallSet(set)) return { count: set.count, x: Float64Array.from(set.x), y: Float64Array.from(set.y), z: Float64Array.from(set.z), radius: set.radius };
  return { count: set.count, x: Float64Array.from(set.x), y: Float64Array.from(set.y), r: typeof set.r === 'number' ? set.r : Float64Array.from(set.r), ...(set.lattice ? { lattice: set.lattice } : {}) };
}

/**
 * The points that carry the measure of a planar set: the disks, or the
 * perimeter sites (radius ½) of a lattice set (worker/probe/probe-lattice.ts);
 * hit ids and counts index these points.
 */
export function probedPointsOf(set: DiskSet): DiskSet {
  if (!set.lattice) return set;
  const p = latticePerimeterOf(set);
  return { count: p.count, x: p.x, y: p.y, r: p.r, lattice: set.lattice };
}
