/**
 * The embedded mode's stand-in for the farm's BullMQ queue: the same
 * RunJobQueue interface (coordinator/farm/batch-contract.ts) that
 * launchEnsemble and advanceAdaptive queue jobs on, kept in memory.
 * Queueing is idempotent as on the farm (a job id already held is ignored);
 * the embedded loop takes the pending jobs in queueing order and reads their
 * payloads with the workers' own reader (readJobData).
 */
import type { RunTaskData } from '../../proto/convert.js';
import { readJobData } from '../../worker/runtime/job-contract.js';
import type { RunJob, RunJobQueue } from '../farm/batch-contract.js';

export class MemoryRunQueue implements RunJobQueue {
  private readonly ids = new Set<string>();
  private pending: RunJob[] = [];

  async addBulk(jobs: RunJob[]): Promise<void> {
    for (const j of jobs) {
      if (this.ids.has(j.opts.jobId)) continue;
      this.ids.add(j.opts.jobId);
      this.pending.push(j);
    }
  }

  /** Jobs queued so far. */
  get queued(): number {
    return this.ids.size;
  }

  /** Take every pending job, in queueing order, as the run tasks their payloads carry. */
  takeRuns(): RunTaskData[] {
    const jobs = this.pending;
    this.pending = [];
    return jobs.flatMap((j) => readJobData(j.data).tasks);
  }
}
