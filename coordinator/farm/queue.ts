/**
 * The run queue on the farm: BullMQ's queue "runs" on Redis, and cancelling
 * an ensemble's queued jobs. Launching (a plan becoming jobs whose ids make
 * queueing idempotent) is in coordinator/farm/launch.ts, shared with the
 * embedded mode; it is re-exported here for the farm's callers.
 */
import { Queue, type ConnectionOptions } from 'bullmq';
import type { Redis } from 'ioredis';
import { QUEUE_NAME } from '../../worker/runtime/job-contract.js';
import type { EnsembleStore } from './store.js';

export function runQueue(connection: Redis, prefix: string): Queue {
  return new Queue(QUEUE_NAME, { connection: connection as unknown as ConnectionOptions, prefix });
}

export { jobsOfPlan, launchEnsemble, type LaunchOptions } from './launch.js';

/** What cancelEnsemble did: cancelled now, was cancelled before, had already finished (done or failed: nothing changed), or no such ensemble. */
export type CancelOutcome = 'cancelled' | 'already-cancelled' | 'finished' | 'unknown';

/**
 * Mark an ensemble cancelled and drop its jobs that no worker holds; workers
 * stop the rest within seconds. A finished ensemble (done or failed) is left
 * as it is.
 */
export async function cancelEnsemble(store: EnsembleStore, queue: Queue, id: string): Promise<CancelOutcome> {
  const rec = await store.get(id);
  if (!rec) return 'unknown';
  const before = await store.status(id);
  if (before && (before.state === 'done' || before.state === 'failed')) return 'finished';
  if (before?.state === 'cancelled') return 'already-cancelled';
  await store.cancel(id);
  for (let j = 0; j < rec.jobs; j++) {
    try {
      await queue.remove(`${id}-${j}`);
    } catch {
      // held by a worker: it sees the cancel flag and finishes the job itself
    }
  }
  return 'cancelled';
}
