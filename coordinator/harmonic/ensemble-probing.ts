/**
 * Probing the clusters of an ensemble ([probe] table of the spec): the same
 * planning and analysis for the farm and the embedded mode.
 *
 * What is probed: cluster i of the ensemble at each size n of
 * probeSizesOf(spec) (the [probe] at_sizes and the final size). The set at
 * size n is the first n particle centres of the finished cluster, which is
 * exactly the cluster when it had n particles (particles are stored in
 * arrival order and never move). It is probed as disks of radius 1 (one
 * particle diameter) about the centres: the capture disks a growth walker's
 * centre sees, so the measure found is each particle's growth probability
 * (see worker/probe/probe-2d.ts). A 3D cluster is probed the same way as
 * balls of radius 1 about the centres (worker/probe/probe-3d.ts), with no
 * contact sample (contactSample 0 in its tasks).
 *
 * Seeds: the probe of (run i, size n) uses the 64-bit seed
 *   s(i, n) = mix64(mix64(ensemble seed ⊕ mix64(i + 1)) ⊕ mix64(n + 2^40))
 * (SplitMix64 finaliser, worker/core/random.ts) and its job j the stream
 * Random.forRun(s(i, n), j, STREAM_PROBE). So the probe of a cluster depends
 * only on (spec, run index, size, engine version), never on who runs which
 * job or in which order, and the hit counts of the jobs add up.
 */
import type { CheckpointData } from '../../proto/convert.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { axisOf } from '../../worker/core/positions.js';
import { planProbeJobs, DEFAULT_PROBE_LAUNCH_MARGIN, type ProbeResult, type ProbeTask } from '../../worker/probe/probe-2d.js';
import { isBallSet, probeSetDigest, type ProbeSet } from '../../worker/probe/probe-set.js';
import { mix64, parseSeed } from '../../worker/core/random.js';
import type { ProbeSpec } from '../spec/index.js';
import { analyseResults } from './probe-run.js';
import { clusterHarmonicOf, type ClusterHarmonic } from './cluster-harmonic.js';

/** Contact radius of a grown cluster's particles as probed (one particle diameter). */
export const CLUSTER_CONTACT_RADIUS = 1;

const MASK64 = (1n << 64n) - 1n;

/** The probe seed of (run, size); see the file header. */
export function probeSeedOf(ensembleSeed: string, runIndex: number, size: number): string {
  const a = mix64(parseSeed(ensembleSeed) ^ mix64(BigInt(runIndex) + 1n));
  return (mix64(a ^ mix64(BigInt(size) + (1n << 40n))) & MASK64).toString();
}

/** The set of the first `size` particles of a finished cluster (compact copies, cheap to send to a thread): disks in 2D, balls in 3D. */
export function clusterPrefix(final: ClusterPositions, size: number): ProbeSet {
  if (!Number.isInteger(size) || size < 1 || size > final.count) throw new RangeError(`probe size ${size} must be an integer from 1 to the cluster's ${final.count} particles`);
  if (final.dimension === 3) return { count: size, x: axisOf(final, 0, size), y: axisOf(final, 1, size), z: axisOf(final, 2, size), radius: CLUSTER_CONTACT_RADIUS };
  if (final.dimension !== 2) throw new RangeError(`probing needs a cluster of dimension 2 or 3; this one has dimension ${final.dimension}`);
  return { count: size, x: axisOf(final, 0, size), y: axisOf(final, 1, size), r: CLUSTER_CONTACT_RADIUS };
}

/** Positions of a final-state checkpoint. */
export function positionsOf(c: CheckpointData): ClusterPositions {
  return { dimension: c.state.dimension, count: c.state.count, coords: c.state.positions };
}

/** The probe jobs of (run, size) for a set with the given digest; a 3D set keeps no contact sample. */
export function probeTasksOf(p: ProbeSpec, ensembleSeed: string, runIndex: number, size: number, digest: string, dimension: 2 | 3 = 2): ProbeTask[] {
  return planProbeJobs(digest, probeSeedOf(ensembleSeed, runIndex, size), p.walkers, p.jobs, dimension === 3 ? 0 : p.contactSample, p.minStep, DEFAULT_PROBE_LAUNCH_MARGIN);
}

/** The probe jobs of (run, size) of a set. */
export function probeTasksOfSet(p: ProbeSpec, ensembleSeed: string, runIndex: number, size: number, set: ProbeSet): ProbeTask[] {
  return probeTasksOf(p, ensembleSeed, runIndex, size, probeSetDigest(set), isBallSet(set) ? 3 : 2);
}

/** The growth exponent η of a model that has one (a parameter named `eta`, as in the dielectric breakdown model), else null. */
export function breakdownEtaOf(model: { params: Record<string, number> }): number | null {
  const eta = model.params.eta;
  return typeof eta === 'number' && Number.isFinite(eta) ? eta : null;
}

/** Digest of the set of (final cluster, size). */
export function prefixDigest(final: ClusterPositions, size: number): string {
  return probeSetDigest(clusterPrefix(final, size));
}

/**
 * Analyse the complete job results of one (run, size): they must be exactly
 * the planned jobs 0 … jobs−1 (checked), in any order.
 */
export function analyseProbedCluster(
  set: ProbeSet, results: readonly ProbeResult[], p: ProbeSpec, runIndex: number, size: number, breakdownEta: number | null = null,
): { record: ClusterHarmonic; counts: Float64Array } {
  const sorted = [...results].sort((a, b) => a.jobIndex - b.jobIndex);
  if (sorted.length !== p.jobs || sorted.some((r, j) => r.jobIndex !== j))
    throw new RangeError(`probe of run ${runIndex} at size ${size}: expected job results 0..${p.jobs - 1}, got ${sorted.map((r) => r.jobIndex).join(',')}`);
  const digest = probeSetDigest(set);
  for (const r of sorted) if (r.geometryDigest !== digest) throw new RangeError(`probe of run ${runIndex} at size ${size}: job ${r.jobIndex} ran on set ${r.geometryDigest}, not ${digest}`);
  const a = analyseResults(set, sorted, p.q, p.window);
  return { record: clusterHarmonicOf(runIndex, size, a.measures, a.counts, breakdownEta), counts: a.counts };
}

