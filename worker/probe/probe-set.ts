/**
 * The set a probe job runs on, in any dimension: a planar set of disks
 * (DiskSet, worker/probe/probe-2d.ts) or a set of balls in 3D (BallSet,
 * worker/probe/probe-3d.ts). A set is a ball set when it has a z axis.
 *
 * prepareProbe builds the geometry of either kind once; its run() takes the
 * same queueable ProbeTask and returns the same ProbeResult, so probe
 * threads, the embedded mode and the farm handle both dimensions through
 * this one door (pure: no I/O).
 */
import { ProbeGeometry, diskSetDigest, runProbeJob, type ProbeResult, type ProbeTask } from './probe-2d.js';
import { ProbeGeometry3d, ballSetDigest, runBallProbeJob, type BallSet } from './probe-3d.js';
import type { DiskSet } from './disk-set.js';

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
  return isBallSet(set) ? ballSetDigest(set) : diskSetDigest(set);
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
  const g = new ProbeGeometry(set);
  return { digest: g.digest, run: (task) => runProbeJob(g, task) };
}

/** Compact copies of a set's arrays (cheap to send to a thread). */
export function plainProbeSet(set: ProbeSet): ProbeSet {
  if (isBallSet(set)) return { count: set.count, x: Float64Array.from(set.x), y: Float64Array.from(set.y), z: Float64Array.from(set.z), radius: set.radius };
  return { count: set.count, x: Float64Array.from(set.x), y: Float64Array.from(set.y), r: typeof set.r === 'number' ? set.r : Float64Array.from(set.r) };
}
