/**
 * One entry point for every planar probe: a disk set (worker/probe/probe-2d.ts)
 * or a lattice set (DiskSet.lattice set; worker/probe/probe-lattice.ts).
 * The probed points are the disks themselves, or the perimeter sites of the
 * lattice set; hit ids and counts index those points.
 */
import type { DiskSet } from './disk-set.js';
import { ProbeGeometry, diskSetDigest, runProbeJob, type ProbeResult, type ProbeTask } from './probe-2d.js';
import { LatticeProbeGeometry, latticePerimeterOf, latticeSetDigest, runLatticeProbeJob } from './probe-lattice.js';

export type PlanarProbeGeometry = ProbeGeometry | LatticeProbeGeometry;

/** Prepare a set for probing (disks or lattice sites). */
export function probeGeometryOf(set: DiskSet): PlanarProbeGeometry {
  return set.lattice ? new LatticeProbeGeometry(set) : new ProbeGeometry(set);
}

/** Run one job on a prepared set. */
export function runPlanarProbeJob(g: PlanarProbeGeometry, task: ProbeTask): ProbeResult {
  return g instanceof LatticeProbeGeometry ? runLatticeProbeJob(g, task) : runProbeJob(g, task);
}

/** The digest a task must carry for this set. */
export function probeSetDigest(set: DiskSet): string {
  return set.lattice ? latticeSetDigest(set) : diskSetDigest(set);
}

/** The points that carry the measure: the disks, or the lattice set's perimeter sites (radius ½). */
export function probedPointsOf(set: DiskSet): DiskSet {
  if (!set.lattice) return set;
  const p = latticePerimeterOf(set);
  return { count: p.count, x: p.x, y: p.y, r: p.r, lattice: set.lattice };
}
