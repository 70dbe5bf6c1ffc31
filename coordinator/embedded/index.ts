/**
 * Embedded mode: the same plan, kernel, task runner and summary as the farm,
 * with an in-process pool of worker threads instead of BullMQ and Redis.
 *
 * When an artifact store is given, checkpoints and finished results are kept
 * there (keys as in the farm), so an interrupted `tendril run` continues
 * where it stopped when started again with the same spec and output folder.
 */
import { availableParallelism } from 'node:os';
import { decodeRunResult, encodeRunResult, type RunResultData } from '../../proto/convert.js';
import { TaskThreadPool, type ThreadOutcome, type ThreadRun } from '../../worker/task-thread.js';
import { checkpointKey, type ArtifactStore } from '../farm/artifacts.js';
import { planEnsemble, type PlannedJob } from '../plan.js';
import type { EnsembleSpec } from '../spec/index.js';
import { buildSummary, type SummaryOptions } from '../summary/index.js';
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
  summary?: SummaryOptions;
  createdAtMs?: number;
}

export interface EmbeddedOutcome {
  ensembleId: string;
  results: RunResultData[];
  summary: EnsembleSummaryData;
  /** Runs taken from the store instead of being grown again. */
  reused: number;
  wallSeconds: number;
}

export class EmbeddedAborted extends Error {
  override name = 'EmbeddedAborted';
}

const resultKey = (id: string, i: number) => `${id}/run-${i}.result`;

export async function runEmbedded(spec: EnsembleSpec, opts: EmbeddedOptions): Promise<EmbeddedOutcome> {
  const t0 = Date.now();
  const plan = planEnsemble(opts.ensembleId, spec);
  const runs = plan.jobs.flatMap((j: PlannedJob) => j.runs);
  const pool = new TaskThreadPool(Math.max(1, Math.min(opts.threads ?? availableParallelism(), runs.length)));
  const store = opts.store;
  const results = new Map<number, RunResultData>();
  const live = new Map<number, number>();
  let reused = 0;
  const report = () => {
    let p = 0;
    for (const r of results.values()) p += r.particles;
    for (const c of live.values()) p += c;
    opts.onProgress?.({ runsDone: results.size, runsTotal: runs.length, particlesDone: p, particlesTotal: runs.length * spec.particles });
  };

  if (store) {
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
  }
  report();

  const active = new Set<ThreadRun>();
  const onAbort = () => {
    for (const a of active) a.stop();
  };
  opts.signal?.addEventListener('abort', onAbort, { once: true });
  try {
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
    if (opts.signal?.aborted) throw new EmbeddedAborted(`interrupted with ${results.size} of ${runs.length} runs done${store ? '; checkpoints kept' : ''}`);
    if (failures.length > 0) throw new Error(`${failures.length} run(s) failed; first: ${failures[0]}`);
  } finally {
    opts.signal?.removeEventListener('abort', onAbort);
    await pool.close();
  }
  const all = [...results.values()].sort((a, b) => a.runIndex - b.runIndex);
  const summary = buildSummary({ ensembleId: opts.ensembleId, spec, createdAtMs: opts.createdAtMs ?? t0, results: all }, opts.summary);
  return { ensembleId: opts.ensembleId, results: all, summary, reused, wallSeconds: (Date.now() - t0) / 1000 };
}
