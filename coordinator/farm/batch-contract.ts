/**
 * What the batch loop of an ensemble needs from its storage and its queue,
 * written down once so the farm and the embedded mode run the same loop
 * (launchEnsemble in coordinator/farm/queue.ts, advanceAdaptive in
 * coordinator/farm/adaptive.ts):
 *
 *   BatchStore    the ensemble's record and results: the farm's Redis
 *                 EnsembleStore, or the embedded MemoryBatchStore
 *                 (coordinator/embedded/in-memory-stores.ts)
 *   RunJobQueue   where planned jobs go: BullMQ's Queue on the farm, or the
 *                 embedded MemoryRunQueue (coordinator/embedded/in-memory-queue.ts).
 *                 Queueing is idempotent: a job id already held is ignored.
 */
import type { RunResultData } from '../../proto/convert.js';
import type { RunJobData } from '../../worker/runtime/job-contract.js';
import type { EnsembleSpec } from '../spec/index.js';
import type { AdaptiveHistory } from '../summary/adaptive.js';
import type { EnsembleRecord } from './store.js';

export interface BatchStore {
  /** Record a new ensemble (its planned clusters are spec.clusters); throws when the id exists. */
  create(id: string, spec: EnsembleSpec, jobs: number, createdAtMs?: number, adaptive?: AdaptiveHistory | null): Promise<void>;
  get(id: string): Promise<EnsembleRecord | null>;
  /** Runs of the ensemble with a stored result. */
  resultCount(id: string): Promise<number>;
  /** Stored results, in run-index order. */
  results(id: string): Promise<RunResultData[]>;
  /** The atomic batch step: set planned clusters, jobs and history only if the planned count is still `expectedClusters` and the outcome is still running; true when this call made it. */
  extendAdaptive(id: string, expectedClusters: number, newClusters: number, newJobs: number, history: AdaptiveHistory): Promise<boolean>;
  /** Record that the jobs of runs 0..through-1 are queued (never lowers it). */
  markQueued(id: string, through: number): Promise<void>;
}

/** One queued job of runs: the payload every worker reads with readJobData, and the id that makes queueing idempotent. */
export interface RunJob {
  name: string;
  data: RunJobData;
  opts: { jobId: string; attempts: number; backoff: { type: 'exponential'; delay: number }; removeOnComplete: { age: number; count: number }; removeOnFail: { age: number } };
}

export interface RunJobQueue {
  addBulk(jobs: RunJob[]): Promise<unknown>;
}
