/**
 * Adaptive ensembles on the farm: when the last run of a batch is stored,
 * judge the ensemble (coordinator/summary/adaptive.ts) and either record the
 * outcome or plan and queue the next batch.
 *
 * Where the loop lives: `advanceAdaptive` is called by every worker right
 * after it stores a result (so no extra process is needed), and a periodic
 * sweep in `tendril worker` and `tendril serve` calls it for every adaptive
 * ensemble still growing (so a worker that dies between storing the last
 * result and queueing the next batch delays the batch by one sweep, no more).
 *
 * Crash safety and "never twice":
 *   1. The decision is a pure function of the stored results of runs
 *      0..K-1, so every caller that sees the batch complete computes the
 *      same decision.
 *   2. The step is one atomic Redis script (EnsembleStore.extendAdaptive):
 *      it writes the new planned count, job count and history only if the
 *      planned count is still K and no outcome is recorded. Of several
 *      callers exactly one wins; the others change nothing.
 *   3. Queueing follows the step and is idempotent: job ids are
 *      "<ensemble>-<job index>" with job indices fixed by the step, BullMQ
 *      ignores an id it already holds, and a worker skips runs whose result
 *      is stored. Until queued_through reaches the planned count, every call
 *      re-queues the jobs of the batches beyond it, so a crash between the
 *      step and the queueing loses nothing.
 *
 * The embedded mode runs this same step on its in-memory store and queue
 * (coordinator/farm/batch-contract.ts; coordinator/embedded/index.ts drains
 * the queue, grows the runs, and calls advanceAdaptive after each batch).
 */
import type { Queue } from 'bullmq';
import { planEnsemble } from '../plan.js';
import { judgeBatch, type AdaptiveHistory } from '../summary/adaptive.js';
import { jobsOfPlan } from './launch.js';
import type { EnsembleStore } from './store.js';
import type { BatchStore, RunJobQueue } from './batch-contract.js';
import { messageOf } from '../../proto/errors.js';

export type AdvanceResult = 'not-adaptive' | 'unknown' | 'stopped' | 'waiting' | 'extended' | 'lost-race' | 'finished';

/** Queue the jobs of every batch beyond queued_through (idempotent). */
async function ensureQueued(store: BatchStore, queue: RunJobQueue, id: string, history: AdaptiveHistory, queuedThrough: number): Promise<void> {
  const rec = await store.get(id);
  if (!rec) return;
  for (const b of history.batches) {
    if (b.toRun <= queuedThrough) continue;
    const plan = planEnsemble(id, rec.spec, b.fromRun, b.toRun, b.firstJob);
    const jobs = jobsOfPlan(id, plan.jobs);
    for (let i = 0; i < jobs.length; i += 500) await queue.addBulk(jobs.slice(i, i + 500));
    await store.markQueued(id, b.toRun);
  }
}

/**
 * One step of an adaptive ensemble's loop; safe to call any time, from any
 * number of processes at once.
 */
export async function advanceAdaptive(store: BatchStore, queue: RunJobQueue, id: string): Promise<AdvanceResult> {
  const rec = await store.get(id);
  if (!rec) return 'unknown';
  if (!rec.adaptive) return 'not-adaptive';
  const h = rec.adaptive;
  if (rec.queuedThrough < rec.plannedClusters) await ensureQueued(store, queue, id, h, rec.queuedThrough);
  if (rec.cancelled || h.outcome !== 'running') return 'stopped';
  if ((await store.resultCount(id)) < rec.plannedClusters) return 'waiting';
  const results = await store.results(id);
  const last = h.batches[h.batches.length - 1];
  const j = judgeBatch(rec.spec, results.filter((r) => r.runIndex < rec.plannedClusters));
  const { nextBatch, ...judged } = j;
  const next: AdaptiveHistory = { ...h, batches: h.batches.map((b) => (b === last ? { ...b, judged } : b)) };
  let newClusters = rec.plannedClusters;
  let newJobs = rec.jobs;
  if (j.action === 'continue') {
    const plan = planEnsemble(id, rec.spec, rec.plannedClusters, rec.plannedClusters + nextBatch, rec.jobs);
    newClusters += nextBatch;
    newJobs += plan.jobs.length;
    next.batches.push({ batch: last.batch + 1, fromRun: rec.plannedClusters, toRun: newClusters, firstJob: rec.jobs, jobs: plan.jobs.length, judged: null });
  } else {
    next.outcome = j.action;
    next.reason = j.reason;
  }
  if (!(await store.extendAdaptive(id, rec.plannedClusters, newClusters, newJobs, next))) return 'lost-race';
  if (j.action !== 'continue') return 'finished';
  await ensureQueued(store, queue, id, next, rec.queuedThrough);
  return 'extended';
}

/** Advance every adaptive ensemble still growing; errors are reported per ensemble and never thrown. */
export async function sweepAdaptive(store: EnsembleStore, queue: Queue, log?: (line: string) => void): Promise<void> {
  let ids: string[];
  try {
    ids = await store.runningAdaptiveIds();
  } catch (err) {
    log?.(`adaptive sweep: ${(err as Error).message}`);
    return;
  }
  for (const id of ids) {
    try {
      await advanceAdaptive(store, queue, id);
    } catch (err) {
      log?.(`adaptive ensemble ${id}: ${messageOf(err)}`);
    }
  }
}

/** Run sweepAdaptive every `everyMs` until the returned stop function is called. */
export function startAdaptiveSweeps(store: EnsembleStore, queue: Queue, everyMs: number, log?: (line: string) => void): () => Promise<void> {
  let running: Promise<void> = Promise.resolve();
  let stopped = false;
  const timer = setInterval(() => {
    running = running.then(() => (stopped ? undefined : sweepAdaptive(store, queue, log)));
  }, everyMs);
  timer.unref();
  return async () => {
    stopped = true;
    clearInterval(timer);
    await running;
  };
}
