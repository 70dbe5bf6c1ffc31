/**
 * Embedded probing: plan the probe jobs of a set, run them in this process
 * or on T worker threads (jobs dealt round-robin; results put back in job
 * order, so the counts do not depend on T), add the counts, and analyse.
 * Halves for the convergence flags: even jobs and odd jobs.
 */
import { Worker } from 'node:worker_threads';
import {
  ProbeGeometry, addProbeCounts, planProbeJobs, runProbeJob,
  DEFAULT_PROBE_LAUNCH_MARGIN, DEFAULT_PROBE_MIN_STEP, type DiskSet, type ProbeResult, type ProbeTask,
} from '../../worker/probe-2d.js';
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

function runOnThread(set: DiskSet, tasks: ProbeTask[]): Promise<ProbeResult[]> {
  return new Promise((resolve, reject) => {
    const w = new Worker(new URL('../../worker/probe-thread.js', import.meta.url), { workerData: { set, tasks } });
    w.once('message', (m: ProbeResult[]) => resolve(m));
    w.once('error', reject);
    w.once('exit', (code) => { if (code !== 0) reject(new Error(`probe thread exited with code ${code}`)); });
  });
}

export async function runProbes(set: DiskSet, o: ProbeRunOptions): Promise<ProbeRun> {
  const geometry = new ProbeGeometry(set);
  const tasks = planProbeJobs(geometry, o.seed, o.walkers, o.jobs, o.contactSample,
    o.minStep ?? DEFAULT_PROBE_MIN_STEP, o.launchMargin ?? DEFAULT_PROBE_LAUNCH_MARGIN);
  const t0 = performance.now();
  let results: ProbeResult[];
  if (o.threads <= 1) {
    results = tasks.map((t) => runProbeJob(geometry, t));
  } else {
    const plain: DiskSet = { count: set.count, x: Array.from(set.x), y: Array.from(set.y), r: typeof set.r === 'number' ? set.r : Array.from(set.r) };
    const groups: ProbeTask[][] = Array.from({ length: Math.min(o.threads, tasks.length) }, () => []);
    tasks.forEach((t, j) => groups[j % groups.length].push(t));
    results = (await Promise.all(groups.map((g) => runOnThread(plain, g)))).flat();
    results.sort((a, b) => a.jobIndex - b.jobIndex);
  }
  const seconds = (performance.now() - t0) / 1000;
  return { tasks, results, ...analyseResults(set, results, o.q), seconds };
}

/** Add job results and analyse them (also usable on results gathered from a queue). */
export function analyseResults(set: DiskSet, results: ProbeResult[], q: number[]): Omit<ProbeRun, 'tasks' | 'results' | 'seconds'> {
  const counts = addProbeCounts(set.count, results);
  const halves: [Float64Array, Float64Array] | null = results.length >= 2
    ? [addProbeCounts(set.count, results.filter((r) => r.jobIndex % 2 === 0)), addProbeCounts(set.count, results.filter((r) => r.jobIndex % 2 === 1))]
    : null;
  const contactX = results.flatMap((r) => r.contactX);
  const contactY = results.flatMap((r) => r.contactY);
  const measures = analyzeProbe({
    count: set.count, x: set.x, y: set.y, r: set.r, counts, halves,
    contactX, contactY, contactCount: contactX.length, q,
  });
  return { counts, contactX, contactY, measures };
}
