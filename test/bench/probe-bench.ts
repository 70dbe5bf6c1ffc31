/**
 * Probe benchmark: grow one DLA cluster (default 10^5 particles; --particles N,
 * e.g. 1000000), then run probe walkers on it in this thread (one core) and
 * report walkers per second (default 10^5 walkers; --walkers W).
 *
 *   node dist/test/bench/probe-bench.js [--particles N] [--walkers W]
 *
 * Prints a human-readable line and one JSON line.
 */
import { axisOf } from '../../worker/core/positions.js';
import { createKernel, defaultModelParams } from '../../worker/models/registry.js';
import { ProbeGeometry, planProbeJobs, runProbeJob } from '../../worker/probe/probe-2d.js';
import { argValue, isEntryPoint } from './bench-process.js';

export interface ProbeBenchmarkResult {
  benchmark: 'probe';
  particles: number;
  walkers: number;
  growSeconds: number;
  indexSeconds: number;
  probeSeconds: number;
  walkersPerSecond: number;
  jumpsPerWalker: number;
  shortStepsPerWalker: number;
  returnsPerWalker: number;
}

export function runProbeBenchmark(particles = 100_000, walkers = 100_000): ProbeBenchmarkResult {
  const kernel = createKernel({ model: defaultModelParams('dla-offlattice-2d'), particles, ensembleSeed: '2026', runIndex: 0, recordsPerDecade: 10 });
  let t = performance.now();
  kernel.growTo(particles);
  const growSeconds = (performance.now() - t) / 1000;
  const p = kernel.positions();
  t = performance.now();
  const g = new ProbeGeometry({ count: particles, x: axisOf(p, 0), y: axisOf(p, 1), r: 1 });
  const indexSeconds = (performance.now() - t) / 1000;
  const [task] = planProbeJobs(g, '1', walkers, 1, 0);
  t = performance.now();
  const r = runProbeJob(g, task);
  const probeSeconds = (performance.now() - t) / 1000;
  return {
    benchmark: 'probe', particles, walkers, growSeconds, indexSeconds, probeSeconds,
    walkersPerSecond: walkers / probeSeconds,
    jumpsPerWalker: r.counters.jumps / walkers,
    shortStepsPerWalker: r.counters.shortSteps / walkers,
    returnsPerWalker: r.counters.returns / walkers,
  };
}

if (isEntryPoint(import.meta.url)) {
  const r = runProbeBenchmark(argValue(process.argv, '--particles', 100_000), argValue(process.argv, '--walkers', 100_000));
  process.stdout.write(`probe: ${r.walkers} walkers on ${r.particles} particles: ${r.probeSeconds.toFixed(2)} s, ${Math.round(r.walkersPerSecond)} walkers/s\n`);
  process.stdout.write(JSON.stringify(r) + '\n');
}
