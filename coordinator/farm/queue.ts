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
import { JOB_PAYLOAD_VERSION, QUEUE_NAME, type RunJobData } from '../../worker/queue-processor.js';
import { newEnsembleId, planEnsemble } from '../plan.js';
import type { EnsembleSpec } from '../spec/index.js';
import { EnsembleStore } from './store.js';

export function runQueue(connection: Redis, prefix: string): Queue {
  return new Queue(QUEUE_NAME, { connection: connection as unknown as ConnectionOptions, prefix });
}

export interface LaunchOptions {
  ensembleId?: string;
  /** Attempts per job before it fails for good (crashes and stalls do not use attempts up). */
  attempts?: number;
}

/** Record the ensemble and queue its jobs; returns the ensemble id. */
export async function launchEnsemble(store: EnsembleStore, queue: Queue, spec: EnsembleSpec, opts: LaunchOptions = {}): Promise<string> {
  const id = opts.ensembleId ?? newEnsembleId();
  const plan = planEnsemble(id, spec);
  await store.create(id, spec, plan.jobs.length);
  const jobs = plan.jobs.map((j) => ({
    name: 'grow',
    data: { v: JOB_PAYLOAD_VERSION, ensembleId: id, tasks: j.runs.map((r) => Buffer.from(encodeRunTask(r)).toString('base64')) } satisfies RunJobData,
    opts: {
      jobId: `${id}-${j.jobIndex}`,
      attempts: opts.attempts ?? 5,
      backoff: { type: 'exponential', delay: 5000 },
      removeOnComplete: { age: 7 * 86400, count: 10000 },
      removeOnFail: { age: 30 * 86400 },
    },
  }));
  for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
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
