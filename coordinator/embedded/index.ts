/**
 * Embedded mode: the same plan, kernel, task runner and summary as the farm,
 * with an in-process pool of worker threads instead of BullMQ and Redis.
 *
 * An adaptive spec ([target]) grows batch after batch: after each complete
 * batch the stopping rule (coordinator/summary/adaptive.ts) judges all
 * results so far and either stops or sizes the next batch. A resumed run
 * replays the same decisions, since they depend only on the stored results.
 *
 * When an artifact store is given, checkpoints and finished results are kept
 * there (keys as in the farm), so an interrupted `tendril run` continues
 * where it stopped when started again with the same spec and output folder.
 */
import { availableParallelism } from 'node:os';
import { decodeRunResult, encodeRunResult, type RunResultData, type RunTaskData } from '../../proto/convert.js';
import { TaskThreadPool, type ThreadOutcome, type ThreadRun } from '../../worker/task-thread.js';
import { checkpointKey, type ArtifactStore } from '../farm/artifacts.js';
import { planEnsemble, type PlannedJob } from '../plan.js';
import { maxRunsOf, type EnsembleSpec } from '../spec/index.js';
import { buildSummary, defaultSummaryOptions, judgeBatch, newAdaptiveHistory, type AdaptiveBatch, type AdaptiveHistory, type SummaryOptions } from '../summary/index.js';
import type { EnsembleSummaryData } from '../../proto/convert.js';

export interface EmbeddedProgress {
  runsDone: number;
  runsTotal: number;
  particlesDone: number;
  particlesTotal: number;
}

export interface EmbeddedOptions {
  /** Worker threads (default: available cores). */
  threads?: number;
  ensembleId: string;
  /** Keeps checkpoints and finished results; enables resuming an interrupted run. */
  store?: ArtifactStore;
  onProgress?: (p: EmbeddedProgress) => void;
  /** When aborted, running clusters checkpoint (if a store is given) and the call rejects. */
  signal?: AbortSignal;
  /** Summary options; default defaultSummaryOptions() (the full analysis). */
  summary?: SummaryOptions;
  createdAtMs?: number;
  /** Adaptive ensembles: called after each batch is judged. */
  onBatch?: (b: AdaptiveBatch) => void;
}

export interface EmbeddedOutcome {
  ensembleId: string;
  results: RunResultData[];
  summary: EnsembleSummaryData;
  /** Runs taken from the store instead of being grown again. */
  reused: number;
  wallSeconds: number;
  /** Batch history of an adaptive ensemble; null for a fixed count. */
  adaptive: AdaptiveHistory | null;
}

export class EmbeddedAborted extends Error {
  override name = 'EmbeddedAborted';
  /** Results finished before the interruption (run-index order) and the clusters planned so far. */
  results: RunResultData[] = [];
  clustersPlanned = 0;
  adaptive: AdaptiveHistory | null = null;
}

const resultKey = (id: string, i: number) => `${id}/run-${i}.result`;

export async function runEmbedded(spec: EnsembleSpec, opts: EmbeddedOptions): Promise<EmbeddedOutcome> {
  const t0 = Date.now();
  const maxRuns = maxRunsOf(spec);
  const pool = new TaskThreadPool(Math.max(1, Math.min(opts.threads ?? availableParallelism(), maxRuns)));
  const store = opts.store;
  const results = new Map<number, RunResultData>();
  const live = new Map<number, number>();
  let planned = spec.clusters;
  let reused = 0;
  const report = () => {
    let p = 0;
    for (const r of results.values()) p += r.particles;
    for (const c of live.values()) p += c;
    opts.onProgress?.({ runsDone: results.size, runsTotal: planned, particlesDone: p, particlesTotal: planned * spec.particles });
  };

  /** Results of earlier (interrupted) invocations, from the store. */
  const reuse = async (runs: RunTaskData[]) => {
    if (!store) return;
    for (const run of runs) {
      const bytes = await store.get(resultKey(opts.ensembleId, run.runIndex));
      if (!bytes) continue;
      try {
        const r = decodeRunResult(bytes);
        if (r.runIndex === run.runIndex && r.particles === run.particles && r.ensembleSeed === run.ensembleSeed && r.engineVersion === run.engineVersion) {
          results.set(run.runIndex, r);
          reused++;
        }
      } catch {
        // an unreadable stored result is grown again
      }
    }
  };

  const adaptive = spec.target ? newAdaptiveHistory(spec) : null;
  const active = new Set<ThreadRun>();
  const onAbort = () => {
    for (const a of active) a.stop();
  };
  const grow = async (runs: RunTaskData[]) => {
    const failures: string[] = [];
    await Promise.all(
      runs
        .filter((run) => !results.has(run.runIndex))
        .map(async (run) => {
          if (opts.signal?.aborted) return;
          const key = checkpointKey(opts.ensembleId, run.runIndex);
          const checkpoint = store ? ((await store.get(key)) ?? undefined) : undefined;
          let writes = Promise.resolve();
          const handle = pool.run(run, {
            checkpoint,
            workerId: 'embedded',
            onProgress: (p) => {
              live.set(run.runIndex, p.count);
              report();
            },
            onCheckpoint: (bytes) => {
              if (store) writes = writes.then(() => store.put(key, bytes));
            },
          });
          active.add(handle);
          if (opts.signal?.aborted) handle.stop();
          const outcome: ThreadOutcome = await handle.outcome;
          active.delete(handle);
          await writes;
          live.delete(run.runIndex);
          if (outcome.status === 'done') {
            results.set(run.runIndex, outcome.result);
            if (store) {
              await store.put(resultKey(opts.ensembleId, run.runIndex), encodeRunResult(outcome.result));
              await store.delete(key);
            }
            report();
          } else if (outcome.status === 'stopped') {
            if (store) await store.put(key, outcome.checkpoint);
          } else {
            failures.push(`run ${run.runIndex}: ${outcome.message}`);
          }
        }),
    );
    if (opts.signal?.aborted) {
      const e = new EmbeddedAborted(`interrupted with ${results.size} of ${planned} runs done${store ? '; checkpoints kept' : ''}`);
      e.results = [...results.values()].sort((x, y) => x.runIndex - y.runIndex);
      e.clustersPlanned = planned;
      e.adaptive = adaptive;
      throw e;
    }
    if (failures.length > 0) throw new Error(`${failures.length} run(s) failed; first: ${failures[0]}`);
  };

  // batches: one for a fixed count; for a [target], batch after batch until the stopping rule says stop
  opts.signal?.addEventListener('abort', onAbort, { once: true });
  try {
    let from = 0;
    for (let b = 0; ; b++) {
      const batch = planEnsemble(opts.ensembleId, spec, from, planned).jobs.flatMap((j: PlannedJob) => j.runs);
      adaptive?.batches.push({ batch: b, fromRun: from, toRun: planned, firstJob: 0, jobs: 0, judged: null });
      await reuse(batch);
      report();
      await grow(batch);
      if (!adaptive) break;
      const all = [...results.values()].sort((x, y) => x.runIndex - y.runIndex);
      const j = judgeBatch(spec, all);
      const { nextBatch, ...judged } = j;
      adaptive.batches[b].judged = judged;
      opts.onBatch?.(adaptive.batches[b]);
      if (j.action !== 'continue') {
        adaptive.outcome = j.action;
        adaptive.reason = j.reason;
        break;
      }
      from = planned;
      planned += nextBatch;
    }
  } finally {
    opts.signal?.removeEventListener('abort', onAbort);
    await pool.close();
  }
  const all = [...results.values()].sort((a, b) => a.runIndex - b.runIndex);
  const summary = buildSummary(
    { ensembleId: opts.ensembleId, spec, createdAtMs: opts.createdAtMs ?? t0, results: all, clustersPlanned: planned, finished: true, adaptive },
    opts.summary ?? defaultSummaryOptions(),
  );
  return { ensembleId: opts.ensembleId, results: all, summary, reused, wallSeconds: (Date.now() - t0) / 1000, adaptive };
}
