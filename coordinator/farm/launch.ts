/**
 * Launching an ensemble: its plan becomes jobs on the run queue, one per
 * group of runs (see coordinator/plan.ts). Job ids are "<ensemble id>-<job
 * index>", so launching the same plan twice never queues a job twice.
 * The farm launches on Redis and BullMQ (coordinator/farm/queue.ts), the
 * embedded mode on its in-memory store and queue; both through the
 * interfaces of coordinator/farm/batch-contract.ts. No queue library is
 * loaded here.
 *
 * Job payload (version 1): { v: 1, ensembleId, tasks: [base64 RunTask protobuf, ...] }
 */
import { encodeRunTask } from '../../proto/convert.js';
import { JOB_PAYLOAD_VERSION, type RunJobData } from '../../worker/runtime/job-contract.js';
import { newEnsembleId, planEnsemble, type PlannedJob } from '../plan.js';
import type { EnsembleSpec } from '../spec/index.js';
import { newAdaptiveHistory } from '../summary/adaptive.js';
import type { BatchStore, RunJob, RunJobQueue } from './batch-contract.js';

export interface LaunchOptions {
  ensembleId?: string;
  /** Attempts per job before it fails for good (crashes and stalls do not use attempts up). */
  attempts?: number;
}

/** BullMQ job descriptions of planned jobs; the job id "<ensemble id>-<job index>" makes queueing idempotent. */
export function jobsOfPlan(id: string, planned: PlannedJob[], attempts = 5): RunJob[] {
  return planned.map((j) => ({
    name: 'grow',
    data: { v: JOB_PAYLOAD_VERSION, ensembleId: id, tasks: j.runs.map((r) => Buffer.from(encodeRunTask(r)).toString('base64')) } satisfies RunJobData,
    opts: {
      jobId: `${id}-${j.jobIndex}`,
      attempts,
      backoff: { type: 'exponential' as const, delay: 5000 },
      removeOnComplete: { age: 7 * 86400, count: 10000 },
      removeOnFail: { age: 30 * 86400 },
    },
  }));
}

/**
 * Record the ensemble and queue its jobs; returns the ensemble id. An
 * adaptive spec queues its first batch (runs 0..clusters-1); later batches
 * are added by coordinator/farm/adaptive.ts. The farm passes its Redis store
 * and BullMQ queue, the embedded mode its in-memory ones
 * (coordinator/farm/batch-contract.ts).
 */
export async function launchEnsemble(store: BatchStore, queue: RunJobQueue, spec: EnsembleSpec, opts: LaunchOptions = {}): Promise<string> {
  const id = opts.ensembleId ?? newEnsembleId();
  const plan = planEnsemble(id, spec);
  const adaptive = spec.target ? newAdaptiveHistory(spec) : null;
  adaptive?.batches.push({ batch: 0, fromRun: 0, toRun: spec.clusters, firstJob: 0, jobs: plan.jobs.length, judged: null });
  await store.create(id, spec, plan.jobs.length, Date.now(), adaptive);
  const jobs = jobsOfPlan(id, plan.jobs, opts.attempts ?? 5);
  for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
  if (adaptive) await store.markQueued(id, spec.clusters);
  return id;
}

