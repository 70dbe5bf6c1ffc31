/**
 * Embedded probing: plan the probe jobs of a set (disks in 2D or balls in
 * 3D, worker/probe/probe-set.ts), run them in this process
 * or on a pool of T probe threads (worker/runtime/probe-thread-pool.ts; results put
 * back in job order, so the counts do not depend on T), add the counts, and
 * analyse.
 * Halves for the convergence flags: even jobs and odd jobs.
 */
import {
  addProbeCounts, planProbeJobs,
  DEFAULT_PROBE_LAUNCH_MARGIN, DEFAULT_PROBE_MIN_STEP, type ProbeResult, type ProbeTask,
} from '../../worker/probe/probe-2d.js';
import { isBallSet, plainProbeSet, prepareProbe, probeSetDigest, probedPointsOf, type ProbeSet } from '../../worker/probe/probe-set.js';
import { ProbeThreadPool } from '../../worker/runtime/probe-thread-pool.js';
import { analyzeProbe, type HarmonicMeasures } from './probe-analysis.js';

export interface ProbeRunOptions {
  walkers: number;
  seed: string;
  jobs: number;
  threads: number;
  q: number[];
  contactSample: number;
  minStep?: number;
  launchMargin?: number;
  /** Fit window relative to R (fit-window.ts); null or absent: the default rule. */
  window?: [number, number] | null;
}

export interface ProbeRun {
  tasks: ProbeTask[];
  results: ProbeResult[];
  counts: Float64Array;
  contactX: number[];
  contactY: number[];
  measures: HarmonicMeasures;
  seconds: number;
}

/**
 * The jobs of probing a set with these settings (job j draws from the probe
 * stream j of the seed): the one plan of `tendril probe` on a set and of a
 * probe request on the farm (coordinator/farm/probe-requests.ts), so both give
 * the same measures. A ball set keeps no contact points.
 */
export function planProbeRun(set: ProbeSet, digest: string, o: Pick<ProbeRunOptions, 'walkers' | 'seed' | 'jobs' | 'contactSample' | 'minStep' | 'launchMargin'>): ProbeTask[] {
  return planProbeJobs(digest, o.seed, o.walkers, o.jobs, isBallSet(set) ? 0 : o.contactSample,
    o.minStep ?? DEFAULT_PROBE_MIN_STEP, o.launchMargin ?? DEFAULT_PROBE_LAUNCH_MARGIN);
}

export async function runProbes(set: ProbeSet, o: ProbeRunOptions): Promise<ProbeRun> {
  const geometry = o.threads <= 1 ? prepareProbe(set) : null;
  const digest = geometry ? geometry.digest : probeSetDigest(set);
  const tasks = planProbeRun(set, digest, o);
  const t0 = performance.now();
  let results: ProbeResult[];
  if (o.threads <= 1) {
    results = tasks.map((t) => geometry!.run(t));
  } else {
    const plain = plainProbeSet(set);
    const pool = new ProbeThreadPool(Math.min(o.threads, tasks.length));
    try {
      results = await Promise.all(tasks.map((t) => pool.run(digest, () => plain, t)));
    } finally {
      await pool.close();
    }
  }
  const seconds = (performance.now() - t0) / 1000;
  return { tasks, results, ...analyseResults(set, results, o.q, o.window ?? null), seconds };
}

/**
 * Add job results and analyse them (also usable on results gathered from a
 * queue). A ball set (3D) is analysed with its z axis and the jobs' launch
 * radius and walkers, for the Newtonian capacity. For a lattice set the
 * measure sits on its perimeter sites (probedPointsOf) and the capacity is
 * the lattice one (log-capacity.ts, latticePairValue).
 */
export function analyseResults(probed: ProbeSet, results: ProbeResult[], q: number[], window: [number, number] | null = null): Omit<ProbeRun, 'tasks' | 'results' | 'seconds'> {
  const set = isBallSet(probed) ? probed : probedPointsOf(probed);
  const counts = addProbeCounts(set.count, results);
  const halves: [Float64Array, Float64Array] | null = results.length >= 2
    ? [addProbeCounts(set.count, results.filter((r) => r.jobIndex % 2 === 0)), addProbeCounts(set.count, results.filter((r) => r.jobIndex % 2 === 1))]
    : null;
  const contactX = results.flatMap((r) => r.contactX);
  const contactY = results.flatMap((r) => r.contactY);
  const ball = isBallSet(set);
  let launched: { launchRadius: number; walkers: number[] } | undefined;
  if (ball) {
    const radii = results.map((r) => r.launchRadius);
    const launchRadius = radii[0];
    if (typeof launchRadius !== 'number' || radii.some((v) => v !== launchRadius))
      throw new RangeError('probe results of a ball set must all carry the same launchRadius');
    launched = { launchRadius, walkers: results.map((r) => r.walkers) };
  }
  const measures = analyzeProbe({
    count: set.count, x: set.x, y: set.y, ...(ball ? { z: set.z, r: set.radius, launched } : { r: set.r }), counts, halves,
    contactX, contactY, contactCount: contactX.length, contactJobSizes: results.map((r) => r.contactX.length), q, relativeWindow: window,
    ...(!isBallSet(set) && set.lattice ? { lattice: set.lattice } : {}),
  });
  return { counts, contactX, contactY, measures };
}
