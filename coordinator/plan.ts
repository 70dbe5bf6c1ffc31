/**
 * Planning: an ensemble spec becomes one run task per cluster, grouped into
 * queue jobs of `runsPerJob` runs. Run i gets the stream (ensemble seed, run
 * index i) of worker/core/random.ts, so a run's result depends only on the spec
 * and the engine version, never on how the runs are grouped or who runs them.
 */
import { randomBytes } from 'node:crypto';
import type { RunTaskData } from '../proto/convert.js';
import { ENGINE_VERSION } from '../worker/core/engine-version.js';
import { maxRunsOf, type EnsembleSpec } from './spec/index.js';

export interface PlannedJob {
  /** 0-based index of the job within its ensemble. */
  jobIndex: number;
  runs: RunTaskData[];
}

export interface EnsemblePlan {
  ensembleId: string;
  spec: EnsembleSpec;
  engineVersion: string;
  jobs: PlannedJob[];
}

/** A fresh ensemble id: "e" + base-36 time + 8 random hex digits (sortable by creation time). */
export function newEnsembleId(now = Date.now()): string {
  return `e${now.toString(36)}${randomBytes(4).toString('hex')}`;
}

export const ENSEMBLE_ID_PATTERN = /^[A-Za-z0-9_-]{1,64}$/;

/** The run task of run `runIndex` of an ensemble. */
export function runTaskFor(ensembleId: string, spec: EnsembleSpec, runIndex: number): RunTaskData {
  const max = maxRunsOf(spec);
  if (!Number.isInteger(runIndex) || runIndex < 0 || runIndex >= max) {
    throw new RangeError(`run index ${runIndex} is outside 0..${max - 1}`);
  }
  return {
    ensembleId,
    runIndex,
    ensembleSeed: spec.seed,
    model: { ...spec.model },
    particles: spec.particles,
    recordsPerDecade: spec.recordsPerDecade,
    checkpointIntervalSeconds: spec.checkpointIntervalSeconds,
    checkpointEveryParticles: spec.checkpointEveryParticles,
    engineVersion: ENGINE_VERSION,
    ...(spec.probe || spec.positions ? { keepPositions: true } : {}),
  };
}

/**
 * The jobs of runs [fromRun, toRun) (default: the first batch, runs 0 ..
 * clusters-1), numbered from firstJobIndex. An adaptive ensemble plans each
 * later batch this way; run i is the same task whichever batch holds it.
 */
export function planEnsemble(ensembleId: string, spec: EnsembleSpec, fromRun = 0, toRun = spec.clusters, firstJobIndex = 0): EnsemblePlan {
  if (!ENSEMBLE_ID_PATTERN.test(ensembleId)) throw new RangeError(`ensemble id "${ensembleId}" must match ${ENSEMBLE_ID_PATTERN}`);
  const jobs: PlannedJob[] = [];
  for (let start = fromRun, j = firstJobIndex; start < toRun; start += spec.runsPerJob, j++) {
    const runs: RunTaskData[] = [];
    for (let i = start; i < Math.min(toRun, start + spec.runsPerJob); i++) runs.push(runTaskFor(ensembleId, spec, i));
    jobs.push({ jobIndex: j, runs });
  }
  return { ensembleId, spec, engineVersion: ENGINE_VERSION, jobs };
}
