/**
 * Queueing: an ensemble's plan becomes BullMQ jobs on the queue "runs", one
 * per group of runs (see coordinator/plan.ts). Job ids are "<ensemble id>-<job
 * index>", so launching the same plan twice never queues a job twice.
 *
 * Job payload (version 1): { v: 1, ensembleId, tasks: [base64 RunTask protobuf, ...] }
 */
import { Queue, type ConnectionOptions } from 'bullmq';
import type { Redis } from 'ioredis';
import { encodeRunTask } from '../../proto/convert.js';
import { JOB_PAYLOAD_VERSION, QUEUE_NAME, type RunJobData } from '../../worker/runtime/job-contract.js';
import { newEnsembleId, planEnsemble, type PlannedJob } from '../plan.js';
import type { EnsembleSpec } from '../spec/index.js';
import { newAdaptiveHistory } from '../summary/adaptive.js';
import { EnsembleStore } from './store.js';

export function runQueue(connection: Redis, prefix: string): Queue {
  return new Queue(QUEUE_NAME, { connection: connection as unknown as ConnectionOptions, prefix });
}

export interface LaunchOptions {
  ensembleId?: string;
  /** Attempts per job before it fails for good (crashes and stalls do not use attempts up). */
  attempts?: number;
}

/** BullMQ job descriptions of planned jobs; the job id "<ensemble id>-<job index>" makes queueing idempotent. */
export function jobsOfPlan(id: string, planned: PlannedJob[], attempts = 5) {
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
 * are added by coordinator/farm/adaptive.ts.
 */
export async function launchEnsemble(store: EnsembleStore, queue: Queue, spec: EnsembleSpec, opts: LaunchOptions = {}): Promise<string> {
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

/** Mark an ensemble cancelled and drop its jobs that no worker holds; workers stop the rest within seconds. */
export async function cancelEnsemble(store: EnsembleStore, queue: Queue, id: string): Promise<boolean> {
  const rec = await store.get(id);
  if (!rec) return false;
  await store.cancel(id);
  for (let j = 0; j < rec.jobs; j++) {
    try {
      await queue.remove(`${id}-${j}`);
    } catch {
      // held by a worker: it sees the cancel flag and finishes the job itself
    }
  }
  return true;
}
