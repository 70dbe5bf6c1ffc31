/**
 * Embedded mode: the same plan, kernel, task runner, run lifecycle and
 * summary as the farm, with an in-process pool of worker threads instead of
 * BullMQ and Redis. Every cluster goes through the farm's runOne
 * (worker/runtime/run-lifecycle.ts) with in-process implementations of its
 * storage interfaces (coordinator/embedded/in-memory-stores.ts: results in
 * memory and, given an artifact store, under the farm's keys; checkpoints in
 * the artifact store or in memory).
 *
 * Batches run through the farm's own loop: launchEnsemble queues the first
 * batch and advanceAdaptive (coordinator/farm/adaptive.ts) judges each
 * complete batch with the stopping rule and queues the next, on in-memory
 * implementations of the farm's store and queue (MemoryBatchStore,
 * MemoryRunQueue; coordinator/farm/batch-contract.ts). This module drains
 * the queue: it reads each job's runs with the workers' reader, grows them
 * on its thread pool (runOne, as a worker does) and probes them. A resumed
 * run replays the same decisions, since they depend only on the stored
 * results.
 *
 * When an artifact store is given, checkpoints and finished results are kept
 * there (keys as in the farm), so an interrupted `tendril run` continues
 * where it stopped when started again with the same spec and output folder.
 *
 * A spec with [probe]: after each batch is grown, every new cluster is
 * probed at each size of probeSizesOf(spec) on a pool of probe threads (the
 * same jobs, seeds and analysis as the farm: coordinator/harmonic/
 * ensemble-probing.ts); the per-cluster records go into the summary. With a
 * store, each cluster's final positions (`run-I.final`), its records
 * (`run-I.harmonic.json`) and its final hit counts (`run-I.hits`, float64)
 * are kept, so an interrupted run probes only what is missing.
 */
import { availableParallelism } from 'node:os';
import { decodeCheckpoint, decodeRunResult, type RunResultData, type RunTaskData } from '../../proto/convert.js';
import { checkpointFileCount } from '../../proto/checkpoint-file.js';
import { axisOf } from '../../worker/core/positions.js';
import { probedPointsOf } from '../../worker/probe/probe-set.js';
import type { DiskSet } from '../../worker/probe/disk-set.js';
import { ProbeThreadPool } from '../../worker/runtime/probe-thread-pool.js';
import type { ProbeResult } from '../../worker/probe/probe-2d.js';
import { analyseProbedCluster, breakdownEtaOf, clusterPrefix, probeTasksOfSet } from '../harmonic/ensemble-probing.js';
import type { ClusterHarmonic } from '../harmonic/cluster-harmonic.js';
import { TaskThreadPool, type ThreadRun } from '../../worker/runtime/task-thread.js';
import { runOne, type CheckpointStore } from '../../worker/runtime/run-lifecycle.js';
import { TaskRejected } from '../../worker/runtime/task-runner.js';
import { EmbeddedRunSink, MemoryBatchStore, MemoryCheckpointStore } from './in-memory-stores.js';
import { MemoryRunQueue } from './in-memory-queue.js';
import { launchEnsemble } from '../farm/launch.js';
import { finalPositionsIn } from '../farm/final-positions.js';
import { advanceAdaptive } from '../farm/adaptive.js';
import type { ArtifactStore } from '../farm/artifacts.js';
import { checkpointKey, finalKey, harmonicKey, hitsKey, resultKey } from '../../worker/runtime/job-contract.js';
import { maxRunsOf, probeSizesOf, type EnsembleSpec } from '../spec/index.js';
import { buildSummary, defaultSummaryOptions, type AdaptiveBatch, type AdaptiveHistory, type SummaryOptions } from '../summary/index.js';
import type { EnsembleSummaryData } from '../../proto/convert.js';
import { messageOf, TendrilError } from '../../proto/errors.js';

export interface EmbeddedProgress {
  /** 'growing' while clusters grow, 'probing' while the probe jobs of a batch run. */
  phase: 'growing' | 'probing';
  runsDone: number;
  runsTotal: number;
  particlesDone: number;
  particlesTotal: number;
  /** Of particlesDone, the particles not grown by this call: results reused from an earlier invocation and the part of resumed runs before their checkpoints. */
  particlesReplayed: number;
  /** Probe jobs finished and planned so far (0 without [probe]). */
  probeJobsDone: number;
  probeJobsTotal: number;
  /** Probe jobs of the current probing pass (the clusters not probed yet): finished and planned. */
  probePassDone: number;
  probePassTotal: number;
}

/** The hit counts of one probed planar cluster at its final size, for the report's picture (the measure picture is planar: none for 3D clusters). */
export interface ProbedPicture {
  runIndex: number;
  size: number;
  x: Float64Array;
  y: Float64Array;
  counts: Float64Array;
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
  /** Harmonic records of the probed clusters (run, then size order); empty without [probe]. */
  harmonic: ClusterHarmonic[];
  /** The lowest-index probed cluster at its final size, when its hits are at hand. */
  picture: ProbedPicture | null;
}

export class EmbeddedAborted extends TendrilError {
  override name = 'EmbeddedAborted';
  readonly kind = 'aborted';
  /** Results finished before the interruption (run-index order) and the clusters planned so far. */
  results: RunResultData[] = [];
  clustersPlanned = 0;
  adaptive: AdaptiveHistory | null = null;
  harmonic: ClusterHarmonic[] = [];
}


export async function runEmbedded(spec: EnsembleSpec, opts: EmbeddedOptions): Promise<EmbeddedOutcome> {
  const t0 = Date.now();
  const maxRuns = maxRunsOf(spec);
  const pool = new TaskThreadPool(Math.max(1, Math.min(opts.threads ?? availableParallelism(), maxRuns)));
  const store = opts.store;
  const probe = spec.probe;
  const probeSizes = probeSizesOf(spec);
  // every requested thread probes, also when there are fewer clusters than threads (one giant
  // cluster's jobs run side by side): the threads share one geometry per set (probe-thread-pool.ts)
  const probePool = probe ? new ProbeThreadPool(Math.max(1, Math.min(opts.threads ?? availableParallelism(), maxRuns * probe.jobs))) : null;
  const sink = new EmbeddedRunSink(opts.ensembleId, store, () => report());
  const checkpoints: CheckpointStore = store ?? new MemoryCheckpointStore();
  const { results, live } = sink;
  /** Clusters not yet probed: their final positions, or null when they wait in the store. */
  const finals = sink.finals;
  const harmonic = new Map<number, ClusterHarmonic[]>();
  let picture: ProbedPicture | null = null;
  let probeJobsDone = 0;
  let planned = spec.clusters;
  let reused = 0;
  let replayed = 0;
  let phase: EmbeddedProgress['phase'] = 'growing';
  let probePassDone = 0, probePassTotal = 0;
  const report = () => {
    let p = 0;
    for (const r of results.values()) p += r.particles;
    for (const c of live.values()) p += c;
    const probeJobsTotal = probe ? planned * probeSizes.length * probe.jobs : 0;
    opts.onProgress?.({
      phase, runsDone: results.size, runsTotal: planned, particlesDone: p, particlesTotal: planned * spec.particles, particlesReplayed: replayed,
      probeJobsDone, probeJobsTotal, probePassDone, probePassTotal,
    });
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
          if (probe) {
            // a probed ensemble reuses a run only with its records, or with its positions to probe again
            const recs = await store.get(harmonicKey(opts.ensembleId, run.runIndex));
            if (recs) harmonic.set(run.runIndex, JSON.parse(Buffer.from(recs).toString('utf8')) as ClusterHarmonic[]);
            else {
              if (!(await store.checkpointFile(finalKey(opts.ensembleId, run.runIndex))).exists) continue; // not read whole just to see it is there
              finals.set(run.runIndex, null);
            }
          }
          results.set(run.runIndex, r);
          reused++;
          replayed += r.particles;
        }
      } catch {
        // an unreadable stored result is grown again
      }
    }
  };

  /** The batch history as the loop last left it (null for a fixed count). */
  let adaptive: AdaptiveHistory | null = null;
  const ledger = new MemoryBatchStore(sink);
  const queue = new MemoryRunQueue();
  const active = new Set<ThreadRun>();
  const onAbort = () => {
    for (const a of active) a.stop();
  };
  const harmonicList = () => [...harmonic.keys()].sort((a, b) => a - b).flatMap((i) => harmonic.get(i)!);
  /** What an interrupted call rejects with: the runs (and probe records) finished so far. */
  const abortedError = (): EmbeddedAborted => {
    const e = new EmbeddedAborted(`interrupted with ${results.size} of ${planned} runs done${store ? '; checkpoints kept' : ''}`);
    e.results = [...results.values()].sort((x, y) => x.runIndex - y.runIndex);
    e.clustersPlanned = planned;
    e.adaptive = adaptive;
    e.harmonic = harmonicList();
    return e;
  };

  /** Grow the runs of a batch that have no result yet, each through the farm's run lifecycle (runOne). */
  const grow = async (runs: RunTaskData[]) => {
    const failures = sink.failures;
    failures.length = 0;
    await Promise.all(
      runs
        .filter((run) => !results.has(run.runIndex))
        .map(async (run) => {
          if (opts.signal?.aborted) return;
          // the particles grown before: a checkpoint file's header alone (never the whole cluster), else the stored bytes
          const key = checkpointKey(opts.ensembleId, run.runIndex);
          const file = checkpoints.checkpointFile ? await checkpoints.checkpointFile(key) : null;
          try {
            if (file) replayed += file.exists ? checkpointFileCount(file.path) : 0;
            else {
              const held = await checkpoints.get(key);
              if (held) replayed += decodeCheckpoint(held).state.count;
            }
          } catch {
            // the thread reports an unreadable checkpoint
          }
          try {
            await runOne(run, {
              pool,
              sink,
              checkpoints,
              workerId: 'embedded',
              progressIntervalMs: 250,
              onStart: (handle) => {
                active.add(handle);
                if (opts.signal?.aborted) handle.stop();
              },
              onEnd: (handle) => active.delete(handle),
            });
          } catch (err) {
            if (!(err instanceof TaskRejected)) failures.push(messageOf(err));
          }
        }),
    );
    if (opts.signal?.aborted) throw abortedError();
    if (failures.length > 0) throw new Error(`${failures.length} run(s) failed; first: ${failures[0]}`);
  };

  /** Probe one cluster at every probe size and keep its records; false when a job failed or the run was aborted. */
  const probeCluster = async (runIndex: number, failures: string[]): Promise<void> => {
    const held = finals.get(runIndex);
    let pos = held ?? null;
    if (!pos && store) pos = await finalPositionsIn(store, opts.ensembleId, runIndex); // read in chunks into one array
    if (!pos) {
      failures.push(`probe of run ${runIndex}: its final positions are missing`);
      return;
    }
    const final = pos;
    const groups = await Promise.all(probeSizes.map(async (size) => {
      const set = clusterPrefix(final, size, spec.model.kind);
      const tasks = probeTasksOfSet(probe!, spec.seed, runIndex, size, set);
      const out = await Promise.all(tasks.map(async (t) => {
        if (opts.signal?.aborted) return null;
        try {
          const r = await probePool!.run(`${opts.ensembleId}:${runIndex}:${size}`, () => set, t);
          probeJobsDone++;
          probePassDone++;
          report();
          return r;
        } catch (err) {
          failures.push(`probe of run ${runIndex} at size ${size}, job ${t.jobIndex}: ${(err as Error).message}`);
          return null;
        }
      }));
      return { size, set, results: out.every((r) => r !== null) ? (out as ProbeResult[]) : null };
    }));
    if (groups.some((g) => g.results === null)) return;
    const recs: ClusterHarmonic[] = [];
    for (const g of groups) {
      const { record, counts } = analyseProbedCluster(g.set, g.results!, probe!, runIndex, g.size, breakdownEtaOf(spec.model));
      recs.push(record);
      if (g.size === spec.particles) {
        if (store) await store.put(hitsKey(opts.ensembleId, runIndex), new Uint8Array(counts.buffer, counts.byteOffset, counts.byteLength));
        if (final.dimension === 2 && (picture === null || runIndex < picture.runIndex)) {
          // the points that carry the measure: the particles, or a lattice cluster's perimeter sites
          const pts = probedPointsOf(g.set as DiskSet);
          picture = { runIndex, size: g.size, x: Float64Array.from(pts.x), y: Float64Array.from(pts.y), counts };
        }
      }
    }
    harmonic.set(runIndex, recs);
    if (store) await store.put(harmonicKey(opts.ensembleId, runIndex), Buffer.from(JSON.stringify(recs)));
    finals.delete(runIndex);
  };

  /**
   * Probe every cluster grown (or reused without records) and not yet
   * probed, at every probe size: as many clusters at once as there are
   * growth threads, so that their jobs keep every thread busy while only a
   * few clusters' positions are in memory (with a store, positions wait
   * there, not in memory).
   */
  const probeAll = async () => {
    if (!probe || !probePool) return;
    const todo = [...finals.keys()].filter((i) => !harmonic.has(i)).sort((a, b) => a - b);
    const failures: string[] = [];
    if (todo.length === 0) return;
    phase = 'probing';
    probePassDone = 0;
    probePassTotal = todo.length * probeSizes.length * probe.jobs;
    report();
    for (let w = 0; w < todo.length && !opts.signal?.aborted; w += pool.size) {
      await Promise.all(todo.slice(w, w + pool.size).map((i) => probeCluster(i, failures)));
    }
    phase = 'growing';
    if (opts.signal?.aborted) throw abortedError();
    if (failures.length > 0) throw new Error(`${failures.length} probe job(s) failed; first: ${failures[0]}`);
  };

  // the farm's batch loop on in-memory stand-ins of its store and queue: launchEnsemble queues the first
  // batch, and after each batch is grown (and probed) advanceAdaptive judges it and queues the next
  opts.signal?.addEventListener('abort', onAbort, { once: true });
  try {
    const id = opts.ensembleId;
    await launchEnsemble(ledger, queue, spec, { ensembleId: id });
    adaptive = ledger.recordOf(id)!.adaptive;
    for (;;) {
      const batch = queue.takeRuns();
      if (batch.length > 0) {
        await reuse(batch);
        report();
        await grow(batch);
        await probeAll();
      }
      const step = await advanceAdaptive(ledger, queue, id);
      const rec = ledger.recordOf(id)!;
      adaptive = rec.adaptive;
      if (step === 'not-adaptive') break;
      const judged = adaptive!.batches.filter((b) => b.judged !== null).at(-1);
      if (step === 'extended' || step === 'finished') opts.onBatch?.(judged!);
      if (step === 'finished') break;
      if (step !== 'extended') throw new Error(`embedded batch loop: unexpected step "${step}" with ${results.size} of ${rec.plannedClusters} runs done`);
      planned = rec.plannedClusters;
    }
  } finally {
    opts.signal?.removeEventListener('abort', onAbort);
    await pool.close();
    await probePool?.close();
  }
  const all = [...results.values()].sort((a, b) => a.runIndex - b.runIndex);
  const summary = buildSummary(
    { ensembleId: opts.ensembleId, spec, createdAtMs: opts.createdAtMs ?? t0, results: all, clustersPlanned: planned, finished: true, adaptive, harmonic: harmonicList() },
    opts.summary ?? defaultSummaryOptions(),
  );
  if (probe && picture === null && store) {
    // the picture's cluster was probed by an earlier invocation: its hits and positions are in the store
    const first = [...harmonic.keys()].sort((a, b) => a - b)[0];
    if (first !== undefined) {
      const [pos, hits] = await Promise.all([finalPositionsIn(store, opts.ensembleId, first), store.get(hitsKey(opts.ensembleId, first))]);
      if (pos && hits) {
        const counts = new Float64Array(Uint8Array.from(hits).buffer);
        const pts = pos.dimension === 2 ? probedPointsOf(clusterPrefix(pos, spec.particles, spec.model.kind) as DiskSet) : null;
        if (pts && counts.length === pts.count) picture = { runIndex: first, size: spec.particles, x: Float64Array.from(pts.x), y: Float64Array.from(pts.y), counts };
      }
    }
  }
  return { ensembleId: opts.ensembleId, results: all, summary, reused, wallSeconds: (Date.now() - t0) / 1000, adaptive, harmonic: harmonicList(), picture };
}
